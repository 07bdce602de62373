// `npm run test:cluster`: the suite in tests/cluster against a three-node Galera cluster of its
// own (.data/cluster-test, ports 3445–3448, 4445–4468, apps 8143–8144, proxy 8145). Each file
// starts the app processes and the proxy on a fresh database; this script starts the nodes
// before and stops them after (when it started them). Ends with "N passed, N failed".
import { spawn } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { isRunning } from './lib/mariadb';
import { nodeInstances, startCluster, stopCluster, testCluster } from './lib/galera';

const ROOT = path.resolve(__dirname, '..');

async function main(): Promise<number> {
  const t0 = Date.now();
  const layout = testCluster();
  const wasRunning = nodeInstances(layout).some(isRunning);
  await startCluster(layout);
  const resultsFile = path.join(ROOT, '.data', 'jest-cluster-results.json');
  try {
    const jest = spawn(
      path.join(ROOT, 'node_modules', '.bin', 'jest'),
      ['--selectProjects', 'cluster', '--runInBand', '--json', `--outputFile=${resultsFile}`, ...process.argv.slice(2)],
      {
        cwd: ROOT,
        stdio: 'inherit',
        env: { ...process.env, NODE_ENV: 'test', VOLTCRIB_CLUSTER_TESTS: '1' },
      },
    );
    const status = await new Promise<number | null>((resolve) => jest.once('exit', (code) => resolve(code)));
    let line = '0 passed, 1 failed';
    if (existsSync(resultsFile)) {
      const s = JSON.parse(readFileSync(resultsFile, 'utf8')) as { numPassedTests: number; numFailedTests: number; numRuntimeErrorTestSuites: number };
      line = `${s.numPassedTests} passed, ${s.numFailedTests + s.numRuntimeErrorTestSuites} failed`;
    }
    writeFileSync(path.join(ROOT, '.data', 'test-cluster-summary.txt'), line + '\n');
    console.log(`\n[test:cluster] finished in ${((Date.now() - t0) / 1000).toFixed(0)} s`);
    console.log(line);
    return status ?? 1;
  } finally {
    // CLUSTER_KEEP=1 leaves the nodes up for the next run (`npm run cluster:stop -- --test` stops them).
    if (!wasRunning && process.env.CLUSTER_KEEP !== '1') await stopCluster(layout);
  }
}

main()
  .then((code) => process.exit(code))
  .catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    console.log('0 passed, 1 failed');
    process.exit(1);
  });
