// A photo line at the counter, at phone size: an officer adds a required photo line to the
// pre-energize checklist (for sets holding an "other" item, which no other suite books), and a
// member answers it by taking a photo through the file input, then releases.
import path from 'node:path';
import { PNG } from 'pngjs';
import type { Page } from 'playwright-core';
import { createBooking } from '../../server/services/booking-plans';
import { KIND_LABELS } from '../../shared/schemas/items';
import { insertItem, insertKit, plan, qualify, windowFromNow } from '../helpers/gear';
import { createPerson } from '../helpers/test-app';
import { e2eSuite, newPage, PHONE, SCREENSHOT_DIR, signInThroughUi, WIDE, expectAccessible } from '../helpers/e2e';

const suite = e2eSuite();

function barrierPng(): Buffer {
  const png = new PNG({ width: 48, height: 36 });
  for (let i = 0; i < png.data.length; i += 4) png.data.set([230, 160, 20, 255], i);
  return PNG.sync.write(png);
}

async function addRequiredPhotoLine(officer: { email: string; password: string }, text: string): Promise<number> {
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, officer.email, officer.password);
    await page.goto(`${suite.server.baseUrl}/lab-rules`, { waitUntil: 'load' });
    await page.getByTestId('checklist-line-form').waitFor({ timeout: 20_000 });
    await page.getByTestId('checklist-line-kind').getByText('Photo', { exact: true }).click();
    await page.getByTestId('checklist-line-text').fill(text);
    await page.getByTestId('checklist-line-with-kind').getByText(KIND_LABELS.other, { exact: true }).click();
    await page.getByTestId('checklist-line-submit').click();
    await page.getByTestId('checklist-line-added').waitFor({ timeout: 15_000 });
  } finally {
    await context.close();
  }
  const row = await suite.server.db('checklist_templates').where({ text, active: true }).first();
  expect(row).toMatchObject({ kind: 'photo', phase: 'pre', applies_with_kind: 'other' });
  expect(Boolean(row.required)).toBe(true);
  return row.id as number;
}

async function answerConfirmationsAndReadings(page: Page): Promise<void> {
  const boxes = page.locator('[data-testid^="checklist-pre-"][role="checkbox"]');
  for (let i = 0; i < (await boxes.count()); i += 1) {
    if ((await boxes.nth(i).getAttribute('aria-checked')) !== 'true') await boxes.nth(i).click();
  }
  const inputs = page.locator('input[data-testid^="checklist-pre-"]');
  for (let i = 0; i < (await inputs.count()); i += 1) await inputs.nth(i).fill('300');
}

async function attachPhoto(page: Page, lineTestId: string, name: string): Promise<void> {
  const chooser = page.waitForEvent('filechooser');
  await page.getByTestId(`${lineTestId}-photo`).click();
  const opened = await chooser;
  // The phone's camera opens from the same input: an image chooser asking for the rear camera.
  expect(await opened.element().evaluate((el) => [(el as Element).getAttribute('accept'), (el as Element).getAttribute('capture')])).toEqual([
    'image/*',
    'environment',
  ]);
  await opened.setFiles({ name, mimeType: 'image/png', buffer: barrierPng() });
  // Once stored, the line names the file it holds (a replacement's name replaces the first one).
  await page.getByTestId(`${lineTestId}-file-name`).filter({ hasText: name }).waitFor({ timeout: 15_000 });
}

