// At the phone viewport: an officer's Today opens with the lab's desk (never-inspected gear
// counted), the hazard legend is one press away, and the audit trail reads in sentences that
// link to their item and can be searched by tag and person.
import path from 'node:path';
import { insertItem } from '../helpers/gear';
import { createPerson } from '../helpers/test-app';
import { e2eSuite, expectAccessible, newPage, PHONE, SCREENSHOT_DIR, signInThroughUi } from '../helpers/e2e';

const suite = e2eSuite();

it('an officer sees the lab desk on Today and the legend behind its button', async () => {
  const officer = await createPerson(suite.server.db, { role: 'officer', name: 'Petra Vasquez-Lind' });
  await insertItem(suite.server.db, 'probe', { nextDue: null });
  await insertItem(suite.server.db, 'grounding-stick', { status: 'out-of-service' });
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, officer.email, officer.password);
    const desk = page.getByTestId('today-desk');
    await desk.waitFor({ timeout: 15_000 });
    await expect(page.getByTestId('today-desk-inspections').textContent({ timeout: 15_000 })).resolves.toMatch(/Inspections: \d+ never inspected/);
    await expect(page.getByTestId('today-desk-tagged-out').textContent()).resolves.toMatch(/\d+ items? tagged out of service/);
    // The approvals card says its count once, in words.
    await expect(page.getByTestId('today-approvals-link').textContent()).resolves.toMatch(/(No test waiting for you|\d+\+? tests? waiting for your decision)/);
    expect(await page.getByTestId('today-legend').count()).toBe(0);
    await page.getByTestId('today-legend-toggle').click();
    await page.getByTestId('today-legend').waitFor();
    await expectAccessible(page, 'today with the legend open');
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'today-officer-desk-phone.png'), fullPage: true });
  } finally {
    await context.close();
  }
});

it('the audit trail reads in sentences, links to the item and is searched by tag and person', async () => {
  const manager = await createPerson(suite.server.db, { role: 'manager', name: 'Hollis Quarrie' });
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, manager.email, manager.password);
    // Make an entry through the app: register nothing new, just retire a test item via the API.
    const item = await insertItem(suite.server.db, 'probe');
    const csrf = await page.evaluate(async () => (await (await fetch('/api/session')).json()).csrfToken as string);
    const retired = await page.evaluate(
      async ([id, token]) =>
        (
          await fetch(`/api/items/${id}`, {
            method: 'PATCH',
            headers: { 'content-type': 'application/json', 'x-csrf-token': token },
            body: JSON.stringify({ status: 'retired', statusReason: 'Cracked probe body' }),
          })
        ).status,
      [item.id, csrf] as const,
    );
    expect(retired).toBe(200);

    await page.goto(`${suite.server.baseUrl}/audit`, { waitUntil: 'load' });
    await page.getByTestId('audit-screen').waitFor({ timeout: 15_000 });
    await page.getByTestId('audit-tag').fill(item.tag);
    const sentence = page.getByText(`Hollis Quarrie retired ${item.tag}`, { exact: false });
    await sentence.waitFor({ timeout: 15_000 });
    await expect(page.getByTestId('audit-list').textContent()).resolves.not.toMatch(/item\.retired|\{"/);
    await expectAccessible(page, 'audit searched by tag');
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'audit-search-phone.png'), fullPage: true });

    // Searching by a person who did nothing to this item empties the list.
    await page.getByTestId('audit-person').fill('Nobody Atall');
    await page.getByTestId('audit-empty').waitFor({ timeout: 15_000 });
    await page.getByTestId('audit-person').fill('Hollis');
    await sentence.waitFor({ timeout: 15_000 });

    // A typed day that is not a day is said on the field, in words.
    await page.getByTestId('audit-day').fill('2026-02-30');
    await page.getByText('Type a real day as YYYY-MM-DD').waitFor();
    await page.getByTestId('audit-day').fill('');

    // The entry opens its item.
    await page.getByRole('link', { name: `Open ${item.tag}` }).click();
    await page.getByTestId('item-screen').waitFor({ timeout: 15_000 });
    expect(page.url()).toContain(`/gear/${item.id}`);
    await page.getByTestId('item-history').getByText(`Hollis Quarrie retired ${item.tag}`, { exact: false }).waitFor({ timeout: 15_000 });
  } finally {
    await context.close();
  }
});

