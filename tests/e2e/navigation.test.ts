// Each demo role signs in at a phone and a wide viewport and sees its own navigation.
import path from 'node:path';
import { createPerson } from '../helpers/test-app';
import { e2eSuite, newPage, PHONE, SCREENSHOT_DIR, signInThroughUi, WIDE, expectAccessible } from '../helpers/e2e';

const suite = e2eSuite();

const EXTRA: Record<string, { has: string[]; hasNot: string[] }> = {
  member: { has: [], hasNot: ['nav-people', 'nav-approvals', 'nav-lab-rules', 'nav-audit', 'nav-outbox'] },
  officer: { has: ['nav-approvals', 'nav-lab-rules', 'nav-audit'], hasNot: ['nav-people', 'nav-outbox', 'nav-labels'] },
  manager: { has: ['nav-people', 'nav-labels', 'nav-outbox', 'nav-audit'], hasNot: ['nav-approvals', 'nav-lab-rules'] },
};

describe.each(['member', 'officer', 'manager'] as const)('a %s', (role) => {
  it('sees bottom tabs on a phone, with role entries on More only', async () => {
    const person = await createPerson(suite.server.db, { role, name: `E2E ${role}` });
    const { context, page } = await newPage(suite.browser.browser, PHONE);
    try {
      await signInThroughUi(page, suite.server.baseUrl, person.email, person.password);
      await page.getByTestId('tab-bar').waitFor();
      for (const tab of ['nav-today', 'nav-gear', 'nav-scan', 'nav-bookings', 'nav-more']) {
        await expect(page.getByTestId(tab).isVisible()).resolves.toBe(true);
      }
      expect(await page.getByTestId('side-nav').count()).toBe(0);
      await page.getByTestId('nav-more').click();
      await page.getByTestId('more-screen').waitFor();
      await expectAccessible(page, 'more');
      for (const id of EXTRA[role]!.has) await expect(page.getByTestId(id).first().isVisible()).resolves.toBe(true);
      for (const id of EXTRA[role]!.hasNot) expect(await page.getByTestId(id).count()).toBe(0);
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, `nav-${role}-phone.png`) });
    } finally {
      await context.close();
    }
  });

  it('sees the side navigation on a wide screen', async () => {
    const person = await createPerson(suite.server.db, { role, name: `E2E ${role} wide` });
    const { context, page } = await newPage(suite.browser.browser, WIDE);
    try {
      await signInThroughUi(page, suite.server.baseUrl, person.email, person.password);
      await page.getByTestId('side-nav').waitFor();
      expect(await page.getByTestId('tab-bar').count()).toBe(0);
      for (const id of ['nav-today', 'nav-gear', 'nav-scan', 'nav-bookings', ...EXTRA[role]!.has]) {
        await expect(page.getByTestId(id).first().isVisible()).resolves.toBe(true);
      }
      for (const id of EXTRA[role]!.hasNot) expect(await page.getByTestId(id).count()).toBe(0);
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, `nav-${role}-wide.png`) });
    } finally {
      await context.close();
    }
  });
});

it('a member who opens a manager URL directly does not get the manager screen', async () => {
  const person = await createPerson(suite.server.db, { role: 'member' });
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, person.email, person.password);
    await page.goto(`${suite.server.baseUrl}/people`, { waitUntil: 'load' });
    await page.waitForTimeout(1500);
    expect(await page.getByTestId('people-screen').count()).toBe(0);
  } finally {
    await context.close();
  }
});

it('a wrong password shows the same message as an unknown e-mail', async () => {
  const person = await createPerson(suite.server.db, { role: 'member' });
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await page.goto(`${suite.server.baseUrl}/`, { waitUntil: 'load' });
    await page.getByTestId('sign-in-email').fill(person.email);
    await page.getByTestId('sign-in-password').fill('wrong password');
    await page.getByTestId('sign-in-submit').click();
    const message = await page.getByTestId('sign-in-error').textContent({ timeout: 15_000 });
    await page.getByTestId('sign-in-email').fill('nobody@test.voltcrib.example');
    await page.getByTestId('sign-in-submit').click();
    await page.waitForTimeout(1000);
    expect(await page.getByTestId('sign-in-error').textContent()).toBe(message);
  } finally {
    await context.close();
  }
});
