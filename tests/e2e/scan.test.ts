// Scanning: a real QR label shown to a fake camera opens the item; the typed tag works without a
// camera; an unknown tag says so; a label URL opened signed out comes back after sign-in.
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { writeQrVideo } from '../helpers/fake-camera';
import { insertItem } from '../helpers/gear';
import { createPerson } from '../helpers/test-app';
import {
  launchBrowser,
  newPage,
  PHONE,
  SCREENSHOT_DIR,
  signInThroughUi,
  startE2eServer,
  type BrowserHandle,
  type E2eServer,
  expectAccessible,
} from '../helpers/e2e';

let server: E2eServer;
/** Chromium whose camera shows the label of `scanned`. */
let cameraBrowser: BrowserHandle;
/** Chromium whose camera shows a QR code from elsewhere (a web address that is not a label). */
let foreignQrBrowser: BrowserHandle;
/** Chromium with no camera granted: the typed fallback must carry the screen alone. */
let plainBrowser: BrowserHandle;
let scanned: { id: number; tag: string };

beforeAll(async () => {
  server = await startE2eServer();
  scanned = await insertItem(server.db, 'hv-supply');
  // Exactly what a printed label holds (server/services/labels.ts): the item's URL on this server.
  const video = writeQrVideo(`${server.baseUrl}/i/${encodeURIComponent(scanned.tag)}`);
  cameraBrowser = await launchBrowser({ fakeVideo: video });
  foreignQrBrowser = await launchBrowser({ fakeVideo: writeQrVideo('https://example.org/kestrel-hall/visitor-wifi') });
  plainBrowser = await launchBrowser();
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
});
afterAll(async () => {
  await cameraBrowser?.close();
  await foreignQrBrowser?.close();
  await plainBrowser?.close();
  await server?.close();
});

it('opens the item whose QR label the camera sees', async () => {
  const person = await createPerson(server.db, { role: 'member' });
  const { context, page } = await newPage(cameraBrowser.browser, PHONE);
  try {
    await context.grantPermissions(['camera'], { origin: server.baseUrl });
    const wasmRequests: string[] = [];
    page.on('request', (request) => {
      if (request.url().endsWith('.wasm')) wasmRequests.push(request.url());
    });
    await signInThroughUi(page, server.baseUrl, person.email, person.password);
    await page.getByTestId('nav-scan').click();
    await page.getByTestId('scan-screen').waitFor();
    // No axe check here: the fake camera's code opens the item within a second, mid-check. The
    // scan screen is checked by the tests below (no camera, a foreign code) with nothing to read.
    await page.getByTestId('item-screen').waitFor({ timeout: 15_000 });
    await expectAccessible(page, 'item');
    await expect(page.getByTestId('item-tag').textContent({ timeout: 5_000 })).resolves.toBe(scanned.tag);
    expect(new URL(page.url()).pathname).toBe(`/gear/${scanned.id}`);
    // The decoder came from our own origin, never from a CDN.
    expect(wasmRequests.length).toBeGreaterThan(0);
    for (const url of wasmRequests) expect(url).toBe(`${server.baseUrl}/zxing_reader.wasm`);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'scan-opened-item-phone.png') });
  } finally {
    await context.close();
  }
});

it('says so when the camera sees a QR code that is not a gear label, and keeps scanning', async () => {
  const person = await createPerson(server.db, { role: 'member' });
  const { context, page } = await newPage(foreignQrBrowser.browser, PHONE);
  try {
    await context.grantPermissions(['camera'], { origin: server.baseUrl });
    await signInThroughUi(page, server.baseUrl, person.email, person.password);
    await page.getByTestId('nav-scan').click();
    await page.getByTestId('scan-not-a-label').waitFor({ timeout: 15_000 });
    expect(await page.locator('[data-testid="scan-camera"] video').count()).toBe(1);
    expect(await page.getByTestId('item-screen').count()).toBe(0);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'scan-foreign-code-phone.png') });
  } finally {
    await context.close();
  }
});

