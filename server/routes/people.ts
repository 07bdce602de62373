import { Router } from 'express';
import { personUpdateSchema } from '../../shared/schemas/accounts';
import { qualificationSchema } from '../../shared/schemas/bookings';
import { idParamSchema } from '../../shared/schemas/common';
import type { Config } from '../config';
import type { Db } from '../db';
import { ForbiddenError, NotFoundError } from '../errors';
import { currentUser, requireRole, requireSignedIn } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { updatePerson } from '../services/accounts';
import { listPeople } from '../services/people';
import { getQualification, setQualification } from '../services/qualifications';

export function peopleRouter(db: Db, config: Config): Router {
  const router = Router();
  router.get('/', requireRole('manager'), async (_req, res) => {
    res.json({ people: await listPeople(db) });
  });

  router.patch('/:id', requireRole('manager'), async (req, res) => {
    const { id } = validate(idParamSchema, req.params, 'person id');
    res.json({ person: await updatePerson(db, currentUser(req), id, validate(personUpdateSchema, req.body, 'change'), { publicUrl: config.publicUrl }) });
  });

  router.get('/:id/qualification', requireSignedIn, async (req, res) => {
    const { id } = validate(idParamSchema, req.params, 'person id');
    const actor = currentUser(req);
    if (actor.role === 'member' && actor.id !== id) throw new ForbiddenError('Members can only read their own qualification.');
    const person = await db('people').where({ id }).first('id');
    if (!person) throw new NotFoundError(`No person with id ${id}.`);
    res.json({ qualification: await getQualification(db, id) });
  });

  router.put('/:id/qualification', requireRole('officer'), async (req, res) => {
    const { id } = validate(idParamSchema, req.params, 'person id');
    const input = validate(qualificationSchema, req.body, 'qualification');
    res.json({ qualification: await setQualification(db, currentUser(req), id, input) });
  });
  return router;
}

export function groupsRouter(db: Db): Router {
  const router = Router();
  router.get('/', requireSignedIn, async (_req, res) => {
    res.json({ groups: await db('groups').orderBy('name').select('id', 'name') });
  });
  return router;
}

/** Everyone's HV qualification, for the safety officer who records them (and the lab manager). */
export function qualificationsRouter(db: Db): Router {
  const router = Router();
  router.get('/', requireRole('officer', 'manager'), async (_req, res) => {
    const people = await listPeople(db);
    res.json({
      people: people
        .filter((p) => p.active)
        .map(({ id, name, email, role, groupName, qualification }) => ({ id, name, email, role, groupName, qualification })),
    });
  });
  return router;
}
