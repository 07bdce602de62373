// Adds `Server-Timing: app;dur=<ms>` to API answers, so the time spent inside the server can be
// read apart from the network (the bench and the notes report it).
import type { RequestHandler } from 'express';
import onHeaders from 'on-headers';

export const serverTiming: RequestHandler = (_req, res, next) => {
  const started = process.hrtime.bigint();
  onHeaders(res, () => {
    const ms = Number(process.hrtime.bigint() - started) / 1e6;
    res.setHeader('Server-Timing', `app;dur=${ms.toFixed(2)}`);
  });
  next();
};
