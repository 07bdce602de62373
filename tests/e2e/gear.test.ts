// The gear registry in a browser: a manager registers a multiplier through the form, finds it,
// records a failed inspection and sees it tagged out; the list filters by kind and rating; a
// member reads gear but is offered none of the manager's actions.
import path from 'node:path';
import type { Locator, Page } from 'playwright-core';
import { PNG } from 'pngjs';
import { insertItem, renameItem } from '../helpers/gear';
import { createPerson, uniqueWord } from '../helpers/test-app';
import { e2eSuite, newPage, PHONE, SCREENSHOT_DIR, signInThroughUi, WIDE, expectAccessible } from '../helpers/e2e';

const suite = e2eSuite();

/** Only what is on screen: a stack keeps the screens under the top one mounted (hidden). */
function shown(page: Page, testId: string): Locator {
  return page.getByTestId(testId).filter({ visible: true });
}

function shownLocator(page: Page, selector: string): Locator {
  return page.locator(selector).filter({ visible: true });
}

function rows(page: Page, options?: { hasText: string }): Locator {
  return page.locator('[data-testid^="gear-row-"]', options).filter({ visible: true });
}

async function openGear(page: Page): Promise<void> {
  await shown(page, 'nav-gear').click();
  await shown(page, 'gear-screen').waitFor();
  await expectAccessible(page, 'gear');
}

