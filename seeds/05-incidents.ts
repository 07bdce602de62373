// Demo data only: two incident reports in Kestrel Hall, so the officer's queue, an incident's
// review and Today's corrective-action cards have something to show on a fresh machine. A near
// miss on the teaching bench, reviewed and closed with a cause and two actions (one of them
// already past due), and an arc-over in the corona cage still open for review. Neither takes gear
// out of service, so the demo bookings stay releasable.
import type { Knex } from 'knex';
import type { SessionUser } from '../shared/schemas/session';
import { reportIncident, reviewIncident } from '../server/services/incidents';
import { addDaysIso, todayIso } from '../server/services/dates';

const MAIL = { publicUrl: process.env.PUBLIC_URL ?? 'http://127.0.0.1:8080' };
const HOUR = 3600_000;

const person = (knex: Knex, email: string): Promise<SessionUser> => knex('people').where({ email }).first('id', 'email', 'name', 'role');

export async function seed(knex: Knex): Promise<void> {
  const ansel = await person(knex, 'ansel.oyelaran@voltcrib.example');
  const kofi = await person(knex, 'kofi.brandvold@voltcrib.example');
  const idris = await person(knex, 'officer@voltcrib.example');
  const [stick] = await knex('items').where({ model: 'HI-GS60' }).orderBy('id').limit(1).pluck('id');
  const now = Date.now();

  const nearMiss = await reportIncident(
    knex,
    ansel,
    {
      kind: 'near-miss',
      severity: 'moderate',
      occurredAt: new Date(now - 50 * HOUR).toISOString(),
      location: 'Kestrel Hall, teaching bench 1',
      description:
        'A student reached for the Van de Graaff sphere to move it before the grounding stick had touched it. I stopped them in time; nobody was hurt. The stick was on the far side of the bench.',
      itemIds: stick ? [stick] : [],
      bookingId: null,
      tagOut: false,
    },
    MAIL,
  );
  await reviewIncident(knex, idris, nearMiss.id, {
    status: 'closed',
    cause: 'The grounding stick had no fixed place on the teaching bench, so it was not at hand when the demonstration ended.',
    correctiveActions: [
      { action: 'Fit a wall hook for the grounding stick beside teaching bench 1', ownerId: idris.id, dueOn: addDaysIso(todayIso(), -1) },
      { action: 'Add "stick the sphere before touching it" to the teaching-lab briefing', ownerId: ansel.id, dueOn: addDaysIso(todayIso(), 6) },
    ],
  });

  await reportIncident(
    knex,
    kofi,
    {
      kind: 'arc-over',
      severity: 'low',
      occurredAt: new Date(now - 5 * HOUR).toISOString(),
      location: 'Kestrel Hall, corona cage',
      description:
        'At about 38 kV an arc jumped from the emitter holder to the cage frame; the supply tripped on overcurrent. The holder shows a small burn mark.',
      itemIds: [],
      bookingId: null,
      tagOut: false,
    },
    MAIL,
  );
}
