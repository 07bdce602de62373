// Browser tests: the real server (exported web app + API) on a free loopback port against the test
// database, driven by Debian's chromium through playwright-core. Never downloads a browser.
import { appendFileSync, mkdirSync, readFileSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import type { Server } from 'node:http';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { createApp } from '../../server/app';
import { createLogger } from '../../server/logger';
import { startFakeSmtp, type FakeSmtp } from '../../server/mail/fake-smtp';
import { createDb, type Db } from '../../server/db';
import { testConfig } from './test-app';

export const PHONE = { width: 390, height: 844 };
export const WIDE = { width: 1280, height: 800 };

async function freePort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as net.AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

export interface E2eServer {
  baseUrl: string;
  db: Db;
  smtp: FakeSmtp;
  close(): Promise<void>;
}

export async function startE2eServer(): Promise<E2eServer> {
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  // VOLTCRIB_E2E_WEB_DIR lets parallel work export the app to its own folder.
  const webDir = process.env.VOLTCRIB_E2E_WEB_DIR ?? path.resolve(__dirname, '../../dist');
  const config = testConfig({ PORT: String(port), PUBLIC_URL: baseUrl, WEB_DIR: webDir });
  const db = createDb(config);
  const smtp = await startFakeSmtp();
  const app = createApp({ db, config, logger: createLogger('silent'), mailbox: smtp });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(port, '127.0.0.1', () => resolve(s));
  });
  return {
    baseUrl,
    db,
    smtp,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections?.();
      await smtp.close();
      await db.destroy();
    },
  };
}

export interface BrowserHandle {
  browser: Browser;
  close(): Promise<void>;
}

/** Debian's chromium, quiet on a closed network. `fakeVideo` feeds a y4m file as the camera. */
export async function launchBrowser(options: { fakeVideo?: string } = {}): Promise<BrowserHandle> {
  // playwright gives every launch a fresh, throw-away profile of its own.
  const args = [
    '--no-sandbox',
    '--disable-gpu',
    '--disable-quic',
    '--no-first-run',
    '--disable-background-networking',
    '--disable-component-update',
    '--disable-sync',
  ];
  if (options.fakeVideo) {
    args.push('--use-fake-ui-for-media-stream', '--use-fake-device-for-media-stream', `--use-file-for-fake-video-capture=${options.fakeVideo}`);
  }
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args });
  return {
    browser,
    close: () => browser.close(),
  };
}

export async function newPage(
  browser: Browser,
  viewport: { width: number; height: number },
  colorScheme: 'light' | 'dark' = 'light',
): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport, colorScheme });
  const page = await context.newPage();
  return { context, page };
}

export async function signInThroughUi(page: Page, baseUrl: string, email: string, password: string): Promise<void> {
  await page.goto(`${baseUrl}/`, { waitUntil: 'load' });
  await page.getByTestId('sign-in-screen').waitFor({ timeout: 20_000 });
  await expectAccessible(page, 'sign-in');
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(password);
  await page.getByTestId('sign-in-submit').click();
  await page.getByTestId('today-screen').waitFor({ timeout: 20_000 });
  await expectAccessible(page, 'today');
}

export const SCREENSHOT_DIR = path.resolve(__dirname, '../../test-results');

export interface E2eSuite {
  /** Set before the file's own beforeAll hooks run. */
  readonly server: E2eServer;
  readonly browser: BrowserHandle;
}

/**
 * Starts a server and a browser for a test file and stops both after it. Call at the top of the
 * file, before its own beforeAll hooks, which then find both ready.
 */
export function e2eSuite(): E2eSuite {
  const suite = {} as { server: E2eServer; browser: BrowserHandle };
  beforeAll(async () => {
    suite.server = await startE2eServer();
    suite.browser = await launchBrowser();
    mkdirSync(SCREENSHOT_DIR, { recursive: true });
  });
  afterAll(async () => {
    await suite.browser?.close();
    await suite.server?.close();
  });
  return suite;
}

