// `npm run cluster`: three Galera nodes, two app processes and HAProxy on PORT (default 8090),
// all on loopback with project-local data (.data/cluster). Ctrl-C stops the app processes and
// the proxy; the nodes keep running until `npm run cluster:stop`.
import { buildWebIfStale } from './build-web';
import { devCluster } from './lib/galera';
import { runCluster } from './lib/cluster-run';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../seeds/01-people';

async function main(): Promise<void> {
  const t0 = Date.now();
  const layout = devCluster();
  await buildWebIfStale();
  const cluster = await runCluster(layout, { seed: true });
  console.log(`\nVoltcrib (cluster) is running: ${cluster.url}   (ready in ${((Date.now() - t0) / 1000).toFixed(1)} s)`);
  console.log(`  database nodes: ${layout.nodes.map((n, i) => `node${i + 1} 127.0.0.1:${n.sql}`).join(', ')} (data in .data/${layout.name}/node1…3)`);
  console.log(`  app processes: ${cluster.apps.map((a) => `127.0.0.1:${a.port} (pid ${a.pid})`).join(', ')}; logs in .data/${layout.name}/app*.log`);
  console.log(`Demo sign-ins (password "${DEMO_PASSWORD}"):`);
  for (const p of DEMO_PEOPLE.slice(0, 3)) console.log(`  ${p.role.padEnd(8)} ${p.email}`);
  console.log('Ctrl-C stops the app processes and the proxy; `npm run cluster:stop` stops the database nodes.\n');

  let stopping = false;
  const stop = () => {
    if (stopping) return;
    stopping = true;
    console.log('\nStopping the app processes and the proxy (the database nodes keep running; `npm run cluster:stop` stops them).');
    cluster.stop().finally(() => process.exit(0));
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
