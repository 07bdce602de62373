// What the gate says before its last button, at phone size: a reading outside its limits is named
// with its line, value and limits (and the warning goes once it is answered with good readings);
// a booking for later is locked with "Opens at" on the lab's clock, never a UTC timestamp; a set
// the gate will refuse whatever is done at the counter (an overdue inspection, the wrong polarity)
// says why above "Request booking", and its page offers no "Go to release".
import path from 'node:path';
import type { Page } from 'playwright-core';
import { createBooking } from '../../server/services/booking-plans';
import { addDaysIso, todayIso } from '../../server/services/dates';
import { insertKit, qualify } from '../helpers/gear';
import { createPerson } from '../helpers/test-app';
import { e2eSuite, expectAccessible, newPage, PHONE, SCREENSHOT_DIR, signInThroughUi } from '../helpers/e2e';

const suite = e2eSuite();
const MAIL = {
  get publicUrl() {
    return suite.server.baseUrl;
  },
};
/** The app scrolls inside its own view: bring the part under test into the picture first. */
async function shot(page: Page, name: string, testId: string) {
  await page.getByTestId(testId).scrollIntoViewIfNeeded();
  await page.screenshot({ path: path.join(SCREENSHOT_DIR, `gate-${name}.png`) });
}

async function member() {
  const person = await createPerson(suite.server.db, { role: 'member', name: 'Odile Ferraby' });
  await qualify(suite.server.db, person.id, 60);
  return { person, actor: { id: person.id, email: person.email, name: person.name, role: 'member' as const } };
}

async function fillReadings(page: Page, reading: string) {
  const boxes = page.locator('[data-testid^="checklist-pre-"][role="checkbox"]');
  for (let i = 0; i < (await boxes.count()); i += 1) if ((await boxes.nth(i).getAttribute('aria-checked')) !== 'true') await boxes.nth(i).click();
  const inputs = page.locator('input[data-testid^="checklist-pre-"]');
  for (let i = 0; i < (await inputs.count()); i += 1) await inputs.nth(i).fill(reading);
}

it('names an out-of-limit reading with its line, value and limits, and clears it once answered with good readings', async () => {
  const { person, actor } = await member();
  const kit = await insertKit(suite.server.db);
  const now = new Date();
  const booking = await createBooking(
    suite.server.db,
    actor,
    {
      itemIds: kit.all.map((i) => i.id),
      startsAt: now.toISOString(),
      endsAt: new Date(now.getTime() + 2 * 3600_000).toISOString(),
      location: 'Bay 2',
      purpose: 'Bleeder check',
      plan: { plannedKv: 8, polarity: 'negative', maxCurrentMa: 0.5, peoplePresent: 2 },
    },
    MAIL,
  );
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, person.email, person.password);
    await page.goto(`${suite.server.baseUrl}/bookings/${booking.id}/release`, { waitUntil: 'load' });
    await page.getByTestId('release-step-scan').waitFor({ timeout: 20_000 });
    // The typed tag's button says what it does; its answer sits right under the field, and a
    // second scan of the same item says it was already ticked off.
    const first = kit.all[0]!;
    expect(await page.getByTestId('release-scanner-typed-submit').textContent()).toMatch(/Tick off$/);
    await page.getByTestId('release-scanner-typed-input').fill(first.tag);
    await page.getByTestId('release-scanner-typed-submit').click();
    await page.getByTestId(`scan-item-${first.id}-scanned`).waitFor({ timeout: 15_000 });
    await page.getByTestId('release-scanner-typed-input').fill(first.tag);
    await page.getByTestId('release-scanner-typed-submit').click();
    // (The badge's text starts with its icon's glyph.)
    await expect(page.getByTestId('release-scan-ok').textContent({ timeout: 15_000 })).resolves.toMatch(
      new RegExp(`${first.tag} was already ticked off\\. ${kit.all.length - 1} still to scan\\.$`),
    );
    const field = await page.getByTestId('release-scanner-typed-input').boundingBox();
    const answer = await page.getByTestId('release-scan-ok').boundingBox();
    expect(answer!.y).toBeGreaterThan(field!.y);
    expect(answer!.y - (field!.y + field!.height)).toBeLessThan(120);
    for (const item of kit.all.slice(1)) {
      await page.getByTestId('release-scanner-typed-input').fill(item.tag);
      await page.getByTestId('release-scanner-typed-submit').click();
      await page.getByTestId(`scan-item-${item.id}-scanned`).waitFor({ timeout: 15_000 });
    }
    await fillReadings(page, '5');
    await page.getByTestId('release-checklist-submit').click();
    await page.getByTestId('release-checklist-outside').waitFor({ timeout: 15_000 });
    const named = await page.getByTestId('release-checklist-outside').textContent();
    expect(named).toContain('“Bleeder resistance measured at the output (supply off).” read 5 MΩ, outside 10 to 2000 MΩ.');
    // Step 2 is not "Done" while a reading is outside its limits, and release waits.
    await page.getByTestId('release-step-checklist-state-current').waitFor();
    await page.getByTestId('release-check-checklist').waitFor({ timeout: 15_000 });
    expect(await page.getByTestId('release-submit').isDisabled()).toBe(true);
    await expectAccessible(page, 'release-reading-outside');
    await shot(page, 'reading-outside', 'release-checklist-outside');

    await page.getByTestId('release-checklist-again').click();
    await fillReadings(page, '300');
    await page.getByTestId('release-checklist-submit').click();
    await page.getByTestId('release-step-checklist-state-done').waitFor({ timeout: 15_000 });
    await page.getByTestId('release-check-clear').waitFor({ timeout: 15_000 });
    expect(await page.getByTestId('release-checklist-outside').count()).toBe(0);
    expect(await page.getByTestId('release-check-checklist').count()).toBe(0);
    expect(await page.getByTestId('release-submit').isDisabled()).toBe(false);
  } finally {
    await context.close();
  }
});

