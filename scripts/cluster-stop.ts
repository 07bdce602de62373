// `npm run cluster:stop`: stops the cluster's database nodes one after another (the last one
// stopped is the one Galera marks safe to start the cluster again from).
import { devCluster, testCluster, stopCluster } from './lib/galera';

async function main(): Promise<void> {
  const layout = process.argv.includes('--test') ? testCluster() : devCluster();
  const stopped = await stopCluster(layout);
  console.log(stopped > 0 ? `[cluster] stopped ${stopped} database node(s) (.data/${layout.name})` : '[cluster] no database node was running');
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
