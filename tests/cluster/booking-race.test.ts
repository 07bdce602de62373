// The 200-way race on a three-node Galera cluster: requests alternate between the two app
// processes, whose database connections spread over all three nodes. Row locks are local to a
// node, so only certification (every locking transaction writes the rows it locked) and the
// retry on 1213 keep the item single: exactly one booking wins, the other 199 are told it is taken.
import { plan, windowFromNow } from '../helpers/gear';
import { post } from '../helpers/booking-flow';
import { nodeDb } from '../../scripts/lib/cluster-run';
import { appUrl, expectConsistent, kitIds, personSignedIn, startTestCluster, statusOf, type ClusterContext } from './cluster-helpers';
import type { Db } from '../../server/db';

let ctx: ClusterContext;
let nodes: Db[];
beforeAll(async () => {
  ctx = await startTestCluster('voltcrib_cluster_race');
  nodes = [0, 1, 2].map((i) => nodeDb(ctx.layout, i));
}, 600_000);
afterAll(async () => {
  await Promise.all(nodes.map((n) => n.destroy()));
  await ctx.close();
});

it('200 concurrent bookings of one item over both processes and all three nodes: exactly one winner, 199 × 409, no 5xx', async () => {
  // Four members signed in on each process.
  const members = await Promise.all(Array.from({ length: 8 }, (_, i) => personSignedIn(ctx, 'member', appUrl(ctx, i % 2))));
  const kit = await kitIds(ctx);
  const stick = kit.ids[1]!;
  const before = await Promise.all(nodes.map((n) => statusOf(n, 'Com_update')));
  const base = windowFromNow(30, 2);
  const responses = await Promise.all(
    Array.from({ length: 200 }, (_, i) => {
      const start = new Date(new Date(base.startsAt).getTime() + (i % 50) * 60_000);
      return post(members[i % members.length]! as never, '/api/bookings', {
        itemIds: [...new Set([stick, kit.ids[(i % 4) + 1]!])],
        startsAt: start.toISOString(),
        endsAt: new Date(start.getTime() + 3600_000).toISOString(),
        location: 'Bay 2',
        purpose: `Cluster contention ${i}`,
        plan: plan(5),
      });
    }),
  );
  const statuses = responses.map((r) => r.status);
  expect(statuses.filter((s) => s >= 500)).toEqual([]);
  expect(statuses.filter((s) => s === 201)).toHaveLength(1);
  expect(statuses.filter((s) => s === 409)).toHaveLength(199);
  for (const r of responses.filter((x) => x.status === 409)) expect(r.body.error.code).toBe('ITEM_TAKEN');

  // Every node took part: each ran some of the attempts' item writes.
  const after = await Promise.all(nodes.map((n) => statusOf(n, 'Com_update')));
  after.forEach((value, i) => expect({ node: i + 1, ranUpdates: value - before[i]! > 0 }).toEqual({ node: i + 1, ranUpdates: true }));
  // The same answer on every node.
  for (const n of nodes) expect(await n('booking_items').where({ item_id: stick, live: true })).toHaveLength(1);
  await expectConsistent(ctx.db);
}, 300_000);
