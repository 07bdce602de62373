import { Router } from 'express';
import { z } from 'zod';
import { calendarFeedScopesSchema } from '../../shared/schemas/calendar-feed';
import type { Config } from '../config';
import type { Db } from '../db';
import { currentUser, requireSignedIn } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { createOrRotateFeed, describeFeed, feedText, revokeFeed } from '../services/calendar-feed';

const none = z.object({}).strict();

/** The account screen's controls: `GET|POST|DELETE /api/calendar-feed`. */
export function calendarFeedRouter(db: Db, config: Config): Router {
  const router = Router();
  router.use(requireSignedIn);
  router.get('/', async (req, res) => {
    validate(none, req.query, 'query');
    res.json(await describeFeed(db, config, currentUser(req)));
  });
  router.post('/', async (req, res) => {
    const scopes = validate(calendarFeedScopesSchema, req.body ?? {}, 'calendar feed');
    res.json(await createOrRotateFeed(db, config, currentUser(req), scopes));
  });
  router.delete('/', async (req, res) => {
    await revokeFeed(db, currentUser(req));
    res.status(204).end();
  });
  return router;
}

/**
 * The feed itself, `GET /cal/:token.ics`, read by calendar applications without a session. Any
 * address that opens no feed answers the same plain 404, so a guess learns nothing.
 */
export function calendarFileRouter(db: Db, config: Config): Router {
  const router = Router();
  router.get('/:file', async (req, res) => {
    const match = /^(.+)\.ics$/.exec(req.params.file);
    const text = match ? await feedText(db, config, match[1]!) : null;
    res.set('Cache-Control', 'private, no-cache');
    if (text === null) {
      res.status(404).type('text/plain').send('No calendar here.');
      return;
    }
    res.type('text/calendar; charset=utf-8').send(text);
  });
  return router;
}