/** Polls until the locator matches exactly `n` elements (lists update after a debounce). */
async function waitForCount(locator: Locator, n: number, timeoutMs = 15_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while ((await locator.count()) !== n && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
}

async function search(page: Page, text: string): Promise<void> {
  await shown(page, 'gear-search').fill(text);
}

it('a manager registers a multiplier, finds it, fails its inspection and sees it tagged out', async () => {
  const manager = await createPerson(suite.server.db, { role: 'manager', name: 'Wren Adeyemi' });
  const word = uniqueWord();
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, manager.email, manager.password);
    await openGear(page);
    await shown(page, 'gear-register').click();
    await shown(page, 'item-form').waitFor({ timeout: 15_000 });

    // The shared schema refuses an empty form before anything is sent.
    await shown(page, 'item-form-submit').click();
    await expect(shown(page, 'item-form-name-error').textContent()).resolves.toBe('Give the item a name');
    // Left empty: the shared error map asks for it plainly.
    await expect(shown(page, 'item-form-rating-maxOutputKv-error').textContent()).resolves.toBe('Fill this in');

    // Multiplier is the default kind; its ratings are asked for with their units.
    await expect(page.getByText('Max output voltage (kV)').count()).resolves.toBe(1);
    await expect(page.getByText('Stage capacitance (nF)').count()).resolves.toBe(1);
    await shown(page, 'item-form-name').fill(`Kestrel ${word} stack`);
    await shown(page, 'item-form-rating-maxOutputKv').fill('80');
    await shown(page, 'item-form-rating-maxInputKvPeak').fill('10');
    await shown(page, 'item-form-rating-stages').fill('6');
    await shown(page, 'item-form-rating-stageCapacitanceNf').fill('2,2');
    await shown(page, 'item-form-rating-driveFrequencyHz').fill('20000');
    await shown(page, 'item-form-rating-maxMa').fill('1.5');
    await shown(page, 'item-form-rating-polarity-positive').click();
    await shown(page, 'item-form-location').fill('Kestrel Hall, bay 2');
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'gear-form-phone.png'), fullPage: true });
    await shown(page, 'item-form-submit').click();

    await shown(page, 'item-screen').waitFor({ timeout: 15_000 });
    await expectAccessible(page, 'item');
    const tag = (await shown(page, 'item-tag').textContent({ timeout: 15_000 })) ?? '';
    expect(tag).toMatch(/^MUL-\d{4}$/);
    await expect(shown(page, 'item-rating-stageCapacitanceNf').textContent()).resolves.toContain('2.2 nF');
    await expect(shown(page, 'item-rated-kv').textContent()).resolves.toBe('80 kV');

    // Found in the list by a word of its name.
    await openGear(page);
    await search(page, word);
    const row = rows(page, { hasText: tag });
    await row.waitFor({ timeout: 15_000 });
    // The search is debounced: in a fresh database the new item is also on the unfiltered first
    // page, so wait for the list to narrow down before counting.
    await waitForCount(rows(page), 1);
    expect(await rows(page).count()).toBe(1);
    await row.click();
    await shown(page, 'item-screen').waitFor();
    await expectAccessible(page, 'item');
    await expect(shown(page, 'item-tag').textContent()).resolves.toBe(tag);

    // A failed inspection says beforehand that it tags the item out, and does.
    await shown(page, 'item-record-inspection').click();
    await shown(page, 'inspection-result-fail').click();
    await shown(page, 'inspection-fail-warning').waitFor();
    await shown(page, 'inspection-submit').click();
    await expect(shown(page, 'inspection-notes-error').textContent()).resolves.toBe('Describe what failed');
    await shown(page, 'inspection-add-reading').click();
    await shown(page, 'inspection-reading-0-label').fill('Insulation resistance, top stage');
    await shown(page, 'inspection-reading-0-unit').fill('MΩ');
    await shown(page, 'inspection-reading-0-value').fill('12');
    await shown(page, 'inspection-notes').fill('Cracked diode string in stage 4');
    await shown(page, 'inspection-submit').click();

    await shown(page, 'item-tagged-out').waitFor({ timeout: 15_000 });
    await expect(shown(page, 'item-action-done').textContent()).resolves.toContain(`${tag} is now tagged out of service`);
    await expect(shown(page, 'item-status').textContent()).resolves.toMatch(/Out of service$/);
    await expect(shown(page, 'item-status-reason').textContent()).resolves.toContain('Cracked diode string in stage 4');
    const inspection = shownLocator(page, '[data-testid^="inspection-"][data-testid$="-result"]').first();
    await expect(inspection.textContent()).resolves.toMatch(/^Failed/);
    await expect(shown(page, 'item-inspections').textContent()).resolves.toContain('Insulation resistance, top stage: 12 MΩ');
    // The history shows the tag-out with its reason.
    // In the audit trail's words: who, which item, what happened.
    await shown(page, 'item-history')
      .getByText(/recorded a failed inspection of .+; it is out of service until repaired\./)
      .waitFor({ timeout: 15_000 });
    await shown(page, 'item-history')
      .getByText(/tagged .+ out of service\./)
      .first()
      .waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'gear-item-tagged-out-phone.png'), fullPage: true });

    // The list shows it out of service too.
    await openGear(page);
    await search(page, word);
    await expect(row.textContent({ timeout: 15_000 })).resolves.toContain('Out of service');
  } finally {
    await context.close();
  }
});

