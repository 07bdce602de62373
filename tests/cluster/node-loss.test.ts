// kill -9 of one database node during counter traffic (book, scan, checklist, release, return)
// through both app processes: the proxy cuts the dead node's connections, the app runs the
// interrupted transactions again on the other nodes, nothing acknowledged is lost, nothing is
// half-written, and the node, started again, catches up by incremental state transfer (IST).
import { existsSync, readFileSync } from 'node:fs';
import { killNode, nodeInstances, restartNode } from '../../scripts/lib/galera';
import { nodeDb } from '../../scripts/lib/cluster-run';
import {
  counterLoad,
  lastFailure,
  expectAcknowledgedWrites,
  expectConsistent,
  kitIds,
  qualifiedMember,
  sleep,
  startTestCluster,
  type ClusterContext,
} from './cluster-helpers';

let ctx: ClusterContext;
beforeAll(async () => {
  ctx = await startTestCluster('voltcrib_cluster_node_loss');
}, 600_000);
afterAll(() => ctx.close());

it('a node killed mid-load: answers go on, acknowledged writes stay, the node rejoins by IST, the chain verifies', async () => {
  const workers = [];
  for (let i = 0; i < 6; i += 1) workers.push({ who: await qualifiedMember(ctx), kits: [await kitIds(ctx), await kitIds(ctx), await kitIds(ctx)] });
  const load = counterLoad(workers);
  await sleep(4000);
  const killedAt = Date.now();
  const victim = nodeInstances(ctx.layout)[1]!;
  const logBefore = existsSync(victim.errorLog) ? readFileSync(victim.errorLog).length : 0;
  killNode(ctx.layout, 1);
  await sleep(12_000);
  await load.stop();
  const records = load.records;
  const failures = records.flatMap((r) => r.statuses).filter((s) => s >= 500 || s === 0);
  console.log(
    `node loss: ${records.length} loops, ${records.filter((r) => r.returned).length} complete, ${failures.length} failed requests (${JSON.stringify(failures)}); last: ${lastFailure}`,
  );
  // Loops that began two seconds after the kill all went through.
  const late = records.filter((r) => r.startedAt > killedAt + 2000);
  expect(late.length).toBeGreaterThan(0);
  expect(late.filter((r) => !r.returned)).toEqual([]);
  // At most the requests in flight on the dead node's connections at the moment of the kill.
  expect(failures.length).toBeLessThanOrEqual(workers.length);

  // The node comes back and catches up from the others' write-set cache.
  await restartNode(ctx.layout, 1);
  const log = readFileSync(victim.errorLog, 'utf8').slice(logBefore);
  expect(log).toMatch(/IST received|Receiving IST/);
  const rejoined = nodeDb(ctx.layout, 1);
  try {
    await expectAcknowledgedWrites(ctx.db, records);
    await expectAcknowledgedWrites(rejoined, records);
    await expectConsistent(rejoined);
    await expectConsistent(ctx.db);
  } finally {
    await rejoined.destroy();
  }
}, 600_000);
