import { Router, type Request } from 'express';
import { z } from 'zod';
import { idParamSchema } from '../../shared/schemas/common';
import { itemCreateSchema, itemListQuerySchema, itemUpdateSchema, tagSchema } from '../../shared/schemas/items';
import type { Config } from '../config';
import type { Db } from '../db';
import { receivedFile, uploadReader } from '../middleware/receive-upload';
import { currentUser, requireRole, requireSignedIn } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { listAudit } from '../services/audit-trail';
import { itemAvailability, itemBookingHistory } from '../services/booking-availability';
import { listItemFiles, storeItemFile } from '../services/files';
import { itemClearance } from '../services/item-clearance';
import { listInspections, recordInspection } from '../services/inspections';
import { listItems } from '../services/item-search';
import { createItem, getItem, getItemByTag, toItem, updateItem } from '../services/items';
import { labelSvg, singleLabelPdf } from '../services/labels';
import type { ObjectStore } from '../storage/object-store';

const windowSchema = z
  .object({ from: z.iso.datetime({ offset: true }), to: z.iso.datetime({ offset: true }) })
  .strict()
  .refine((v) => new Date(v.to) > new Date(v.from), { message: 'to must be after from', path: ['to'] })
  .refine((v) => new Date(v.to).getTime() - new Date(v.from).getTime() <= 92 * 24 * 3600_000, { message: 'At most 92 days at a time', path: ['to'] });

const uploadKindSchema = z.object({ kind: z.enum(['photo', 'document']).optional() }).strict();

export function itemsRouter(db: Db, config: Config, store: ObjectStore): Router {
  const router = Router();
  const readUpload = uploadReader(config.uploadMaxBytes);
  const id = (req: Request) => validate(idParamSchema, req.params, 'item id').id;

  router.get('/', requireSignedIn, async (req, res) => {
    const query = validate(itemListQuerySchema, req.query, 'search');
    res.json(await listItems(db, query));
  });

  router.post('/', requireRole('manager'), async (req, res) => {
    const input = validate(itemCreateSchema, req.body, 'item');
    const row = await createItem(db, currentUser(req), input);
    res.status(201).json({ item: toItem(row, config.publicUrl) });
  });

  router.get('/by-tag/:tag', requireSignedIn, async (req, res) => {
    const tag = validate(tagSchema, req.params.tag, 'tag');
    res.json({ item: toItem(await getItemByTag(db, tag), config.publicUrl) });
  });

  router.get('/:id', requireSignedIn, async (req, res) => {
    res.json({ item: toItem(await getItem(db, id(req)), config.publicUrl) });
  });

  router.patch('/:id', requireRole('manager'), async (req, res) => {
    const itemId = id(req);
    const input = validate(itemUpdateSchema, req.body, 'item change');
    res.json({ item: toItem(await updateItem(db, currentUser(req), itemId, input, { publicUrl: config.publicUrl }), config.publicUrl) });
  });

  router.get('/:id/clearance', requireSignedIn, async (req, res) => {
    res.json(await itemClearance(db, await getItem(db, id(req))));
  });

  router.get('/:id/history', requireSignedIn, async (req, res) => {
    const itemId = id(req);
    await getItem(db, itemId);
    res.json(await listAudit(db, { entity: 'item', entityId: String(itemId), limit: 100 }));
  });

  router.get('/:id/availability', requireSignedIn, async (req, res) => {
    const itemId = id(req);
    const window = validate(windowSchema, req.query, 'window');
    await getItem(db, itemId);
    res.json({ busy: await itemAvailability(db, itemId, new Date(window.from), new Date(window.to)) });
  });

  router.get('/:id/bookings', requireSignedIn, async (req, res) => {
    const itemId = id(req);
    await getItem(db, itemId);
    res.json({ bookings: await itemBookingHistory(db, itemId) });
  });

  router.get('/:id/inspections', requireSignedIn, async (req, res) => {
    const itemId = id(req);
    await getItem(db, itemId);
    res.json({ inspections: await listInspections(db, itemId) });
  });

  router.post('/:id/inspections', requireRole('manager', 'officer'), async (req, res) => {
    const itemId = id(req);
    const inspection = await recordInspection(db, currentUser(req), itemId, req.body);
    res.status(201).json({ inspection, item: toItem(await getItem(db, itemId), config.publicUrl) });
  });

  router.get('/:id/files', requireSignedIn, async (req, res) => {
    const itemId = id(req);
    await getItem(db, itemId);
    res.json({ files: await listItemFiles(db, itemId) });
  });

  router.post('/:id/files', requireRole('manager', 'officer'), async (req, res) => {
    const itemId = id(req);
    await readUpload(req);
    const { kind } = validate(uploadKindSchema, req.body ?? {}, 'upload');
    const file = await storeItemFile(db, store, currentUser(req), itemId, receivedFile(req), kind);
    res.status(201).json({ file });
  });

  router.get('/:id/label.svg', requireSignedIn, async (req, res) => {
    const item = await getItem(db, id(req));
    res
      .type('image/svg+xml')
      .set('Cache-Control', 'private, max-age=3600')
      .send(await labelSvg(item.tag, config.publicUrl));
  });

  router.get('/:id/label.pdf', requireRole('manager', 'officer'), async (req, res) => {
    const item = toItem(await getItem(db, id(req)), config.publicUrl);
    const pdf = await singleLabelPdf(item, config.publicUrl);
    res.type('application/pdf').set('Content-Disposition', `inline; filename="label-${item.tag}.pdf"`).send(pdf);
  });

  return router;
}
