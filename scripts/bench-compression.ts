// `npm run bench:compression`: what the `compression` middleware costs the server per API answer.
// It compresses real answers of the sizes the app asks for (built here from the bench's item and
// booking shapes) with the middleware's own defaults (gzip level 6, brotli quality 4) and reports
// CPU microseconds per answer and the bytes saved, next to the ~1.6-2.9 ms of server CPU a
// signed-in list request costs in `npm run bench` (README). Results: stdout + bench/results/.
import { mkdirSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';

const ROOT = path.resolve(__dirname, '..');

function itemRow(i: number) {
  return {
    id: 10_000 + i,
    tag: `KH-${String(i).padStart(5, '0')}`,
    kind: ['probe', 'hv-supply', 'grounding-stick', 'isolation-stand', 'interlock', 'multiplier'][i % 6],
    name: `Kestrel Hall corona probe ${i}`,
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
    purpose: 'Ion-wind thrust sweep at 15-25 kV',
  };
}

const BODIES: { name: string; body: string }[] = [
  { name: 'gear search, 25 items', body: JSON.stringify({ items: Array.from({ length: 25 }, (_, i) => itemRow(i)), nextCursor: 'KH-00025' }) },
  { name: 'bookings list, 25 rows', body: JSON.stringify({ bookings: Array.from({ length: 25 }, (_, i) => bookingRow(i)), nextCursor: null }) },
  { name: 'gear search, 5 items', body: JSON.stringify({ items: Array.from({ length: 5 }, (_, i) => itemRow(i)), nextCursor: null }) },
];

function cpuMicrosPerCall(fn: () => Buffer, minMs = 400): { us: number; bytes: number } {
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
  const br = cpuMicrosPerCall(() => brotliCompressSync(buffer, { params: { [constants.BROTLI_PARAM_QUALITY]: 4, [constants.BROTLI_PARAM_SIZE_HINT]: buffer.length } }));
  return { name, rawBytes: buffer.length, gzipBytes: gzip.bytes, gzipCpuUs: gzip.us, brBytes: br.bytes, brCpuUs: br.us };
});

console.log('| answer | raw | gzip (level 6) | gzip CPU µs | brotli (q4) | brotli CPU µs |');
console.log('| --- | ---: | ---: | ---: | ---: | ---: |');
for (const r of rows) {
  console.log(`| ${r.name} | ${(r.rawBytes / 1024).toFixed(1)} KB | ${(r.gzipBytes / 1024).toFixed(1)} KB | ${r.gzipCpuUs.toFixed(0)} | ${(r.brBytes / 1024).toFixed(1)} KB | ${r.brCpuUs.toFixed(0)} |`);
}
const machine = `${os.cpus().length} × ${os.cpus()[0]?.model ?? 'unknown'}, Node ${process.version}`;
console.log(`\nmachine: ${machine}`);
const at = new Date().toISOString();
mkdirSync(path.join(ROOT, 'bench', 'results'), { recursive: true });
writeFileSync(path.join(ROOT, 'bench', 'results', `compression-${at.replace(/[:.]/g, '-')}.json`), JSON.stringify({ at, machine, rows }, null, 2));