it('says why a page is closed to a member, and offers no "Try again" for a booking that does not exist', async () => {
  const member = await createPerson(suite.server.db, { role: 'member', name: 'Juno Abernethy' });
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, member.email, member.password);
    await page.goto(`${suite.server.baseUrl}/people`, { waitUntil: 'load' });
    await page.getByTestId('not-found-role').waitFor({ timeout: 15_000 });
    await expect(page.getByTestId('not-found-role').textContent()).resolves.toMatch(/This page is for lab managers.*signed in as a member/);
    expect(await page.getByTestId('people-screen').count()).toBe(0);
    await expectAccessible(page, 'not-found for a role');

    await page.goto(`${suite.server.baseUrl}/no/such/page`, { waitUntil: 'load' });
    await page.getByTestId('not-found-nothing').waitFor({ timeout: 15_000 });

    await page.goto(`${suite.server.baseUrl}/bookings/987654321`, { waitUntil: 'load' });
    await page.getByText('The booking did not load').waitFor({ timeout: 15_000 });
    expect(await page.getByRole('button', { name: 'Try again' }).count()).toBe(0);
    await expectAccessible(page, 'missing booking');
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'missing-booking-phone.png'), fullPage: true });
  } finally {
    await context.close();
  }
});

it('shows the password on request while signing in on a phone', async () => {
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await page.goto(`${suite.server.baseUrl}/`, { waitUntil: 'load' });
    await page.getByTestId('sign-in-password').fill('correct horse');
    await expect(page.getByTestId('sign-in-password').getAttribute('type')).resolves.toBe('password');
    await page.getByTestId('sign-in-password-show').click();
    // react-native-web drops the type attribute for plain text (the HTML default).
    await expect(page.getByTestId('sign-in-password').getAttribute('type')).resolves.not.toBe('password');
    await expect(page.getByTestId('sign-in-password-show').getAttribute('aria-pressed')).resolves.toBe('true');
    await expect(page.getByTestId('sign-in-password').inputValue()).resolves.toBe('correct horse');
    await expectAccessible(page, 'sign-in with the password shown');
    await page.getByTestId('sign-in-password-show').click();
    await expect(page.getByTestId('sign-in-password').getAttribute('type')).resolves.toBe('password');
  } finally {
    await context.close();
  }
});

it('keeps dark colours when chosen on More, whatever the system says, and goes back to following it', async () => {
  const member = await createPerson(suite.server.db, { role: 'member', name: 'Ilse Marchetti' });
  const { context, page } = await newPage(suite.browser.browser, PHONE, 'light');
  const background = () => page.getByTestId('more-screen').evaluate((el) => getComputedStyle(el).backgroundColor);
  const settlesOn = (want: (colour: string) => boolean) =>
    page
      .waitForFunction(() => getComputedStyle(document.querySelector('[data-testid="more-screen"]')!).backgroundColor)
      .then(async () => {
        for (let i = 0; i < 50 && !want(await background()); i += 1) await page.waitForTimeout(100);
        return background();
      });
  try {
    await signInThroughUi(page, suite.server.baseUrl, member.email, member.password);
    await page.getByTestId('nav-more').click();
    await page.getByTestId('more-screen').waitFor();
    const light = await background();
    await page.getByTestId('theme-choice-dark').click();
    const dark = await settlesOn((c) => c !== light);
    expect(dark).not.toBe(light);
    // Survives a reload (stored in this browser) and a system switch to light.
    await page.reload({ waitUntil: 'load' });
    await page.getByTestId('more-screen').waitFor({ timeout: 20_000 });
    await expect(settlesOn((c) => c === dark)).resolves.toBe(dark);
    await expectAccessible(page, 'more with dark chosen');
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'more-theme-dark-phone.png') });
    await page.getByTestId('theme-choice-system').click();
    await expect(settlesOn((c) => c === light)).resolves.toBe(light);
  } finally {
    await context.close();
  }
});