it('locks a booking for tomorrow with "Opens at" on the lab clock, and offers neither scanning nor the checklist', async () => {
  const { person, actor } = await member();
  const kit = await insertKit(suite.server.db);
  const start = new Date(Date.now() + 26 * 3600_000);
  const booking = await createBooking(
    suite.server.db,
    actor,
    {
      itemIds: kit.all.map((i) => i.id),
      startsAt: start.toISOString(),
      endsAt: new Date(start.getTime() + 2 * 3600_000).toISOString(),
      location: 'Bay 2',
      purpose: 'Tomorrow',
      plan: { plannedKv: 8, polarity: 'negative', maxCurrentMa: 0.5, peoplePresent: 2 },
    },
    MAIL,
  );
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, person.email, person.password);
    await page.goto(`${suite.server.baseUrl}/bookings/${booking.id}/release`, { waitUntil: 'load' });
    await page.getByTestId('release-locked').waitFor({ timeout: 20_000 });
    const opens = (await page.getByTestId('release-opens-at').textContent()) ?? '';
    expect(opens).toMatch(/^Opens at \d{2}:\d{2} on \w{3} \d{1,2} \w{3} \d{4} \(.+ time\)$/);
    // The lab clock of the test server: LAB_TIME_ZONE, else the server's own zone.
    const zone = process.env.LAB_TIME_ZONE || Intl.DateTimeFormat().resolvedOptions().timeZone;
    expect(opens).toContain(`(${zone} time)`);
    expect(await page.getByTestId('release-screen').textContent()).not.toMatch(/\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/);
    expect(await page.getByTestId('release-scanner-typed-input').count()).toBe(0);
    expect(await page.getByTestId('release-checklist-submit').count()).toBe(0);
    expect(await page.getByTestId('release-submit').count()).toBe(0);
    await expectAccessible(page, 'release-locked');
    await shot(page, 'locked', 'release-locked');
    // The booking's page says when the counter opens it, on the same clock.
    await page.goto(`${suite.server.baseUrl}/bookings/${booking.id}`, { waitUntil: 'load' });
    await page.waitForFunction(() => /opens it at/.test(document.querySelector('[data-testid="booking-next-step-text"]')?.textContent ?? ''), undefined, {
      timeout: 20_000,
    });
    expect(await page.getByTestId('booking-next-step-text').textContent()).toMatch(/opens it at \d{2}:\d{2} on .+ time\)\.$/);
  } finally {
    await context.close();
  }
});

it('says why a set can never be released above "Request booking", and its page offers no "Go to release"', async () => {
  const { person } = await member();
  const kit = await insertKit(suite.server.db);
  // The supply's inspection ran out yesterday; it is negative only and the plan will be positive.
  await suite.server
    .db('items')
    .where({ id: kit.supply.id })
    .update({ next_inspection_due: addDaysIso(todayIso(), -1) });
  const items = (await suite.server
    .db('items')
    .whereIn(
      'id',
      kit.all.map((i) => i.id),
    )
    .select('id', 'tag', 'name')) as { id: number; tag: string; name: string }[];
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, person.email, person.password);
    await page.goto(`${suite.server.baseUrl}/bookings/new`, { waitUntil: 'load' });
    await page.getByTestId('book-screen').waitFor({ timeout: 20_000 });
    for (const item of items) {
      await page.getByTestId('item-search').fill(item.name.split(' ')[0]!);
      await page.getByTestId(`pick-item-${item.id}`).click({ timeout: 15_000 });
      await page.getByTestId(`picked-item-${item.id}`).waitFor();
    }
    await page.getByTestId('book-location').fill('Bay 1');
    await page.getByTestId('book-purpose').fill('Positive corona sweep');
    await page.getByTestId('book-planned-kv').fill('8');
    await page.getByTestId('book-polarity-positive').click();
    await page.getByTestId('book-max-current').fill('0.5');
    await page.getByTestId('book-people').fill('2');

    await page.getByTestId('book-gate-inspection-fail').waitFor({ timeout: 20_000 });
    await page.getByTestId('book-gate-polarity-fail').waitFor();
    await page.getByTestId('book-gate-rating-pass').waitFor();
    await page.getByTestId('book-gate-companions-pass').waitFor();
    await page.getByTestId('book-gate-clash-pass').waitFor({ timeout: 15_000 });
    expect(await page.getByTestId('book-gate-inspection-fail').textContent()).toContain(items.find((i) => i.id === kit.supply.id)!.tag);
    expect(await page.getByTestId('book-gate-verdict').textContent()).toContain('The release will refuse this set');
    // On a phone the warnings sit above the button.
    const warning = await page.getByTestId('book-gate').boundingBox();
    const button = await page.getByTestId('book-submit').boundingBox();
    expect(warning!.y + warning!.height).toBeLessThanOrEqual(button!.y);
    await expectAccessible(page, 'book-gate-failing');
    await shot(page, 'book-refused-gear', 'book-gate');

    await page.getByTestId('book-submit').click();
    await page.getByTestId('booking-screen').waitFor({ timeout: 20_000 });
    await page.getByTestId('booking-blocked').waitFor({ timeout: 20_000 });
    await page.getByTestId('booking-blocked-inspection').waitFor();
    await page.getByTestId('booking-blocked-polarity').waitFor();
    expect(await page.getByTestId('booking-go-release').count()).toBe(0);
    expect(await page.getByTestId('booking-next-step-text').textContent()).toContain('cannot be released as it stands');
    await expectAccessible(page, 'booking-blocked');
    await shot(page, 'booking-blocked', 'booking-blocked');
  } finally {
    await context.close();
  }
});
