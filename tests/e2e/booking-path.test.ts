// The safety gate end to end at phone size, through the real screens: a member books a 25 kV test
// (above the lab's approval voltage and their own 20 kV qualification), an officer approves it in
// the queue, the member releases it at the counter (typed tags, pre-energize checklist) and returns
// it with the make-safe checklist. Refusals along the way must name their rules.
import path from 'node:path';
import type { Page } from 'playwright-core';
import { insertItem, insertKit, qualify } from '../helpers/gear';
import { createPerson } from '../helpers/test-app';
import { e2eSuite, newPage, PHONE, SCREENSHOT_DIR, signInThroughUi, expectAccessible } from '../helpers/e2e';

const suite = e2eSuite();

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOT_DIR, `booking-path-${name}.png`), fullPage: true });

async function statusInDb(id: number): Promise<string> {
  const row = await suite.server.db('bookings').where({ id }).first('status');
  return row.status as string;
}

/** Ticks every confirmation of a checklist and types `reading` into every numeric line. */
async function answerChecklist(page: Page, prefix: string, reading: string): Promise<number> {
  const boxes = page.locator(`[data-testid^="${prefix}-"][role="checkbox"]`);
  const count = await boxes.count();
  for (let i = 0; i < count; i += 1) {
    const box = boxes.nth(i);
    if ((await box.getAttribute('aria-checked')) !== 'true') await box.click();
  }
  const inputs = page.locator(`input[data-testid^="${prefix}-"]`);
  for (let i = 0; i < (await inputs.count()); i += 1) await inputs.nth(i).fill(reading);
  return count;
}

