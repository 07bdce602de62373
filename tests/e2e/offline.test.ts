// Opened once, the app opens again with the network cut: the service worker serves the app shell
// and fonts from its cache, and the app says plainly that it is offline and that nothing can be
// released, booked or returned until the connection is back, instead of showing old data as
// current or failing silently.
import path from 'node:path';
import type { Page } from 'playwright-core';
import { createPerson } from '../helpers/test-app';
import { e2eSuite, newPage, PHONE, SCREENSHOT_DIR, signInThroughUi } from '../helpers/e2e';

const suite = e2eSuite();

/** Waits until the service worker controls the page, so the next load can come from its cache. */
async function waitForServiceWorker(page: Page): Promise<void> {
  await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
  if (!(await page.evaluate(() => navigator.serviceWorker.controller !== null))) {
    await page.reload({ waitUntil: 'load' });
    await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
  }
}

it('opens without a network after one visit and says nothing can be released, booked or returned', async () => {
  const person = await createPerson(suite.server.db, { role: 'member', name: 'Offline Member' });
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, person.email, person.password);
    await waitForServiceWorker(page);
    expect(await page.getByTestId('offline-notice').count()).toBe(0);

    // The connection drops while the app is open: it says so at once, above the screen.
    await context.setOffline(true);
    const notice = page.getByTestId('offline-notice');
    await notice.waitFor({ timeout: 10_000 });
    const text = await notice.innerText();
    expect(text).toMatch(/offline/i);
    expect(text).toMatch(/nothing can be released, booked or returned until the connection is back/i);
    expect(text).toMatch(/may be out of date/i);

    // A fresh load with no network: the shell and fonts come from the service worker's cache.
    await page.reload({ waitUntil: 'load' });
    await notice.waitFor({ timeout: 10_000 });
    expect(await notice.innerText()).toMatch(/nothing can be released, booked or returned/i);
    // Nothing from before is shown as current: no screen of data renders without the server.
    expect(await page.getByTestId('today-screen').count()).toBe(0);
    const fontsReady = await page.evaluate(async () => {
      await document.fonts.ready;
      return ['AtkinsonHyperlegible_400Regular', 'material-community'].map((family) => document.fonts.check(`16px "${family}"`));
    });
    expect(fontsReady).toEqual([true, true]);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'offline-phone.png') });

    // Back online: the notice goes and the app carries on by itself.
    await context.setOffline(false);
    await page.getByTestId('today-screen').waitFor({ timeout: 20_000 });
    expect(await notice.count()).toBe(0);
  } finally {
    await context.close();
  }
});

it('serves the service worker and index.html for revalidation, hashed files for a year', async () => {
  const res = await fetch(`${suite.server.baseUrl}/sw.js`);
  expect(res.status).toBe(200);
  expect(res.headers.get('cache-control')).toBe('no-cache');
  const html = await fetch(`${suite.server.baseUrl}/bookings/1`, { headers: { 'accept-encoding': 'br' } });
  expect(html.headers.get('cache-control')).toBe('no-cache');
  expect(html.headers.get('etag')).toBeTruthy();
  const body = await html.text();
  // The text fonts and icon font are preloaded WOFF2 files declared with font-display: swap.
  const preloads = [...body.matchAll(/<link rel="preload" href="(\/fonts\/[^"]+\.woff2)" as="font"/g)].map((m) => m[1]!);
  expect(preloads).toHaveLength(3);
  expect(body.match(/font-display:swap/g)).toHaveLength(3);
  for (const href of preloads) {
    const font = await fetch(`${suite.server.baseUrl}${href}`);
    expect(font.headers.get('content-type')).toBe('font/woff2');
    expect(font.headers.get('cache-control')).toBe('public, max-age=31536000, immutable');
    expect(
      Buffer.from(await font.arrayBuffer())
        .subarray(0, 4)
        .toString('latin1'),
    ).toBe('wOF2');
  }
});
