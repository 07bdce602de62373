// API answers carry people's names, bookings and the audit trail, and are out of date as soon as
// somebody else acts: no browser or proxy keeps a copy. A route whose answer never changes under
// its address (a stored file, a QR label) sets its own Cache-Control after this.
import type { RequestHandler } from 'express';

export const noStore: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'no-store');
  next();
};