it('books above the approval voltage, gets approved, releases at the counter and returns made safe', async () => {
  const member = await createPerson(suite.server.db, { role: 'member', name: 'Ines Kestrel' });
  const officer = await createPerson(suite.server.db, { role: 'officer', name: 'Tomas Orrin' });
  await qualify(suite.server.db, member.id, 20);
  const kit = await insertKit(suite.server.db);
  const stray = await insertItem(suite.server.db, 'probe');
  const items = (await suite.server
    .db('items')
    .whereIn(
      'id',
      kit.all.map((i) => i.id),
    )
    .select('id', 'tag', 'name')) as { id: number; tag: string; name: string }[];

  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    // --- Book -------------------------------------------------------------------------------
    await signInThroughUi(page, suite.server.baseUrl, member.email, member.password);
    await page.getByTestId('nav-bookings').click();
    await page.getByTestId('bookings-screen').waitFor();
    await expectAccessible(page, 'bookings');
    await page.getByTestId('bookings-new').click();
    await page.getByTestId('book-screen').waitFor();
    await expectAccessible(page, 'book');

    for (const item of items) {
      // Each test item's name starts with its own unique word.
      await page.getByTestId('item-search').fill(item.name.split(' ')[0]!);
      await page.getByTestId(`pick-item-${item.id}`).click({ timeout: 15_000 });
      await page.getByTestId(`picked-item-${item.id}`).waitFor();
    }
    for (const item of items) await page.getByTestId(`availability-${item.id}-free`).waitFor({ timeout: 15_000 });

    await page.getByTestId('book-location').fill('Bay 1 (interlocked cage)');
    await page.getByTestId('book-purpose').fill('Corona onset on a 0.2 mm wire, negative polarity');
    await page.getByTestId('book-planned-kv').fill('25');
    await page.getByTestId('book-polarity-negative').click();
    await page.getByTestId('book-max-current').fill('1');
    await page.getByTestId('book-people').fill('2');

    // The live assessment agrees with the rules before anything is sent.
    await page.getByTestId('live-assessment-panel-approval-required').waitFor({ timeout: 15_000 });
    await page.getByTestId('live-assessment-panel-approval-reason-planned-kv').waitFor();
    await page.getByTestId('live-assessment-panel-approval-reason-qualification').waitFor();
    expect(await page.getByTestId('live-assessment-panel-hazard-badge').textContent()).toMatch(/DANGER/);
    expect(await page.getByTestId('live-assessment-panel-energy-stored-value').textContent()).toMatch(/J$/);
    expect(await page.getByTestId('live-assessment-panel-boundaries-barrier-value').textContent()).toMatch(/\d m \(\d+ ft/);
    await expect(page.getByTestId('live-assessment-panel-caution').textContent()).resolves.toContain('licensed practice');
    await shot(page, '1-book');

    await page.getByTestId('book-submit').click();
    await page.getByTestId('booking-screen').waitFor({ timeout: 15_000 });
    await expectAccessible(page, 'booking');
    await page.getByTestId('booking-status-awaiting-approval').waitFor();
    const bookingId = Number(/\/bookings\/(\d+)/.exec(page.url())?.[1]);
    expect(bookingId).toBeGreaterThan(0);
    // The stored assessment (the server's) is what the booking shows now.
    await page.getByTestId('stored-assessment-approval-required').waitFor();
    expect(await statusInDb(bookingId)).toBe('awaiting-approval');

    // --- Approve (the officer, in a second browser context) ---------------------------------
    const officerPage = await newPage(suite.browser.browser, PHONE);
    try {
      const o = officerPage.page;
      await signInThroughUi(o, suite.server.baseUrl, officer.email, officer.password);
      await o.goto(`${suite.server.baseUrl}/approvals`, { waitUntil: 'load' });
      await o.getByTestId('approvals-screen').waitFor();
      await expectAccessible(o, 'approvals');
      await o.getByTestId(`approval-${bookingId}`).waitFor({ timeout: 15_000 });
      await o.getByTestId(`approval-${bookingId}-assessment-approval-reason-planned-kv`).waitFor({ timeout: 15_000 });
      if ((await o.getByTestId(`approval-${bookingId}-form`).count()) === 0) await o.getByTestId(`approval-${bookingId}-review`).click();
      await o.getByTestId(`approval-${bookingId}-conditions`).fill('Second person from the group at the emergency stop; barrier at the marked line.');
      await shot(o, '2-approve');
      await o.getByTestId(`approval-${bookingId}-approve`).click();
      // One more press names the decision before it binds the plan.
      await o.getByTestId(`approval-${bookingId}-confirm-yes`).click();
      await o.getByTestId('approvals-last-decision').waitFor({ timeout: 15_000 });
      expect(await o.getByTestId(`approval-${bookingId}`).count()).toBe(0);
    } finally {
      await officerPage.context.close();
    }
    expect(await statusInDb(bookingId)).toBe('approved');

    // --- Release ------------------------------------------------------------------------------
    await page.reload({ waitUntil: 'load' });
    await page.getByTestId('booking-status-approved').waitFor({ timeout: 15_000 });
    expect(await page.getByTestId('booking-approval-conditions').textContent()).toContain('emergency stop');
    await page.getByTestId('booking-go-release').click();
    await page.getByTestId('release-screen').waitFor();
    await expectAccessible(page, 'release');

    // Before scanning and the checklist, the release step says what stands in the way, naming
    // each rule, and the button waits.
    await page.getByTestId('release-check').waitFor({ timeout: 15_000 });
    await page.getByTestId('release-check-scanned').waitFor();
    await page.getByTestId('release-check-checklist').waitFor();
    expect(await page.getByTestId('release-check').textContent()).toContain('Scan every item at the counter.');
    expect(await page.getByTestId('release-submit').isDisabled()).toBe(true);
    await shot(page, '3-release-refused');
    expect(await statusInDb(bookingId)).toBe('approved');

    // A tag that is not in the booking is refused with the server's words.
    await page.getByTestId('release-scanner-typed-input').fill(stray.tag);
    await page.getByTestId('release-scanner-typed-submit').click();
    await expect(page.getByTestId('release-scan-error').textContent({ timeout: 15_000 })).resolves.toContain('not part of this booking');

    for (const item of items) {
      await page.getByTestId(`scan-item-${item.id}-pending`).waitFor();
      await page.getByTestId('release-scanner-typed-input').fill(item.tag);
      await page.getByTestId('release-scanner-typed-submit').click();
      await page.getByTestId(`scan-item-${item.id}-scanned`).waitFor({ timeout: 15_000 });
    }
    await page.getByTestId('release-step-scan-state-done').waitFor();

    const confirmed = await answerChecklist(page, 'checklist-pre', '300');
    expect(confirmed).toBeGreaterThan(3);
    await page.getByTestId('release-checklist-submit').click();
    await page.getByTestId('release-checklist-done').waitFor({ timeout: 15_000 });

    await page.getByTestId('release-check-clear').waitFor({ timeout: 15_000 });
    await page.getByTestId('release-submit').click();
    await page.getByTestId('release-done').waitFor({ timeout: 15_000 });
    expect(await page.getByTestId('release-done-barrier-value').textContent()).toMatch(/\d m \(\d+ ft/);
    expect(await page.getByTestId('release-done-bleed-value').textContent()).toMatch(/s$/);
    await expect(page.getByTestId('release-done-caution').textContent()).resolves.toContain('licensed practice');
    await shot(page, '4-released');
    expect(await statusInDb(bookingId)).toBe('released');

    // --- Return -------------------------------------------------------------------------------
    await page.getByTestId('release-go-return').click();
    await page.getByTestId('return-screen').waitFor();
    await expectAccessible(page, 'return');
    await page.getByTestId('return-bleed').waitFor();

    // A residual voltage above the lab's 50 V is refused, and the screen says why.
    await answerChecklist(page, 'checklist-return', '120');
    await page.getByTestId('return-submit').click();
    await page.getByTestId('return-failures').waitFor({ timeout: 15_000 });
    await page.getByTestId('return-failures-make-safe-checklist').waitFor();
    expect(await statusInDb(bookingId)).toBe('released');

    await answerChecklist(page, 'checklist-return', '12');
    await page.getByTestId('return-submit').click();
    await page.getByTestId('return-done').waitFor({ timeout: 15_000 });
    await page.getByTestId('return-status-returned').waitFor();
    await shot(page, '5-returned');
    expect(await statusInDb(bookingId)).toBe('returned');
    const run = await suite.server.db('checklist_runs').where({ booking_id: bookingId, phase: 'return' }).orderBy('id', 'desc').first('within_limits');
    expect(Boolean(run.within_limits)).toBe(true);
  } catch (error) {
    // The screen as it was when a step failed, beside the other screenshots.
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'booking-path-failure.png') });
    throw error;
  } finally {
    await context.close();
  }
}, 180_000);
