// `npm run bench:compression`: what the `compression` middleware costs the server per API answer.
// It compresses real answers of the sizes the app asks for (built here from the bench's item and
// booking shapes) with the middleware's own defaults (gzip level 6, brotli quality 4) and reports
// CPU microseconds per answer and the bytes saved, to set beside the server CPU a signed-in list
// request costs in `npm run bench` (620-710 µs, README; autocannon sends no Accept-Encoding, so
// that bench never compresses). Results: stdout + bench/results/compression-<time>.json.
import { mkdirSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';

const ROOT = path.resolve(__dirname, '..');

// Varied words, so the answers compress like real ones and not like one row repeated.
const WORDS = [
  'corona',
  'ion',
  'wind',
  'sweep',
  'divider',
  'bleeder',
  'stack',
  'flyback',
  'grounding',
  'stand',
  'probe',
  'enclosure',
  'teaching',
  'bench',
  'precipitator',
  'spinneret',
  'needle',
  'plate',
  'guard',
  'ring',
];
const word = (i: number, k: number) => WORDS[(i * 7 + k * 13 + ((i * k) % 5)) % WORDS.length]!;

function itemRow(i: number) {
  return {
    id: 10_000 + i,
    tag: `KH-${String(i).padStart(5, '0')}`,
    kind: ['probe', 'hv-supply', 'grounding-stick', 'isolation-stand', 'interlock', 'multiplier'][i % 6],
    name: `${word(i, 1)} ${word(i, 2)} ${word(i, 3)} ${1000 + ((i * 7919) % 9000)}`,
    notes: `${word(i, 4)} ${word(i, 5)} checked ${((i * 37) % 28) + 1} Nov, ${word(i, 6)} ${word(i, 7)}`,
    status: 'available',
    location: 'Bay 2, cabinet B',
    ratedKv: 40 + (i % 5) * 10,
    nextInspectionDue: '2027-03-14',
    inspectionOverdue: false,
  };
}

function bookingRow(i: number) {
  return {
    id: 500 + i,
    personId: 40 + (i % 7),
    personName: 'Noor Vasquez-Lind',
    status: 'approved',
    overdue: false,
    startsAt: '2026-12-04T09:00:00.000Z',
    endsAt: '2026-12-04T12:00:00.000Z',
    plannedKv: 25,
    itemTags: ['KH-00012', 'KH-00031', 'KH-00044', 'KH-00102'],
    purpose: `${word(i, 8)} ${word(i, 9)} at ${10 + (i % 20)} kV, ${word(i, 10)} ${word(i, 11)}`,
  };
}

const BODIES: { name: string; body: string }[] = [
  { name: 'gear search, 25 items', body: JSON.stringify({ items: Array.from({ length: 25 }, (_, i) => itemRow(i)), nextCursor: 'KH-00025' }) },
  { name: 'bookings list, 25 rows', body: JSON.stringify({ bookings: Array.from({ length: 25 }, (_, i) => bookingRow(i)), nextCursor: null }) },
  { name: 'gear search, 5 items', body: JSON.stringify({ items: Array.from({ length: 5 }, (_, i) => itemRow(i)), nextCursor: null }) },
];

/** Median of five timed rounds: the machine is shared, single rounds swing. */
function cpuMicrosPerCall(fn: () => Buffer): { us: number; bytes: number } {
  const rounds = Array.from({ length: 5 }, () => cpuRound(fn));
  rounds.sort((a, b) => a.us - b.us);
  return rounds[2]!;
}

function cpuRound(fn: () => Buffer, minMs = 300): { us: number; bytes: number } {
  let bytes = fn().length;
  for (let i = 0; i < 50; i += 1) fn();
  const started = process.cpuUsage();
  const wall = Date.now();
  let n = 0;
  while (Date.now() - wall < minMs) {
    bytes = fn().length;
    n += 1;
  }
  const used = process.cpuUsage(started);
  return { us: (used.user + used.system) / n, bytes };
}

const rows = BODIES.map(({ name, body }) => {
  const buffer = Buffer.from(body);
  const gzip = cpuMicrosPerCall(() => gzipSync(buffer, { level: 6 }));
  const br = cpuMicrosPerCall(() =>
    brotliCompressSync(buffer, { params: { [constants.BROTLI_PARAM_QUALITY]: 4, [constants.BROTLI_PARAM_SIZE_HINT]: buffer.length } }),
  );
  return { name, rawBytes: buffer.length, gzipBytes: gzip.bytes, gzipCpuUs: gzip.us, brBytes: br.bytes, brCpuUs: br.us };
});

console.log('| answer | raw | gzip (level 6) | gzip CPU µs | brotli (q4) | brotli CPU µs |');
console.log('| --- | ---: | ---: | ---: | ---: | ---: |');
for (const r of rows) {
  console.log(
    `| ${r.name} | ${(r.rawBytes / 1024).toFixed(1)} KB | ${(r.gzipBytes / 1024).toFixed(1)} KB | ${r.gzipCpuUs.toFixed(0)} | ${(r.brBytes / 1024).toFixed(1)} KB | ${r.brCpuUs.toFixed(0)} |`,
  );
}
const machine = `${os.cpus().length} × ${os.cpus()[0]?.model ?? 'unknown'}, Node ${process.version}`;
console.log(`\nmachine: ${machine}`);
const at = new Date().toISOString();
mkdirSync(path.join(ROOT, 'bench', 'results'), { recursive: true });
writeFileSync(path.join(ROOT, 'bench', 'results', `compression-${at.replace(/[:.]/g, '-')}.json`), JSON.stringify({ at, machine, rows }, null, 2));
