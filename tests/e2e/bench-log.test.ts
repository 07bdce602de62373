// The bench log at phone size: on a released booking the member taps "Add run", records a first
// point, then a second beyond the plan with an impossible thrust; both flags show as icon and
// word, the booking page names the run beyond the plan, the officers' e-mail is queued once, and
// a logger's CSV goes in through the mapping and preview. Charts load with their summaries.
import path from 'node:path';
import { PNG } from 'pngjs';
import type { Page } from 'playwright-core';
import { createBooking } from '../../server/services/booking-plans';
import { recordScan, submitChecklist } from '../../server/services/booking-counter';
import { releaseBooking } from '../../server/services/booking-release';
import type { ChecklistEntry } from '../../shared/schemas/bookings';
import { insertKit, plan, qualify, windowFromNow } from '../helpers/gear';
import { createPerson } from '../helpers/test-app';
import { e2eSuite, newPage, PHONE, SCREENSHOT_DIR, signInThroughUi, WIDE } from '../helpers/e2e';

const suite = e2eSuite();

function answers(entries: ChecklistEntry[]) {
  return entries
    .filter((e) => e.required)
    .map((e) => (e.kind === 'reading' ? { itemId: e.id, value: e.min ?? e.max ?? 0 } : { itemId: e.id, confirmed: true }));
}

async function releasedFor(member: { id: number; email: string; name: string }) {
  const who = { id: member.id, email: member.email, name: member.name, role: 'member' as const };
  const kit = await insertKit(suite.server.db);
  const mail = { publicUrl: suite.server.baseUrl };
  let booking = await createBooking(
    suite.server.db,
    who,
    {
      itemIds: kit.all.map((i) => i.id),
      ...windowFromNow(),
      location: 'Kestrel Hall, bay 2',
      purpose: 'Wire-to-mesh sweep',
      plan: plan(10, { maxCurrentMa: 0.5 }),
    } as never,
    mail,
  );
  for (const item of booking.items) booking = await recordScan(suite.server.db, who, booking.id, item.tag);
  booking = await submitChecklist(suite.server.db, who, booking.id, { phase: 'pre', answers: answers(booking.checklist.pre) });
  return releaseBooking(suite.server.db, who, booking.id);
}

async function fill(page: Page, testID: string, value: string) {
  await page.getByTestId(testID).fill(value);
}

