// Reporting an incident from an item page on a phone (issue 17 point 1): "Report a problem" opens
// the report with the item named, damage turns "take out of service" on, and the sent report
// says what was tagged out; the officer sees it in the queue and reviews it. Screens are checked
// with axe at 390 x 844 and 1280 x 800, light and dark, and screenshotted.
import path from 'node:path';
import type { Locator, Page } from 'playwright-core';
import { insertItem } from '../helpers/gear';
import { createPerson } from '../helpers/test-app';
import { e2eSuite, expectAccessible, newPage, PHONE, SCREENSHOT_DIR, signInThroughUi, WIDE } from '../helpers/e2e';

const suite = e2eSuite();

function shown(page: Page, testId: string): Locator {
  return page.getByTestId(testId).filter({ visible: true });
}

async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });
}

it('a member reports damage from an item page in a few taps; the item is tagged out and the officer reviews it', async () => {
  const member = await createPerson(suite.server.db, { role: 'member', name: 'Ines Moreau' });
  const officer = await createPerson(suite.server.db, { role: 'officer', name: 'Tomas Reyes' });
  const item = await insertItem(suite.server.db, 'probe');
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, member.email, member.password);
    await page.goto(`${suite.server.baseUrl}/gear/${item.id}`);
    await shown(page, 'item-screen').waitFor({ timeout: 20_000 });
    await shown(page, 'report-problem').click();
    await shown(page, 'report-incident-screen').waitFor({ timeout: 20_000 });
    await expectAccessible(page, 'report-incident');
    // The item from the page is already named (on the report itself: the item page stays mounted, hidden, below it).
    await shown(page, 'report-incident-screen').getByText(item.tag).filter({ visible: true }).first().waitFor({ timeout: 15_000 });

    // Nothing chosen yet: the shared schema asks for the kind and the severity.
    await shown(page, 'incident-submit').click();
    await page.getByText('Choose what kind of incident it was').waitFor();

    await shown(page, 'incident-kind-damage').click();
    // Damage turns "take out of service" on by default.
    await expect(shown(page, 'incident-tag-out').getAttribute('aria-checked')).resolves.toBe('true');
    await shown(page, 'incident-severity-moderate').click();
    await expect(shown(page, 'incident-severity-definition').textContent()).resolves.toContain('First aid only');
    await shown(page, 'severity-guide-toggle').click();
    await shown(page, 'severity-guide').waitFor();
    await shown(page, 'incident-description').fill('Probe body cracked when the stand tipped over');
    // The place comes from the item; the reporter can change it.
    await expect(shown(page, 'incident-location').inputValue()).resolves.toBe('Test bay');
    await shot(page, 'incident-report-phone-light');
    await shown(page, 'incident-submit').click();

    await shown(page, 'incident-sent').waitFor({ timeout: 20_000 });
    await expect(shown(page, 'incident-sent-tagged-out').textContent()).resolves.toContain(item.tag);
    await expectAccessible(page, 'incident');
    await shot(page, 'incident-sent-phone-light');

    const row = await suite.server.db('items').where({ id: item.id }).first('status');
    expect(row.status).toBe('out-of-service');
    const incident = await suite.server.db('incidents').where({ reported_by: member.id }).orderBy('id', 'desc').first();
    expect(incident).toMatchObject({ kind: 'damage', severity: 'moderate', status: 'open' });
    const mail = await suite.server.db('outbox').where({ kind: 'incident-reported', dedupe_key: `incident-reported:${incident.id}:${officer.id}` });
    expect(mail).toHaveLength(1);
  } finally {
    await context.close();
  }

  // The officer: the report waits on Today and in the queue; the review closes it only with a cause and an action.
  for (const [viewport, scheme, label] of [
    [PHONE, 'dark', 'phone-dark'],
    [WIDE, 'light', 'wide-light'],
  ] as const) {
    const { context: oc, page: op } = await newPage(suite.browser.browser, viewport, scheme);
    try {
      await signInThroughUi(op, suite.server.baseUrl, officer.email, officer.password);
      await shown(op, 'today-incidents').waitFor({ timeout: 20_000 });
      await op.goto(`${suite.server.baseUrl}/incidents`);
      await shown(op, 'incidents-screen').waitFor({ timeout: 20_000 });
      await shown(op, 'incidents-list').waitFor({ timeout: 15_000 });
      await expectAccessible(op, 'incidents');
      await shot(op, `incidents-queue-${label}`);
      if (label === 'phone-dark') {
        const first = op.locator('[data-testid^="incident-row-"]').filter({ visible: true }).first();
        await first.click();
        await shown(op, 'incident-review-form').waitFor({ timeout: 20_000 });
        await shown(op, 'review-status-closed').click();
        await shown(op, 'review-save').click();
        await shown(op, 'review-actions-error').waitFor();
        await shown(op, 'review-cause').fill('Stand placed on an uneven floor tile');
        await shown(op, 'review-add-action').click();
        await shown(op, 'review-action-0').fill('Level the bay floor and add stand feet');
        await op.getByRole('radio', { name: 'Tomas Reyes' }).filter({ visible: true }).first().click();
        await expectAccessible(op, 'incident-review');
        await shot(op, 'incident-review-phone-dark');
        await shown(op, 'review-save').click();
        // Closed: the review form gives way to the record of the review.
        await shown(op, 'incident-status').filter({ hasText: 'Closed' }).waitFor({ timeout: 15_000 });
        await op.getByText('Cause: Stand placed on an uneven floor tile').filter({ visible: true }).first().waitFor();
      }
    } finally {
      await oc.close();
    }
  }
}, 420_000);