describe('the gear list filters', () => {
  let word: string;
  let probe: { id: number };
  let supply: { id: number };
  let stick: { id: number };
  beforeAll(async () => {
    word = uniqueWord();
    probe = await insertItem(suite.server.db, 'probe', { ratings: { maxKv: 40, ratio: 1000, inputResistanceMohm: 1000 } });
    supply = await insertItem(suite.server.db, 'hv-supply');
    stick = await insertItem(suite.server.db, 'grounding-stick', { ratings: { ratedKv: 100, hookResistanceMohm: null, cableLengthM: 3 } });
    // One shared word in their names so a search narrows the list to these three.
    for (const [item, label] of [
      [probe, 'divider'],
      [supply, 'supply'],
      [stick, 'stick'],
    ] as const) {
      await renameItem(suite.server.db, item.id, `Filter ${word} ${label}`);
    }
  });

  const visible = async (page: Page, id: number) => shown(page, `gear-row-${id}`).count();

  it.each([
    ['phone', PHONE],
    ['wide', WIDE],
  ] as const)('by kind and minimum kV (%s)', async (name, viewport) => {
    const member = await createPerson(suite.server.db, { role: 'member' });
    const { context, page } = await newPage(suite.browser.browser, viewport);
    try {
      await signInThroughUi(page, suite.server.baseUrl, member.email, member.password);
      await openGear(page);
      await search(page, word);
      await shown(page, `gear-row-${stick.id}`).waitFor({ timeout: 15_000 });
      await waitForCount(rows(page), 3);
      expect(await rows(page).count()).toBe(3);
      if (name === 'wide') await shown(page, 'gear-table').waitFor();

      // The panel starts closed on a phone and open on a wide screen.
      if ((await shown(page, 'gear-filters-panel').count()) === 0) await shown(page, 'gear-filters-toggle').click();
      await shown(page, 'gear-filter-min-kv').fill('35');
      await shown(page, `gear-row-${supply.id}`).waitFor({ state: 'detached', timeout: 15_000 });
      expect(await visible(page, probe.id)).toBe(1);
      expect(await visible(page, stick.id)).toBe(1);

      await shown(page, 'gear-filter-kind-probe').click();
      await shown(page, `gear-row-${stick.id}`).waitFor({ state: 'detached', timeout: 15_000 });
      expect(await visible(page, probe.id)).toBe(1);
      await waitForCount(rows(page), 1);
      expect(await rows(page).count()).toBe(1);
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, `gear-list-filtered-${name}.png`), fullPage: true });

      await shown(page, 'gear-filter-min-kv').fill('45');
      await shown(page, 'gear-empty').waitFor({ timeout: 15_000 });
      expect(await visible(page, probe.id)).toBe(0);

      await shown(page, 'gear-filters-clear').click();
      await shown(page, `gear-row-${supply.id}`).waitFor({ timeout: 15_000 });
      await waitForCount(rows(page), 3);
      expect(await rows(page).count()).toBe(3);
    } finally {
      await context.close();
    }
  });
});

it('a member reads an item but is offered no register, edit or inspection actions', async () => {
  const member = await createPerson(suite.server.db, { role: 'member' });
  const item = await insertItem(suite.server.db, 'hv-supply');
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, member.email, member.password);
    await openGear(page);
    await rows(page).first().waitFor({ timeout: 15_000 });
    expect(await shown(page, 'gear-register').count()).toBe(0);

    await page.goto(`${suite.server.baseUrl}/gear/${item.id}`, { waitUntil: 'load' });
    await shown(page, 'item-summary').waitFor({ timeout: 15_000 });
    await expect(shown(page, 'item-tag').textContent()).resolves.toBe(item.tag);
    await expect(shown(page, 'item-rating-maxKv').textContent()).resolves.toContain('30 kV');
    await shown(page, 'item-label-qr').waitFor();
    for (const id of ['item-actions', 'item-edit', 'item-record-inspection', 'item-tag-out', 'item-retire', 'item-print-label', 'item-add-photo']) {
      expect(await shown(page, id).count()).toBe(0);
    }
    // The form's address does not let a member in either.
    await page.goto(`${suite.server.baseUrl}/gear/new`, { waitUntil: 'load' });
    await shown(page, 'item-form-not-allowed').waitFor({ timeout: 15_000 });
    expect(await shown(page, 'item-form').count()).toBe(0);
  } finally {
    await context.close();
  }
});

