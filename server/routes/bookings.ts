import { Router, type Request } from 'express';
import { z } from 'zod';
import {
  approvalDecisionSchema,
  assessmentRequestSchema,
  bookingCreateSchema,
  bookingListQuerySchema,
  bookingUpdateSchema,
  checklistSubmitSchema,
  returnSchema,
  scanSchema,
} from '../../shared/schemas/bookings';
import { idParamSchema } from '../../shared/schemas/common';
import type { Config } from '../config';
import type { Db } from '../db';
import { ForbiddenError } from '../errors';
import { receivedFile, uploadReader } from '../middleware/receive-upload';
import { currentUser, requireRole, requireSignedIn } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { decideApproval } from '../services/booking-approvals';
import { assessPlan } from '../services/booking-assessment';
import { recordScan, returnBooking, submitChecklist } from '../services/booking-counter';
import { cancelBooking, createBooking, updateBooking } from '../services/booking-plans';
import { previewRelease, releaseBooking } from '../services/booking-release';
import { getBooking, listBookings } from '../services/booking-view';
import { storeBookingPhoto } from '../services/booking-photos';
import { listChecklistRuns } from '../services/checklist-records';
import type { ObjectStore } from '../storage/object-store';

export function assessmentsRouter(db: Db): Router {
  const router = Router();
  // No side effects: the booking form calls it as the member types.
  router.post('/', requireSignedIn, async (req, res) => {
    const input = validate(assessmentRequestSchema, req.body, 'assessment request');
    const actor = currentUser(req);
    // Officers may assess for someone else (the approval queue); members only for themselves.
    if (input.personId && input.personId !== actor.id && actor.role === 'member') throw new ForbiddenError('Members can only assess their own plans.');
    res.json({ assessment: await assessPlan(db, input.itemIds, input.plan, input.personId ?? actor.id) });
  });
  return router;
}

// A checklist photo comes with no other form field.
const photoFieldsSchema = z.object({}).strict();

export function bookingsRouter(db: Db, config: Config, store: ObjectStore): Router {
  const mail = { publicUrl: config.publicUrl };
  const readUpload = uploadReader(config.uploadMaxBytes);
  const router = Router();
  const id = (req: Request) => validate(idParamSchema, req.params, 'booking id').id;
  router.use(requireSignedIn);

  router.get('/', async (req, res) => {
    res.json(await listBookings(db, currentUser(req), validate(bookingListQuerySchema, req.query, 'booking search')));
  });
  router.post('/', async (req, res) => {
    const booking = await createBooking(db, currentUser(req), validate(bookingCreateSchema, req.body, 'booking'), mail);
    res.status(201).json({ booking });
  });
  router.get('/:id', async (req, res) => {
    res.json({ booking: await getBooking(db, currentUser(req), id(req)) });
  });
  router.patch('/:id', async (req, res) => {
    const bookingId = id(req);
    res.json({ booking: await updateBooking(db, currentUser(req), bookingId, validate(bookingUpdateSchema, req.body, 'booking change'), mail) });
  });
  router.post('/:id/cancel', async (req, res) => {
    res.json({ booking: await cancelBooking(db, currentUser(req), id(req)) });
  });
  router.post('/:id/approval', requireRole('officer'), async (req, res) => {
    const bookingId = id(req);
    res.json({ booking: await decideApproval(db, currentUser(req), bookingId, validate(approvalDecisionSchema, req.body, 'decision'), mail) });
  });
  router.post('/:id/scans', async (req, res) => {
    const bookingId = id(req);
    const { tag } = validate(scanSchema, req.body, 'scan');
    res.json({ booking: await recordScan(db, currentUser(req), bookingId, tag) });
  });
  router.post('/:id/photos', async (req, res) => {
    const bookingId = id(req);
    await readUpload(req);
    validate(photoFieldsSchema, req.body ?? {}, 'upload');
    res.status(201).json({ file: await storeBookingPhoto(db, store, currentUser(req), bookingId, receivedFile(req), config.uploadCaps) });
  });
  router.get('/:id/checklist-runs', async (req, res) => {
    res.json({ runs: await listChecklistRuns(db, currentUser(req), id(req)) });
  });
  router.post('/:id/checklist', async (req, res) => {
    const bookingId = id(req);
    res.json({ booking: await submitChecklist(db, currentUser(req), bookingId, validate(checklistSubmitSchema, req.body, 'checklist')) });
  });
  router.get('/:id/release-check', async (req, res) => {
    res.json(await previewRelease(db, currentUser(req), id(req)));
  });
  router.post('/:id/release', async (req, res) => {
    res.json({ booking: await releaseBooking(db, currentUser(req), id(req)) });
  });
  router.post('/:id/return', async (req, res) => {
    const bookingId = id(req);
    res.json({ booking: await returnBooking(db, currentUser(req), bookingId, validate(returnSchema, req.body ?? {}, 'return'), mail) });
  });
  return router;
}
