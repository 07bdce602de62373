import { Router } from 'express';
import { idParamSchema } from '../../shared/schemas/common';
import type { Db } from '../db';
import { currentUser, requireSignedIn } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { readFile } from '../services/files';
import type { ObjectStore } from '../storage/object-store';

export function filesRouter(db: Db, store: ObjectStore): Router {
  const router = Router();
  router.get('/:id', requireSignedIn, async (req, res) => {
    const { id } = validate(idParamSchema, req.params, 'file id');
    const { file, body } = await readFile(db, store, currentUser(req), id);
    // Served as data, never as a page: no sniffing, sandboxed, and with the stored name quoted.
    const asciiName = file.fileName.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
    res
      .type(file.contentType)
      .set({
        'Content-Disposition': `inline; filename="${asciiName}"; filename*=UTF-8''${encodeURIComponent(file.fileName)}`,
        'X-Content-Type-Options': 'nosniff',
        'Content-Security-Policy': "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'; sandbox",
        'Cache-Control': 'private, max-age=3600',
      })
      .send(body);
  });
  return router;
}
