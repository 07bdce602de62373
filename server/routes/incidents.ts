import { Router, type Request } from 'express';
import { z } from 'zod';
import { idParamSchema } from '../../shared/schemas/common';
import { actionDoneSchema, incidentCreateSchema, incidentListQuerySchema, incidentUpdateSchema } from '../../shared/schemas/incidents';
import type { Config } from '../config';
import type { Db } from '../db';
import { receivedFile, uploadReader } from '../middleware/receive-upload';
import { currentUser, requireRole, requireSignedIn } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { storeIncidentPhoto } from '../services/incident-photos';
import { getIncident, listIncidents, pastDueActions, reportIncident, reviewIncident, setActionDone } from '../services/incidents';
import type { ObjectStore } from '../storage/object-store';

const none = z.object({}).strict();

export function incidentsRouter(db: Db, config: Config, store: ObjectStore): Router {
  const mail = { publicUrl: config.publicUrl };
  const readUpload = uploadReader(config.uploadMaxBytes);
  const router = Router();
  const id = (req: Request) => validate(idParamSchema, req.params, 'incident id').id;
  router.use(requireSignedIn);

  router.post('/', async (req, res) => {
    const input = validate(incidentCreateSchema, req.body, 'incident');
    res.status(201).json({ incident: await reportIncident(db, currentUser(req), input, mail) });
  });
  router.get('/', async (req, res) => {
    res.json({ incidents: await listIncidents(db, currentUser(req), validate(incidentListQuerySchema, req.query, 'filter')) });
  });
  // Before /:id so "actions" is never read as an id.
  router.get('/actions/past-due', async (req, res) => {
    validate(none, req.query, 'query');
    res.json({ actions: await pastDueActions(db, currentUser(req)) });
  });
  router.patch('/actions/:id', async (req, res) => {
    const actionId = validate(idParamSchema, req.params, 'action id').id;
    const { done } = validate(actionDoneSchema, req.body, 'action');
    res.json({ incident: await setActionDone(db, currentUser(req), actionId, done) });
  });
  router.get('/:id', async (req, res) => {
    res.json({ incident: await getIncident(db, currentUser(req), id(req)) });
  });
  router.patch('/:id', requireRole('officer'), async (req, res) => {
    const incidentId = id(req);
    res.json({ incident: await reviewIncident(db, currentUser(req), incidentId, validate(incidentUpdateSchema, req.body, 'review')) });
  });
  router.post('/:id/photos', async (req, res) => {
    const incidentId = id(req);
    await readUpload(req);
    validate(none, req.body ?? {}, 'upload');
    res.status(201).json({ file: await storeIncidentPhoto(db, store, currentUser(req), incidentId, receivedFile(req), config.uploadCaps) });
  });
  return router;
}
