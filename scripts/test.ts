// `npm test`: every suite against a real MariaDB (its own instance, separate from dev) and a real
// browser. Extra arguments go to jest (e.g. `npm test -- tests/unit`).
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { buildWebIfStale } from './build-web';
import { CHROMIUM, ensureDebianPackages, MARIADB, POPPLER } from './lib/debian-packages';
import { testInstance } from './lib/instances';
import { startFakeS3 } from '../server/storage/fake-s3';
import { startInstance, stopInstance } from './lib/mariadb';
import { recreateDatabase, recreateMailDatabase, recreateModelDatabase } from './lib/test-database';

const ROOT = path.resolve(__dirname, '..');

interface JestSummary {
  numPassedTests: number;
  numFailedTests: number;
  numPendingTests: number;
  numTotalTests: number;
  numRuntimeErrorTestSuites: number;
}

async function main(): Promise<number> {
  const t0 = Date.now();
  ensureDebianPackages([MARIADB, CHROMIUM, POPPLER]);
  const options = testInstance();
  const { started } = await startInstance(options);
  const s3 = await startFakeS3({ directory: path.join(ROOT, '.data', 'test-s3'), port: 0, bucket: 'voltcrib-test' });
  try {
    await recreateDatabase(options);
    await recreateMailDatabase(options);
    await recreateModelDatabase(options);
    await buildWebIfStale();
    mkdirSync(path.join(ROOT, '.data'), { recursive: true });
    const resultsFile = path.join(ROOT, '.data', 'jest-results.json');
    // Asynchronous on purpose: the S3 fake lives in this process and must keep answering.
    const jest = spawn(path.join(ROOT, 'node_modules', '.bin', 'jest'), ['--json', `--outputFile=${resultsFile}`, ...process.argv.slice(2)], {
      cwd: ROOT,
      stdio: 'inherit',
      env: { ...process.env, NODE_ENV: 'test', VOLTCRIB_TEST_DB_PORT: String(options.port), VOLTCRIB_TEST_S3_ENDPOINT: s3.endpoint },
    });
    const status = await new Promise<number | null>((resolve) => jest.once('exit', (code) => resolve(code)));
    let line = `0 passed, 1 failed`;
    if (existsSync(resultsFile)) {
      const summary = JSON.parse(readFileSync(resultsFile, 'utf8')) as JestSummary;
      // A suite that failed to load counts as a failure even though it ran no test.
      const failed = summary.numFailedTests + summary.numRuntimeErrorTestSuites;
      line = `${summary.numPassedTests} passed, ${failed} failed` + (summary.numPendingTests ? `, ${summary.numPendingTests} skipped` : '');
    }
    writeFileSync(path.join(ROOT, '.data', 'test-summary.txt'), line + '\n');
    console.log(`\n[test] finished in ${((Date.now() - t0) / 1000).toFixed(0)} s`);
    console.log(line);
    return status ?? 1;
  } finally {
    await s3.close();
    if (started) await stopInstance(options);
  }
}

main()
  .then((code) => process.exit(code))
  .catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    console.log('0 passed, 1 failed');
    process.exit(1);
  });
