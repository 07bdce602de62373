// Overdue reminders with both app processes running their schedulers every second against the
// same cluster: each reminder is queued once (its dedupe key is unique cluster-wide) and sent
// once (the outbox lease is a write, so two nodes claiming one row conflict and one backs off).
import { counterLoop, kitIds, personSignedIn, qualifiedMember, startTestCluster, type ClusterContext } from './cluster-helpers';

let ctx: ClusterContext;
beforeAll(async () => {
  ctx = await startTestCluster('voltcrib_cluster_mail', { MAIL_CRON: '* * * * * *', MAIL_POLL_MS: '200', SCHEDULER: 'true' });
}, 600_000);
afterAll(() => ctx.close());

it('overdue bookings: each reminder reaches each recipient exactly once with two schedulers running', async () => {
  const officers = await Promise.all([personSignedIn(ctx, 'officer'), personSignedIn(ctx, 'officer')]);
  const members = await Promise.all([qualifiedMember(ctx), qualifiedMember(ctx), qualifiedMember(ctx)]);
  const bookingIds: number[] = [];
  for (const member of members) {
    const loop = await counterLoop(member, await kitIds(ctx), { returnIt: false });
    expect(loop.released).toBe(true);
    bookingIds.push(loop.bookingId!);
  }
  // Out past the end and the officers' grace (the lab's default is 30 minutes).
  await ctx
    .db('bookings')
    .whereIn('id', bookingIds)
    .update({ ends_at: new Date(Date.now() - 3 * 3600_000) });
  const expected = new Map<string, number>();
  for (const m of members) expected.set(m.person.email, 1);
  for (const o of officers) expected.set(o.person.email, bookingIds.length);
  const deadline = Date.now() + 60_000;
  const received = () => ctx.cluster.mail!.list().filter((m) => /overdue/i.test(m.subject) || m.to.some((t) => expected.has(t)));
  while (Date.now() < deadline && received().length < members.length + officers.length * bookingIds.length) await new Promise((r) => setTimeout(r, 500));
  // Both schedulers ran several more times after the last send.
  await new Promise((r) => setTimeout(r, 5000));
  const counts = new Map<string, number>();
  for (const m of received()) for (const to of m.to) if (expected.has(to)) counts.set(to, (counts.get(to) ?? 0) + 1);
  expect(Object.fromEntries(counts)).toEqual(Object.fromEntries(expected));
  const ids = received().map((m) => m.messageId);
  expect(new Set(ids).size).toBe(ids.length);
  const rows = await ctx.db('outbox').where('dedupe_key', 'like', 'overdue-%').select('state');
  expect(rows).toHaveLength(members.length + officers.length * bookingIds.length);
  expect(rows.every((r) => r.state === 'sent')).toBe(true);
}, 180_000);