it('completes an officer-added required photo line by attaching a PNG, then releases', async () => {
  const officer = await createPerson(suite.server.db, { role: 'officer' });
  const member = await createPerson(suite.server.db, { role: 'member', name: 'Ines Kestrel' });
  await qualify(suite.server.db, member.id, 20);
  const text = `Photo of the barrier and ground hook ${Date.now()}`;
  const lineId = await addRequiredPhotoLine(officer, text);
  try {
    const kit = await insertKit(suite.server.db);
    const rig = await insertItem(suite.server.db, 'other', { ratings: { maxKv: 40 } });
    const booking = await createBooking(
      suite.server.db,
      { id: member.id, email: member.email, name: 'Ines Kestrel', role: 'member' },
      {
        itemIds: [...kit.all.map((i) => i.id), rig.id],
        ...windowFromNow(),
        location: 'Bay 4',
        purpose: 'Surface flashover on the stand',
        plan: plan(10),
      } as never,
      { publicUrl: suite.server.baseUrl },
    );
    expect(booking.checklist.pre.some((e) => e.id === lineId && e.required && e.kind === 'photo')).toBe(true);

    const { context, page } = await newPage(suite.browser.browser, PHONE);
    try {
      await signInThroughUi(page, suite.server.baseUrl, member.email, member.password);
      await page.goto(`${suite.server.baseUrl}/bookings/${booking.id}/release`, { waitUntil: 'load' });
      await page.getByTestId('release-screen').waitFor({ timeout: 20_000 });
      await expectAccessible(page, 'release');
      for (const item of booking.items) {
        await page.getByTestId('release-scanner-typed-input').fill(item.tag);
        await page.getByTestId('release-scanner-typed-submit').click();
        await page.getByTestId(`scan-item-${item.id}-scanned`).waitFor({ timeout: 15_000 });
      }
      await page.getByTestId('release-step-scan-state-done').waitFor();

      // Without the photo the server names the line, and nothing is recorded.
      const line = `checklist-pre-${lineId}`;
      await answerConfirmationsAndReadings(page);
      await page.getByTestId('release-checklist-submit').click();
      await page.getByTestId(line).getByText(`Attach the photo: ${text}`).waitFor({ timeout: 15_000 });
      expect(await suite.server.db('checklist_runs').where({ booking_id: booking.id })).toHaveLength(0);

      // Every photo line on this checklist gets one (a parallel suite may have added its own).
      const photoLines = await page
        .locator('[data-testid^="checklist-pre-"][data-testid$="-photo"]')
        .evaluateAll((els: Element[]) => els.map((el) => el.getAttribute('data-testid')!.replace(/-photo$/, '')));
      expect(photoLines).toContain(line);
      for (const id of photoLines) await attachPhoto(page, id, 'barrier-first.png');
      // Answering the line the server named takes its message (and the summary) away.
      await page.getByTestId(line).getByText(`Attach the photo: ${text}`).waitFor({ state: 'detached' });
      await page.getByTestId('release-checklist-error').waitFor({ state: 'detached' });
      // Replacing: the newer photo is the one the answer names.
      await expect(page.getByTestId(`${line}-photo`).textContent()).resolves.toContain('Replace the photo');
      await attachPhoto(page, line, 'barrier-ground-hook.png');
      await expect(page.getByTestId(`${line}-file-name`).textContent()).resolves.toBe('barrier-ground-hook.png');
      const lastPhoto = await suite.server.db('item_files').where({ booking_id: booking.id, file_name: 'barrier-ground-hook.png' }).first('id');

      await page.getByTestId(line).scrollIntoViewIfNeeded();
      await page.waitForFunction((id) => {
        const img = document.querySelector(`[data-testid="${id}-attached"] img`) as HTMLImageElement | null;
        return img === null || (img.complete && img.naturalWidth > 0);
      }, line);
      // What the member sees: the viewport with the photo line in it, at phone and desktop width.
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'checklist-photo-phone.png') });
      await page.setViewportSize(WIDE);
      await page.getByTestId(line).scrollIntoViewIfNeeded();
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'checklist-photo-wide.png') });
      await page.setViewportSize(PHONE);

      await page.getByTestId('release-checklist-submit').click();
      await page.getByTestId('release-checklist-done').waitFor({ timeout: 15_000 });
      const run = await suite.server.db('checklist_runs').where({ booking_id: booking.id, phase: 'pre' }).first('answers');
      const answers = (typeof run.answers === 'string' ? JSON.parse(run.answers) : run.answers) as { id: number; fileId?: number }[];
      expect(answers.find((a) => a.id === lineId)?.fileId).toBe(lastPhoto.id);

      await page.getByTestId('release-submit').click();
      await page.getByTestId('release-done').waitFor({ timeout: 15_000 });
      await expect(page.getByTestId('release-done-caution').textContent()).resolves.toContain('licensed practice');
      expect((await suite.server.db('bookings').where({ id: booking.id }).first('status')).status).toBe('released');

      // The booking's page keeps the checklist as answered: who, the photo itself, the readings.
      const runId = (await suite.server.db('checklist_runs').where({ booking_id: booking.id, phase: 'pre' }).first('id')).id as number;
      await page.goto(`${suite.server.baseUrl}/bookings/${booking.id}`, { waitUntil: 'load' });
      const record = page.getByTestId(`checklist-run-${runId}`);
      await record.waitFor({ timeout: 20_000 });
      await expect(record.textContent()).resolves.toContain('Ines Kestrel');
      await expect(page.getByTestId(`checklist-run-${runId}-line-${lineId}-answer`).textContent()).resolves.toBe('Photo taken');
      const photoLink = page.getByTestId(`checklist-run-${runId}-line-${lineId}-photo`);
      await expect(photoLink.getAttribute('href')).resolves.toBe(`/api/files/${lastPhoto.id}`);
      // The wide layout lays the page out anew (two columns), so the photo is found again there.
      const photoShown = async () => {
        await page.waitForFunction((id) => {
          const img = document.querySelector(`[data-testid="${id}"] img`) as HTMLImageElement | null;
          return img !== null && img.complete && img.naturalWidth > 0;
        }, `checklist-run-${runId}-line-${lineId}-photo`);
        // The page may draw the record again as its queries refresh: scroll to it as it is then.
        await page.waitForFunction((id) => {
          const link = document.querySelector(`[data-testid="${id}"]`);
          link?.scrollIntoView({ block: 'center' });
          return link !== null && link.isConnected;
        }, `checklist-run-${runId}-line-${lineId}-photo`);
      };
      await photoShown();
      await page.getByTestId('booking-checklist-runs').evaluate((el) => el.scrollIntoView({ block: 'start' }));
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'checklist-record-phone.png') });
      await page.setViewportSize(WIDE);
      await photoShown();
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'checklist-record-wide.png') });
    } finally {
      await context.close();
    }
  } finally {
    await suite.server.db('checklist_templates').where({ id: lineId }).update({ active: false });
  }
});
