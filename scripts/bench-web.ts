// `npm run bench:web`: how fast the web app reaches a phone. Starts the product on its own port
// with its own database (the demo data, emptied and reloaded every run), then runs Lighthouse
// 12.2.3 with its default mobile profile (simulated slow 4G, 4x slower CPU) on Debian's chromium,
// three runs per page, and reports the median run of each page. Signed-in pages get the member's
// session cookie. It also measures, in a real browser without throttling, the bytes a first and a
// repeat visit transfer before the first API call. Prints a table and writes
// bench/results/web-<time>.json (and web-latest.json). A benchmark, not a test: `npm test` never
// runs it.
import { mkdirSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type Page } from 'playwright-core';
import { createDb } from '../server/db';
import { loadConfig } from '../server/config';
import { startServer } from '../server/index';
import { DEMO_PASSWORD } from '../seeds/01-people';
import { buildWebIfStale } from './build-web';
import { benchWebInstance, dbEnv } from './lib/instances';
import { resetDatabase, startInstance } from './lib/mariadb';
import { migrateLatest, seedDemoIfEmpty } from './lib/migrate';

const ROOT = path.resolve(__dirname, '..');
const RUNS = Number(process.env.BENCH_WEB_RUNS ?? 3);
const PORT = Number(process.env.BENCH_WEB_PORT ?? 8190);
const CHROMIUM = '/usr/bin/chromium';
const CHROME_FLAGS = [
  '--headless=new',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];
const MEMBER = 'member@voltcrib.example';

interface PageSpec {
  name: string;
  path: string;
  signedIn: boolean;
}

interface RunFigures {
  score: number;
  fcpMs: number;
  lcpMs: number;
  tbtMs: number;
  cls: number;
  bytes: number;
  unusedJsBytes: number;
  /**
   * Lighthouse's measure of this machine's CPU speed at the time of the run (higher is faster).
   * The 4x slowdown is applied on top of it, so on a busy shared machine TBT and LCP grow.
   */
  benchmarkIndex: number;
  /** The machine's 1-minute load average when the run started (2 cores: above 2, others wait). */
  loadAverage: number;
}

interface PageResult extends RunFigures {
  name: string;
  path: string;
  runs: RunFigures[];
}

/** The 1-minute load average, to two places: the other engineers' work shares these cores. */
function loadNow(): number {
  return Math.round(os.loadavg()[0]! * 100) / 100;
}

