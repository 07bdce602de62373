// Demo data only: an invented lab ("Kestrel Hall HV Laboratory" at the invented Orrin
// Polytechnic). Loaded by `npm start` into an EMPTY development database, never in production.
import bcrypt from 'bcrypt';
import type { Knex } from 'knex';

export const DEMO_PASSWORD = 'voltcrib-demo';

export const DEMO_GROUPS = ['Ion Wind Group', 'Corona & Plasma Group', 'Electrospinning Group', 'Teaching Lab'];

export const DEMO_PEOPLE = [
  { email: 'manager@voltcrib.example', name: 'Maren Tollefsen', role: 'manager', group: null },
  { email: 'officer@voltcrib.example', name: 'Idris Achterberg', role: 'officer', group: null },
  { email: 'member@voltcrib.example', name: 'Noor Vasquez-Lind', role: 'member', group: 'Ion Wind Group' },
  { email: 'kofi.brandvold@voltcrib.example', name: 'Kofi Brandvold', role: 'member', group: 'Corona & Plasma Group' },
  { email: 'yuki.marchetti@voltcrib.example', name: 'Yuki Marchetti', role: 'member', group: 'Electrospinning Group' },
  { email: 'ansel.oyelaran@voltcrib.example', name: 'Ansel Oyelaran', role: 'member', group: 'Teaching Lab' },
  { email: 'petra.quenneville@voltcrib.example', name: 'Petra Quenneville', role: 'officer', group: 'Corona & Plasma Group' },
] as const;

export async function seed(knex: Knex): Promise<void> {
  const hash = await bcrypt.hash(DEMO_PASSWORD, 11);
  await knex('groups').insert(DEMO_GROUPS.map((name) => ({ name })));
  const groups = await knex('groups').select('id', 'name');
  const groupId = (name: string | null) => groups.find((g) => g.name === name)?.id ?? null;
  await knex('people').insert(DEMO_PEOPLE.map((p) => ({ email: p.email, name: p.name, role: p.role, group_id: groupId(p.group), password_hash: hash })));
}
