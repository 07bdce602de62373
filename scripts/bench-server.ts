// The product under benchmark, in a process of its own: autocannon then measures from the parent
// without sharing this event loop, as a lab's browsers would. Mounts the reference route (one
// primary-key SELECT through the same pool, no session) inside the app ahead of its session, and
// answers the parent's requests for CPU time and for EXPLAIN of the list queries, since only this
// process sees the app's knex events.
import express, { type RequestHandler } from 'express';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { createApp } from '../server/app';
import { createDb, type Db } from '../server/db';
import { createLogger } from '../server/logger';
import { startFakeS3 } from '../server/storage/fake-s3';
import { benchConfig } from './lib/instances';

const ROOT = path.resolve(__dirname, '..');

export interface ExplainRow {
  url: string;
  sql: string;
  scans: string[];
}

export type BenchServerMessage =
  | { type: 'ready'; base: string }
  | { type: 'explains'; explains: ExplainRow[] }
  /** This process's CPU time so far (user + system, microseconds): per-request cost survives a noisy machine. */
  | { type: 'cpu'; micros: number };

async function explainLists(db: Db, base: string, urls: string[], headers: Record<string, string>): Promise<ExplainRow[]> {
  const out: ExplainRow[] = [];
  for (const url of urls) {
    const captured: { sql: string; bindings: unknown[] }[] = [];
    const listener = (q: { sql: string; bindings: unknown[] }) => captured.push(q);
    db.on('query', listener);
    await (await fetch(`${base}${url}`, { headers })).arrayBuffer();
    db.removeListener('query', listener);
    for (const q of captured.filter((c) => /^select/i.test(c.sql) && !/from `?sessions`?/i.test(c.sql))) {
      const [rows] = (await db.raw(`EXPLAIN ${q.sql}`, q.bindings as never)) as [{ table: string; type: string; key: string | null; rows: number }[]];
      out.push({ url, sql: q.sql.slice(0, 160), scans: rows.map((r) => `${r.table}:${r.type}${r.key ? `(${r.key})` : ''}~${r.rows}`) });
    }
  }
  return out;
}

async function main(): Promise<void> {
  const config = benchConfig();
  const db = createDb(config);
  const s3 = await startFakeS3({ directory: path.join(ROOT, '.data', 'bench-s3'), port: 0, bucket: config.s3.bucket });
  const maxId = Number((await db('items').max({ m: 'id' }).first())?.m);
  const reference: RequestHandler = async (_req, res) => {
    res.json(
      await db('items')
        .where({ id: 1 + Math.floor(Math.random() * maxId) })
        .first('id', 'tag', 'name'),
    );
  };
  const app = createApp({
    db,
    config: { ...config, s3: { ...config.s3, endpoint: s3.endpoint } },
    logger: createLogger('silent'),
    // The reference the ratios use: the app's own headers, log and timing, then no session.
    mountBeforeSession: (inner) => inner.get('/api/bench/reference', reference),
  });
  // The same SELECT on a bare Express app, printed too, so the cost of the app's edge is visible.
  const outer = express();
  outer.get('/bench/bare', reference);
  outer.use(app);
  const server = outer.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

  process.on('message', (message: { type: string; urls?: string[]; headers?: Record<string, string> }) => {
    if (message.type === 'explain') {
      explainLists(db, base, message.urls ?? [], message.headers ?? {})
        .then((explains) => process.send?.({ type: 'explains', explains } satisfies BenchServerMessage))
        .catch((error: unknown) => {
          console.error(error);
          process.exit(1);
        });
    } else if (message.type === 'cpu') {
      const { user, system } = process.cpuUsage();
      process.send?.({ type: 'cpu', micros: user + system } satisfies BenchServerMessage);
    } else if (message.type === 'stop') {
      server.close();
      void Promise.all([s3.close(), db.destroy()]).then(() => process.exit(0));
    }
  });
  process.send?.({ type: 'ready', base } satisfies BenchServerMessage);
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