describe('without a camera', () => {
  it('opens an item from its typed tag, in any letter case', async () => {
    const person = await createPerson(server.db, { role: 'member' });
    const item = await insertItem(server.db, 'probe');
    const { context, page } = await newPage(plainBrowser.browser, PHONE);
    try {
      await signInThroughUi(page, server.baseUrl, person.email, person.password);
      await page.getByTestId('nav-scan').click();
      await page.getByTestId('scan-screen').waitFor();
      await expectAccessible(page, 'scan');
      // This chromium has no camera device (or no permission for one): the scanner says so in
      // place of the preview, and typing works meanwhile.
      await page.locator('[data-testid="scan-camera-unavailable"], [data-testid="scan-camera-permission-needed"]').waitFor({ timeout: 15_000 });
      expect(await page.locator('[data-testid="scan-camera"] video').count()).toBe(0);
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'scan-no-camera-phone.png') });
      await page.getByTestId('scan-typed-input').fill(item.tag.toLowerCase());
      await page.getByTestId('scan-typed-submit').click();
      await page.getByTestId('item-screen').waitFor({ timeout: 15_000 });
      await expectAccessible(page, 'item');
      await expect(page.getByTestId('item-tag').textContent()).resolves.toBe(item.tag);
    } finally {
      await context.close();
    }
  });

  it('says plainly when no gear carries a typed tag', async () => {
    const person = await createPerson(server.db, { role: 'member' });
    const { context, page } = await newPage(plainBrowser.browser, PHONE);
    try {
      await signInThroughUi(page, server.baseUrl, person.email, person.password);
      await page.getByTestId('nav-scan').click();
      await page.getByTestId('scan-typed-input').fill('NOSUCH-0000');
      await page.getByTestId('scan-typed-submit').click();
      const message = await page.getByTestId('scan-not-found').textContent({ timeout: 15_000 });
      expect(message).toContain('NOSUCH-0000');
      expect(await page.getByTestId('item-screen').count()).toBe(0);
    } finally {
      await context.close();
    }
  });

  it('refuses text that is not a tag without asking the server', async () => {
    const person = await createPerson(server.db, { role: 'member' });
    const { context, page } = await newPage(plainBrowser.browser, PHONE);
    try {
      await signInThroughUi(page, server.baseUrl, person.email, person.password);
      await page.getByTestId('nav-scan').click();
      await page.getByTestId('scan-typed-input').fill('no tag here!');
      await page.getByTestId('scan-typed-submit').click();
      await expect(page.getByTestId('scan-typed-input-error').textContent({ timeout: 5_000 })).resolves.toMatch(/capital letters/);
    } finally {
      await context.close();
    }
  });
});

describe('a label URL opened by any phone camera', () => {
  it('sends a signed-out visitor to sign in and then to the item', async () => {
    const person = await createPerson(server.db, { role: 'member' });
    const { context, page } = await newPage(plainBrowser.browser, PHONE);
    try {
      await page.goto(`${server.baseUrl}/i/${encodeURIComponent(scanned.tag)}`, { waitUntil: 'load' });
      await page.getByTestId('sign-in-email').fill(person.email);
      await page.getByTestId('sign-in-password').fill(person.password);
      await page.getByTestId('sign-in-submit').click();
      await page.getByTestId('item-screen').waitFor({ timeout: 20_000 });
      await expectAccessible(page, 'item');
      await expect(page.getByTestId('item-tag').textContent()).resolves.toBe(scanned.tag);
    } finally {
      await context.close();
    }
  });

  it('shows a clear message for a tag no gear carries', async () => {
    const person = await createPerson(server.db, { role: 'member' });
    const { context, page } = await newPage(plainBrowser.browser, PHONE);
    try {
      await signInThroughUi(page, server.baseUrl, person.email, person.password);
      await page.goto(`${server.baseUrl}/i/GONE-9999`, { waitUntil: 'load' });
      const message = await page.getByTestId('item-by-tag-not-found').textContent({ timeout: 15_000 });
      expect(message).toContain('No gear carries the tag GONE-9999');
    } finally {
      await context.close();
    }
  });
});