describe('a manager on an item page', () => {
  it('tags it out with a reason, clears it, and adds a photo', async () => {
    const manager = await createPerson(suite.server.db, { role: 'manager' });
    const item = await insertItem(suite.server.db, 'isolation-stand');
    const { context, page } = await newPage(suite.browser.browser, PHONE);
    try {
      await signInThroughUi(page, suite.server.baseUrl, manager.email, manager.password);
      await page.goto(`${suite.server.baseUrl}/gear/${item.id}`, { waitUntil: 'load' });
      await shown(page, 'item-tag-out').click();
      // The reason is required by the shared schema.
      await shown(page, 'tag-out-submit').click();
      await expect(shown(page, 'tag-out-reason-error').textContent()).resolves.toBe('Say why the item is out of service');
      await shown(page, 'tag-out-reason').fill('Surface tracking marks on the top plate');
      await shown(page, 'tag-out-submit').click();
      await shown(page, 'item-tagged-out').waitFor({ timeout: 15_000 });
      await expect(shown(page, 'item-status-reason').textContent()).resolves.toContain('Surface tracking marks on the top plate');
      expect(await suite.server.db('items').where({ id: item.id }).first('status')).toEqual({ status: 'out-of-service' });

      // Lockout/tagout: the tag stays on until an inspection passes after the tag-out, so the page
      // offers no "Put back in service" until then and says what to do instead.
      await expect(shown(page, 'item-clear-needs-inspection').textContent({ timeout: 15_000 })).resolves.toMatch(/first record an inspection that passes/);
      expect(await shown(page, 'item-clear').count()).toBe(0);
      expect(await suite.server.db('items').where({ id: item.id }).first('status')).toEqual({ status: 'out-of-service' });
      await page.goto(`${suite.server.baseUrl}/gear/${item.id}`, { waitUntil: 'load' });
      await shown(page, 'item-record-inspection').click();
      await shown(page, 'inspection-result-pass').click();
      await shown(page, 'inspection-notes').fill('Top plate cleaned and re-tested');
      await shown(page, 'inspection-submit').click();
      await shown(page, 'item-action-done').waitFor({ timeout: 15_000 });
      await shown(page, 'item-clear').click();
      await shown(page, 'clear-submit').click();
      await shown(page, 'item-tagged-out').waitFor({ state: 'detached', timeout: 15_000 });
      await expect(shown(page, 'item-status').textContent()).resolves.toMatch(/In service$/);

      const chooser = page.waitForEvent('filechooser');
      await shown(page, 'item-add-photo').click();
      await (await chooser).setFiles({ name: 'stand-top.png', mimeType: 'image/png', buffer: tinyPng() });
      await expect(shown(page, 'item-upload-done').textContent({ timeout: 15_000 })).resolves.toBe('Added stand-top.png.');
      await shown(page, 'item-photo').waitFor({ timeout: 15_000 });
      await expect(shown(page, 'item-files').textContent()).resolves.toContain('stand-top.png');
      await shown(page, 'item-history')
        .getByText(/added the file “stand-top\.png” to /)
        .waitFor({ timeout: 15_000 });
    } finally {
      await context.close();
    }
  });

  it('shows how far a photo upload has gone on a slow connection', async () => {
    const manager = await createPerson(suite.server.db, { role: 'manager' });
    const item = await insertItem(suite.server.db, 'probe');
    const { context, page } = await newPage(suite.browser.browser, PHONE);
    try {
      await signInThroughUi(page, suite.server.baseUrl, manager.email, manager.password);
      await page.goto(`${suite.server.baseUrl}/gear/${item.id}`, { waitUntil: 'load' });
      await shown(page, 'item-add-photo').waitFor({ timeout: 15_000 });
      // A phone on a weak lab Wi-Fi: about 1.5 MB goes out at 600 KB/s.
      const cdp = await context.newCDPSession(page);
      await cdp.send('Network.enable');
      await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 600 * 1024 });
      const chooser = page.waitForEvent('filechooser');
      await shown(page, 'item-add-photo').click();
      await (await chooser).setFiles({ name: 'probe-tip.png', mimeType: 'image/png', buffer: noisyPng(620) });

      const seen = new Set<number>();
      const progress = shown(page, 'item-upload-progress-text');
      await progress.waitFor({ timeout: 15_000 });
      while ((await progress.count()) > 0) {
        const text = await progress.textContent().catch(() => null);
        const percent = /(\d+) %$/.exec(text ?? '')?.[1];
        if (percent !== undefined) seen.add(Number(percent));
        if (seen.size === 3) await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'item-upload-progress-phone.png') }).catch(() => undefined);
        await page.waitForTimeout(100);
      }
      await expect(shown(page, 'item-upload-done').textContent({ timeout: 15_000 })).resolves.toBe('Added probe-tip.png.');
      // Seen part-way, rising: not only a spinner, and not a bar that jumps straight to the end.
      const inBetween = [...seen].filter((p) => p > 0 && p < 100);
      expect(inBetween.length).toBeGreaterThanOrEqual(2);
      expect(await progress.count()).toBe(0);
    } finally {
      await context.close();
    }
  });

  it('edits its ratings through the same form, with the limits of the shared schema', async () => {
    const manager = await createPerson(suite.server.db, { role: 'manager' });
    const item = await insertItem(suite.server.db, 'hv-supply');
    const { context, page } = await newPage(suite.browser.browser, PHONE);
    try {
      await signInThroughUi(page, suite.server.baseUrl, manager.email, manager.password);
      await page.goto(`${suite.server.baseUrl}/gear/${item.id}`, { waitUntil: 'load' });
      await shown(page, 'item-edit').click();
      await shown(page, 'item-form').waitFor({ timeout: 15_000 });
      await expect(shown(page, 'item-form-rating-maxKv').inputValue()).resolves.toBe('30');
      await shown(page, 'item-form-rating-maxKv').fill('1200');
      await shown(page, 'item-form-submit').click();
      await expect(shown(page, 'item-form-rating-maxKv-error').textContent()).resolves.toBe('At most 1000 kV');
      await shown(page, 'item-form-rating-maxKv').fill('45');
      await shown(page, 'item-form-location').fill('Kestrel Hall, cage 4');
      await shown(page, 'item-form-submit').click();
      await expect(shown(page, 'item-rated-kv').textContent({ timeout: 15_000 })).resolves.toBe('45 kV');
      await expect(shown(page, 'item-location').textContent()).resolves.toBe('Kept at Kestrel Hall, cage 4');
      expect(Number((await suite.server.db('items').where({ id: item.id }).first('rated_kv')).rated_kv)).toBe(45);
    } finally {
      await context.close();
    }
  });

  it('prints the labels picked on the labels screen as one sheet', async () => {
    const manager = await createPerson(suite.server.db, { role: 'manager' });
    const word = uniqueWord();
    const first = await insertItem(suite.server.db, 'probe');
    const second = await insertItem(suite.server.db, 'interlock');
    for (const item of [first, second]) await renameItem(suite.server.db, item.id, `Label ${word} ${item.tag}`);
    const { context, page } = await newPage(suite.browser.browser, PHONE);
    try {
      await signInThroughUi(page, suite.server.baseUrl, manager.email, manager.password);
      await page.goto(`${suite.server.baseUrl}/labels`, { waitUntil: 'load' });
      await shown(page, 'labels-search').fill(word);
      await shown(page, `labels-item-${second.id}`).click();
      await shown(page, `labels-item-${first.id}`).click();
      await expect(shown(page, 'labels-count').textContent()).resolves.toBe('2 labels on 1 sheet');
      const popup = context.waitForEvent('page');
      await shown(page, 'labels-print').click();
      const sheet = await popup;
      // In the order picked, so the sheet prints as the manager chose.
      expect(sheet.url()).toBe(`${suite.server.baseUrl}/api/labels.pdf?items=${second.id},${first.id}`);
    } finally {
      await context.close();
    }
  });
});

/** A 2x2 PNG, built in memory: the server checks uploads by their bytes, so it must be a real one. */
/** A square PNG of noise, which does not compress: about 4 × side² bytes. */
function noisyPng(side: number): Buffer {
  const png = new PNG({ width: side, height: side });
  let seed = 12345;
  for (let i = 0; i < png.data.length; i += 1) png.data[i] = (seed = (seed * 1103515245 + 12345) % 2 ** 31) >>> 23;
  return PNG.sync.write(png);
}

function tinyPng(): Buffer {
  const png = new PNG({ width: 2, height: 2 });
  png.data.fill(200);
  return PNG.sync.write(png);
}
