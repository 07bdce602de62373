// kill -9 of one app process during counter traffic through the proxy: the proxy stops sending
// it requests, the other process carries the load, and the killed one, started again, is given
// requests once its health check passes. Only requests in flight in the killed process fail.
import { readFileSync } from 'node:fs';
import {
  counterLoad,
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
  ctx = await startTestCluster('voltcrib_cluster_app_loss', { LOG_LEVEL: 'info' });
}, 600_000);
afterAll(() => ctx.close());

it('an app process killed mid-load: the proxy routes around it and takes it back when restarted', async () => {
  const workers = [];
  for (let i = 0; i < 6; i += 1) workers.push({ who: await qualifiedMember(ctx), kits: [await kitIds(ctx), await kitIds(ctx), await kitIds(ctx)] });
  const load = counterLoad(workers);
  await sleep(4000);
  const killedAt = Date.now();
  const app1 = ctx.cluster.apps[0]!;
  app1.kill();
  await sleep(8000);
  const restartedAt = Date.now();
  const logBefore = readFileSync(app1.logFile).length;
  await app1.start();
  await sleep(6000);
  await load.stop();
  const records = load.records;
  const failures = records.flatMap((r) => r.statuses).filter((s) => s >= 500 || s === 0);
  console.log(
    `app loss: ${records.length} loops, ${records.filter((r) => r.returned).length} complete, ${failures.length} failed requests (${JSON.stringify(failures)})`,
  );
  const late = records.filter((r) => r.startedAt > killedAt + 2000);
  expect(late.length).toBeGreaterThan(0);
  expect(late.filter((r) => !r.returned)).toEqual([]);
  expect(failures.length).toBeLessThanOrEqual(workers.length);
  // The restarted process answered traffic from the proxy (its request log grew with API calls).
  const served = readFileSync(app1.logFile, 'utf8')
    .slice(logBefore)
    .split('\n')
    .filter((l) => l.includes('"url":"/api/bookings'));
  expect(served.length).toBeGreaterThan(0);
  expect(records.some((r) => r.startedAt > restartedAt && r.returned)).toBe(true);
  await expectAcknowledgedWrites(ctx.db, records);
  await expectConsistent(ctx.db);
}, 600_000);