// ---------------------------------------------------------------------------------------------
// Accessibility: axe-core (pinned in package.json) injected into the page, run on every screen a
// browser test visits at both viewports and in both colour schemes. Any violation fails the test.

// Four axe runs per screen: browser tests get three minutes each instead of jest's one.
jest.setTimeout(180_000);

/** Screens (by the name a test gives) already checked in this test file: each is checked once. */
const checkedScreens = new Set<string>();

const AXE_SOURCE = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');
const A11Y_VIEWPORTS = [
  { name: 'phone', size: PHONE },
  { name: 'wide', size: WIDE },
] as const;
const A11Y_SCHEMES = ['light', 'dark'] as const;
/** One line per check (screen × viewport × scheme) with its violation count, for the report. */
export const A11Y_LOG = path.join(SCREENSHOT_DIR, 'axe-checks.jsonl');

interface AxeViolation {
  id: string;
  help: string;
  impact: string | null;
  targets: string[];
}

declare global {
  interface Window {
    axe?: {
      run(
        context: Document,
        options: Record<string, unknown>,
      ): Promise<{ violations: { id: string; help: string; impact: string | null; nodes: { target: unknown[] }[] }[] }>;
    };
  }
}

/** Two animation frames and a moment: a resize or a scheme change has re-rendered and painted. */
async function settle(page: Page): Promise<void> {
  await page.evaluate(() => new Promise<void>((resolve) => requestAnimationFrame(() => requestAnimationFrame(() => setTimeout(resolve, 120)))));
}

async function axeViolations(page: Page): Promise<AxeViolation[]> {
  // Evaluated through the DevTools protocol: the app's CSP (script-src 'self') rightly refuses an
  // injected <script>, and the page is tested with its real headers.
  if (!(await page.evaluate(() => typeof window.axe !== 'undefined'))) await page.evaluate(AXE_SOURCE);
  return page.evaluate(async () => {
    const result = await window.axe!.run(document, { resultTypes: ['violations'] });
    return result.violations.map((v) => ({
      id: v.id,
      help: v.help,
      impact: v.impact,
      targets: v.nodes.slice(0, 4).map((n) => n.target.map(String).join(' ')),
    }));
  });
}

/**
 * Fails when axe-core finds any violation on the current screen, at 390x844 and 1280x800, light
 * and dark. The page is put back to its own viewport and scheme afterwards, so a test goes on
 * where it was. `screen` names the screen (and its state, where one matters) in the failure and
 * the log; a name already checked in this file is not checked again.
 */
export async function expectAccessible(page: Page, screen: string): Promise<void> {
  if (checkedScreens.has(screen)) return;
  checkedScreens.add(screen);
  const ownSize = page.viewportSize();
  const ownScheme = (await page.evaluate(() => matchMedia('(prefers-color-scheme: dark)').matches)) ? 'dark' : 'light';
  const problems: string[] = [];
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  try {
    for (const viewport of A11Y_VIEWPORTS) {
      await page.setViewportSize(viewport.size);
      for (const scheme of A11Y_SCHEMES) {
        await page.emulateMedia({ colorScheme: scheme });
        await settle(page);
        const violations = await axeViolations(page);
        appendFileSync(
          A11Y_LOG,
          `${JSON.stringify({ screen, viewport: viewport.name, scheme, violations: violations.map((v) => v.id), targets: violations.map((v) => `${v.id}: ${v.targets.join(' | ')}`) })}\n`,
        );
        for (const v of violations) problems.push(`${viewport.name}/${scheme} ${v.id} (${v.impact ?? 'n/a'}): ${v.help}\n      ${v.targets.join('\n      ')}`);
      }
    }
  } finally {
    if (ownSize) await page.setViewportSize(ownSize);
    await page.emulateMedia({ colorScheme: ownScheme });
    await settle(page);
  }
  if (problems.length > 0 && !process.env.AXE_REPORT_ONLY)
    throw new Error(`axe-core found ${problems.length} violation(s) on ${screen}:\n  ${problems.join('\n  ')}`);
}
