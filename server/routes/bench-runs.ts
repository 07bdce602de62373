// The bench log of a booking: /api/bookings/:id/runs…
import { Router, type Request } from 'express';
import { benchRunDeleteSchema, benchRunEditSchema, benchRunImportSchema, benchRunInputSchema, runParamsSchema } from '../../shared/schemas/bench-runs';
import { idParamSchema } from '../../shared/schemas/common';
import type { Config } from '../config';
import type { Db } from '../db';
import { currentUser, requireRole, requireSignedIn } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { deleteBenchRun, editBenchRun, importBenchRuns, recordBenchRun } from '../services/bench-runs';
import { benchRunsCsv, listBenchRuns, listRunRevisions } from '../services/bench-runs-read';

export function benchRunsRouter(db: Db, config: Config): Router {
  const mail = { publicUrl: config.publicUrl };
  const router = Router();
  const id = (req: Request) => validate(idParamSchema, req.params, 'booking id').id;
  const ids = (req: Request) => validate(runParamsSchema, req.params, 'run id');
  router.use(requireSignedIn);

  router.get('/:id/runs', async (req, res) => {
    res.json(await listBenchRuns(db, currentUser(req), id(req)));
  });
  router.get('/:id/runs.csv', async (req, res) => {
    const bookingId = id(req);
    const csv = await benchRunsCsv(db, currentUser(req), bookingId);
    res.type('text/csv; charset=utf-8').attachment(`booking-${bookingId}-runs.csv`).send(`\uFEFF${csv}\r\n`);
  });
  router.post('/:id/runs', async (req, res) => {
    const bookingId = id(req);
    res.status(201).json({ run: await recordBenchRun(db, currentUser(req), bookingId, validate(benchRunInputSchema, req.body, 'run'), mail) });
  });
  router.post('/:id/runs/import', async (req, res) => {
    const bookingId = id(req);
    const runs = await importBenchRuns(db, currentUser(req), bookingId, validate(benchRunImportSchema, req.body, 'import'), mail);
    res.status(201).json({ runs, imported: runs.length });
  });
  router.put('/:id/runs/:runId', async (req, res) => {
    const p = ids(req);
    res.json({ run: await editBenchRun(db, currentUser(req), p.id, p.runId, validate(benchRunEditSchema, req.body, 'run correction'), mail) });
  });
  router.get('/:id/runs/:runId/revisions', async (req, res) => {
    const p = ids(req);
    res.json({ revisions: await listRunRevisions(db, currentUser(req), p.id, p.runId) });
  });
  router.delete('/:id/runs/:runId', requireRole('officer', 'manager'), async (req, res) => {
    const p = ids(req);
    await deleteBenchRun(db, currentUser(req), p.id, p.runId, validate(benchRunDeleteSchema, req.body ?? {}, 'removal').reason);
    res.status(204).end();
  });
  return router;
}