async function signIn(base: string, email: string): Promise<string> {
  const first = await fetch(`${base}/api/session`);
  const anonymous = (first.headers.get('set-cookie') ?? '').split(';')[0]!;
  const { csrfToken } = (await first.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/session`, {
    method: 'POST',
    headers: { cookie: anonymous, 'content-type': 'application/json', 'x-csrf-token': csrfToken },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  if (res.status !== 200) throw new Error(`bench:web sign-in failed: ${res.status} ${await res.text()}`);
  return (res.headers.get('set-cookie') ?? '').split(';')[0]!;
}

async function apiJson<T>(base: string, cookie: string, url: string): Promise<T> {
  const res = await fetch(`${base}${url}`, { headers: { cookie } });
  if (res.status !== 200) throw new Error(`${url}: ${res.status}`);
  return (await res.json()) as T;
}

/** The member's own booking (the demo's approved sweep) and one of its items. */
async function demoTargets(base: string, cookie: string): Promise<{ bookingId: number; itemId: number }> {
  const bookings = await apiJson<{ bookings?: { id: number }[]; data?: { id: number }[] }>(base, cookie, '/api/bookings?mine=1');
  const list = bookings.bookings ?? bookings.data ?? (bookings as unknown as { id: number }[]);
  const bookingId = list[0]?.id;
  if (!bookingId) throw new Error('the demo member has no booking');
  const items = await apiJson<{ items?: { id: number }[]; data?: { id: number }[] }>(base, cookie, '/api/items');
  const itemList = items.items ?? items.data ?? (items as unknown as { id: number }[]);
  const itemId = itemList[0]?.id;
  if (!itemId) throw new Error('the demo data has no item');
  return { bookingId, itemId };
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)]!;
}

type Lhr = {
  environment?: { benchmarkIndex?: number };
  categories: { performance: { score: number | null } };
  audits: Record<string, { numericValue?: number; details?: { overallSavingsBytes?: number; items?: { url?: string }[] } }>;
  runtimeError?: { message: string };
};

/** Whether the page asked the API for more than the session: a signed-in screen loads its data. */
function loadedSignedInData(lhr: Lhr): boolean {
  return (lhr.audits['network-requests']?.details?.items ?? []).some((r) => {
    const pathname = r.url ? new URL(r.url).pathname : '';
    return pathname.startsWith('/api/') && pathname !== '/api/session';
  });
}

function figuresOf(lhr: Lhr, loadAverage: number): RunFigures {
  const n = (id: string) => lhr.audits[id]?.numericValue ?? Number.NaN;
  return {
    score: Math.round((lhr.categories.performance.score ?? 0) * 100),
    fcpMs: n('first-contentful-paint'),
    lcpMs: n('largest-contentful-paint'),
    tbtMs: n('total-blocking-time'),
    cls: n('cumulative-layout-shift'),
    bytes: n('total-byte-weight'),
    unusedJsBytes: lhr.audits['unused-javascript']?.details?.overallSavingsBytes ?? 0,
    benchmarkIndex: Math.round(lhr.environment?.benchmarkIndex ?? 0),
    loadAverage,
  };
}

/**
 * Bytes on the wire (response headers and bodies as the browser's network stack counted them)
 * for a cold visit and for a repeat visit in the same profile, each up to the first /api request.
 */
async function visitTransfers(
  base: string,
  cookie: string | null,
  pagePath: string,
): Promise<{ firstVisitBytes: number; repeatVisitBytes: number; repeatRequests: number }> {
  const browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: CHROME_FLAGS.filter((f) => f !== '--headless=new') });
  try {
    const context = await browser.newContext({ viewport: { width: 412, height: 823 } });
    if (cookie) {
      const [name, value] = cookie.split('=') as [string, string];
      await context.addCookies([{ name, value, url: base }]);
    }
    const page = await context.newPage();
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    const measure = async (visit: (p: Page) => Promise<unknown>) => {
      let bytes = 0;
      let requests = 0;
      let apiSeen = false;
      const urls = new Map<string, string>();
      const onRequest = (e: { requestId: string; request: { url: string } }) => {
        urls.set(e.requestId, e.request.url);
        if (new URL(e.request.url).pathname.startsWith('/api/')) apiSeen = true;
      };
      const onFinished = (e: { requestId: string; encodedDataLength: number }) => {
        const url = urls.get(e.requestId);
        if (!url || apiSeen || new URL(url).pathname.startsWith('/api/')) return;
        bytes += e.encodedDataLength;
        requests += 1;
      };
      cdp.on('Network.requestWillBeSent', onRequest);
      cdp.on('Network.loadingFinished', onFinished);
      await visit(page);
      await page.waitForTimeout(2500);
      cdp.off('Network.requestWillBeSent', onRequest);
      cdp.off('Network.loadingFinished', onFinished);
      return { bytes, requests };
    };
    const first = await measure((p) => p.goto(`${base}${pagePath}`, { waitUntil: 'load' }));
    const repeat = await measure((p) => p.goto(`${base}${pagePath}`, { waitUntil: 'load' }));
    return { firstVisitBytes: first.bytes, repeatVisitBytes: repeat.bytes, repeatRequests: repeat.requests };
  } finally {
    await browser.close();
  }
}

type LighthouseFn = (typeof import('lighthouse'))['default'];

/** One Lighthouse run; a run whose trace failed to record (it happens on a loaded machine) is retried twice. */
async function lighthouseRun(lighthouse: LighthouseFn, port: number, url: string, cookie: string | null): Promise<Lhr> {
  let lastError = 'no result';
  for (let attempt = 0; attempt < 3; attempt += 1) {
    const result = await lighthouse(url, {
      port,
      output: 'json',
      logLevel: 'error',
      onlyCategories: ['performance'],
      extraHeaders: cookie ? { Cookie: cookie } : undefined,
    });
    const lhr = result?.lhr as unknown as Lhr | undefined;
    if (lhr && !lhr.runtimeError) {
      // A run that did not see the page it was meant to (signed out by a stray cookie) is flagged.
      // The Planner calculates in the browser and asks the API for nothing but the session.
      if (!url.endsWith('/planner') && loadedSignedInData(lhr) !== (cookie !== null))
        console.warn(`[bench:web] ${url}: the run ${cookie ? 'was not signed in' : 'loaded signed-in data'}`);
      return lhr;
    }
    lastError = lhr?.runtimeError?.message ?? 'no result';
    console.warn(`[bench:web] ${url}: ${lastError}; running it again`);
  }
  throw new Error(`Lighthouse failed on ${url}: ${lastError}`);
}

function kb(bytes: number): string {
  return `${(bytes / 1024).toFixed(0)} KB`;
}

async function main(): Promise<void> {
  const loadAtStart = loadNow();
  const options = benchWebInstance();
  await startInstance(options);
  resetDatabase(options);
  const env = { ...process.env, ...dbEnv(options), PORT: String(PORT), HOST: '127.0.0.1', LOG_LEVEL: 'silent', SCHEDULER: 'false', LOGIN_RATE_LIMIT: '1000' };
  const db = createDb(loadConfig(env));
  try {
    await migrateLatest(db);
    await seedDemoIfEmpty(db);
  } finally {
    await db.destroy();
  }
  // WEB_DIR measures an export kept elsewhere (an earlier build, to compare); otherwise dist/.
  if (!process.env.WEB_DIR) await buildWebIfStale();
  const server = await startServer(env);
  const base = `http://127.0.0.1:${server.port}`;
  const { default: lighthouse } = await import('lighthouse');
  const chromeLauncher = await import('chrome-launcher');
  try {
    const cookie = await signIn(base, MEMBER);
    const { bookingId, itemId } = await demoTargets(base, cookie);
    const pages: PageSpec[] = [
      { name: 'Sign-in', path: '/sign-in', signedIn: false },
      { name: 'Today', path: '/', signedIn: true },
      { name: 'Gear search', path: '/gear', signedIn: true },
      { name: 'Item', path: `/gear/${itemId}`, signedIn: true },
      { name: 'Booking', path: `/bookings/${bookingId}`, signedIn: true },
      { name: 'Release', path: `/bookings/${bookingId}/release`, signedIn: true },
      { name: 'Planner', path: '/planner', signedIn: true },
    ];
    const results: PageResult[] = [];
    for (const spec of pages) {
      const runs: RunFigures[] = [];
      // A fresh browser profile per page: a cookie the sign-in page was given must not sign the
      // member out of the next page's runs.
      const chrome = await chromeLauncher.launch({ chromePath: CHROMIUM, chromeFlags: CHROME_FLAGS });
      try {
        for (let i = 0; i < RUNS; i += 1) {
          const load = loadNow();
          runs.push(figuresOf(await lighthouseRun(lighthouse, chrome.port, `${base}${spec.path}`, spec.signedIn ? cookie : null), load));
        }
      } finally {
        chrome.kill();
      }
      // The median run by score (ties by LCP), so every figure in a row comes from one real run.
      const ordered = [...runs].sort((a, b) => a.score - b.score || b.lcpMs - a.lcpMs);
      const mid = ordered[Math.floor(ordered.length / 2)]!;
      results.push({ name: spec.name, path: spec.path, ...mid, runs });
      console.log(`[bench:web] ${spec.name}: score ${mid.score} (runs ${runs.map((r) => `${r.score} at load ${r.loadAverage}`).join(', ')})`);
    }
    const signInVisit = await visitTransfers(base, null, '/sign-in');
    const todayVisit = await visitTransfers(base, cookie, '/');

    console.log('\n| page | score | FCP | LCP | TBT | CLS | transferred | unused JS | CPU index | load |');
    console.log('| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: |');
    for (const r of results) {
      console.log(
        `| ${r.name} | ${r.score} | ${(r.fcpMs / 1000).toFixed(1)} s | ${(r.lcpMs / 1000).toFixed(1)} s | ${r.tbtMs.toFixed(0)} ms | ${r.cls.toFixed(3)} | ${kb(r.bytes)} | ${kb(r.unusedJsBytes)} | ${r.benchmarkIndex} | ${r.loadAverage.toFixed(1)} |`,
      );
    }
    console.log('\n| visit (before the first API call) | first visit | repeat visit |');
    console.log('| --- | ---: | ---: |');
    console.log(
      `| Sign-in | ${kb(signInVisit.firstVisitBytes)} | ${(signInVisit.repeatVisitBytes / 1024).toFixed(1)} KB (${signInVisit.repeatRequests} requests) |`,
    );
    console.log(
      `| Today | ${kb(todayVisit.firstVisitBytes)} | ${(todayVisit.repeatVisitBytes / 1024).toFixed(1)} KB (${todayVisit.repeatRequests} requests) |`,
    );
    const median3 = (key: keyof RunFigures) => results.map((r) => ({ page: r.name, median: median(r.runs.map((x) => x[key])) }));
    const loadAverages = { atStart: loadAtStart, atEnd: loadNow() };
    console.log(`load average (1 min) at the start ${loadAverages.atStart}, at the end ${loadAverages.atEnd}; each row's is its median run's`);
    const machine = {
      cpus: os.cpus().length,
      cpuModel: os.cpus()[0]?.model ?? 'unknown',
      memGb: Math.round(os.totalmem() / 2 ** 30),
      node: process.version,
      platform: `${os.type()} ${os.release()}`,
    };
    console.log(
      `\nmachine: ${machine.cpus} × ${machine.cpuModel}, ${machine.memGb} GB, ${machine.platform}, Node ${machine.node}; Lighthouse 12.2.3 mobile (simulated), ${RUNS} runs per page, median run`,
    );
    const out = {
      at: new Date().toISOString(),
      lighthouse: '12.2.3',
      profile: 'default mobile, simulated throttling',
      runsPerPage: RUNS,
      machine,
      loadAverages,
      pages: results,
      perMetricMedians: { lcpMs: median3('lcpMs'), score: median3('score') },
      visits: { signIn: signInVisit, today: todayVisit },
    };
    const dir = path.join(ROOT, 'bench', 'results');
    mkdirSync(dir, { recursive: true });
    const json = JSON.stringify(out, null, 2);
    writeFileSync(path.join(dir, `web-${out.at.replace(/[:.]/g, '-')}.json`), json);
    writeFileSync(path.join(dir, 'web-latest.json'), json);
  } finally {
    await server.close();
  }
}

main().then(
  () => process.exit(0),
  (error: unknown) => {
    console.error(error instanceof Error ? (error.stack ?? error.message) : error);
    process.exit(1);
  },
);