it('records runs from the booking page, flags them in words, and imports a logger file', async () => {
  const member = await createPerson(suite.server.db, { role: 'member', name: 'Mirela Kestrel' });
  await qualify(suite.server.db, member.id, 20);
  const booking = await releasedFor(member);
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, member.email, member.password);
    await page.goto(`${suite.server.baseUrl}/bookings/${booking.id}`, { waitUntil: 'load' });
    await page.getByTestId('booking-add-run').click();
    await page.getByTestId('bench-log-screen').waitFor({ timeout: 20_000 });

    // The first point: everything typed, setup included.
    await fill(page, 'bench-run-form-kv', '8');
    await fill(page, 'bench-run-form-current', '0.1');
    await fill(page, 'bench-run-form-gap', '30');
    await fill(page, 'bench-run-form-temperature', '21');
    await fill(page, 'bench-run-form-pressure', '101.3');
    await page.getByTestId('bench-run-form-submit').click();
    await page.getByTestId('bench-run-1-no-flags').waitFor({ timeout: 15_000 });

    // The next point starts from the last: the setup folds away, two taps change the voltage.
    await page.getByTestId('bench-run-form-setup-summary').waitFor();
    await expect(page.getByTestId('bench-run-form-kv').inputValue()).resolves.toBe('8');
    // One tap at a time: each waits for the field to show its step before the next.
    for (const kv of ['9', '10', '11']) {
      await page.getByTestId('bench-run-form-kv-up').click();
      await page.waitForFunction((want) => (document.querySelector('[data-testid="bench-run-form-kv"]') as HTMLInputElement | null)?.value === want, kv, {
        timeout: 5_000,
      });
    }
    await expect(page.getByTestId('bench-run-form-kv').inputValue()).resolves.toBe('11');
    await page.getByTestId('bench-run-form-unit-ua').click();
    await expect(page.getByTestId('bench-run-form-current').inputValue()).resolves.toBe('100');
    await fill(page, 'bench-run-form-current', '200');
    await fill(page, 'bench-run-form-thrust', '60');
    // A photo of the setup goes with this point: taken through the same chooser as a checklist photo.
    const chooser = page.waitForEvent('filechooser');
    await page.getByTestId('bench-run-form-photo-photo').click();
    const photo = new PNG({ width: 40, height: 30 });
    for (let i = 0; i < photo.data.length; i += 4) photo.data.set([40, 90, 200, 255], i);
    await (await chooser).setFiles({ name: 'mesh-gap-30.png', mimeType: 'image/png', buffer: PNG.sync.write(photo) });
    await page.getByTestId('bench-run-form-photo-file-name').filter({ hasText: 'mesh-gap-30.png' }).waitFor({ timeout: 15_000 });
    await page.getByTestId('bench-run-form-submit').click();
    await page.getByTestId('bench-run-2-flag-above-plan-kv').waitFor({ timeout: 15_000 });
    await expect(page.getByTestId('bench-run-2-flag-above-plan-kv').textContent()).resolves.toContain('DANGER');
    await expect(page.getByTestId('bench-run-2-flag-thrust-above-ehd-bound').textContent()).resolves.toContain('Thrust above 1-D bound');
    await expect(page.getByTestId('bench-run-2').textContent()).resolves.toContain('200 µA');
    // The run names its photo, shown on the run; the next point starts without one.
    await page.getByTestId('bench-run-2-photo').waitFor();
    await expect(page.getByTestId('bench-run-form-photo-attached').count()).resolves.toBe(0);
    const stored = await suite.server
      .db('bench_runs')
      .where({ booking_id: booking.id })
      .orderBy('number')
      .select('current_ma', 'current_unit', 'temperature_c', 'photo_file_id');
    const [photoRow] = await suite.server.db('item_files').where({ booking_id: booking.id, file_name: 'mesh-gap-30.png' }).select('id');
    expect(photoRow).toBeDefined();
    expect(stored).toEqual([
      { current_ma: 0.1, current_unit: 'mA', temperature_c: 21, photo_file_id: null },
      { current_ma: 0.2, current_unit: 'uA', temperature_c: 21, photo_file_id: photoRow!.id },
    ]);
    const mails = await suite.server.db('outbox').where('dedupe_key', 'like', `bench-run-beyond-plan:${booking.id}:%`);
    expect(mails.length).toBe(Number((await suite.server.db('people').where({ role: 'officer', active: true }).count<{ n: number }[]>('id as n'))[0]!.n));

    await page.getByTestId('bench-chart-current-summary').waitFor({ timeout: 20_000 });
    await expect(page.getByTestId('bench-chart-current-summary').textContent()).resolves.toContain('Too few runs above onset');
    await page.getByTestId('bench-run-2').scrollIntoViewIfNeeded();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'bench-log-phone.png') });

    // The booking page names the run beyond the plan.
    await page.goto(`${suite.server.baseUrl}/bookings/${booking.id}`, { waitUntil: 'load' });
    await page.getByTestId('booking-run-beyond-2').waitFor({ timeout: 20_000 });
    await expect(page.getByTestId('booking-bench-log-count').textContent()).resolves.toBe('2 runs recorded, 1 flagged.');

    // A logger's file: mapping guessed from its headers, every row previewed, then imported.
    await page.goto(`${suite.server.baseUrl}/bookings/${booking.id}/runs-import`, { waitUntil: 'load' });
    await page.getByTestId('bench-import-screen').waitFor({ timeout: 20_000 });
    await fill(page, 'bench-import-text', 'kV,mA,gap (mm)\n7.5,0.029,30\n9,ten,30');
    await expect(page.getByTestId('bench-import-verdict').textContent()).resolves.toContain('1 of 2 rows cannot be read');
    await expect(page.getByTestId('bench-import-line-3').textContent()).resolves.toContain('"ten" is not a number');
    await expect(page.getByTestId('bench-import-submit').getAttribute('aria-disabled')).resolves.toBe('true');
    await fill(page, 'bench-import-text', 'kV,mA,gap (mm)\n7.5,0.029,30\n9,0.0756,30\n10,0.114,30\n9.5,0.095,30');
    await expect(page.getByTestId('bench-import-verdict').textContent()).resolves.toBe('4 rows ready to record, in file order.');
    await page.getByTestId('bench-import-submit').click();
    await page.getByTestId('bench-log-screen').waitFor({ timeout: 20_000 });
    await page.getByTestId('bench-run-6').waitFor({ timeout: 15_000 });
    await page.getByTestId('bench-fit-30-negative').waitFor({ timeout: 15_000 });
    await page.setViewportSize(WIDE);
    await page.getByTestId('bench-chart-current-svg').scrollIntoViewIfNeeded();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'bench-log-wide.png') });
  } finally {
    await context.close();
  }
});
