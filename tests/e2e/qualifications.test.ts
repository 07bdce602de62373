// The safety officer records a member's authorised voltage and expiry on the Qualifications screen.
import { createPerson } from '../helpers/test-app';
import { e2eSuite, newPage, PHONE, signInThroughUi, expectAccessible } from '../helpers/e2e';

const suite = e2eSuite();

it('records a qualification that the release rules then read', async () => {
  const officer = await createPerson(suite.server.db, { role: 'officer' });
  const member = await createPerson(suite.server.db, { role: 'member', name: `Qualify Me ${Date.now()}` });
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, officer.email, officer.password);
    await page.getByTestId('nav-more').click();
    await page.getByTestId('nav-qualifications').first().click();
    await page.getByTestId('qualifications-screen').waitFor({ timeout: 20_000 });
    await expectAccessible(page, 'qualifications');
    await page.getByTestId(`qualification-person-${member.id}`).click();
    // On a phone the form opens in view, under the person, with a way out.
    await page.getByTestId('qualification-form').waitFor();
    expect(
      await page.getByTestId('qualification-kv').evaluate((el) => {
        const r = el.getBoundingClientRect();
        return r.top >= 0 && r.bottom <= innerHeight;
      }),
    ).toBe(true);
    await page.getByTestId('qualification-cancel').click();
    await page.getByTestId('qualification-form').waitFor({ state: 'detached' });
    await page.getByTestId(`qualification-person-${member.id}`).click();
    await expectAccessible(page, 'qualifications editing');
    await page.getByTestId('qualification-kv').fill('30');
    await page.getByTestId('qualification-expires').fill('31/12/2027');
    await page.getByTestId('qualification-save').click();
    // The shared schema wants an ISO date, said on the field; nothing is saved.
    await page.getByTestId('qualification-form').getByText(/date/i).first().waitFor({ timeout: 10_000 });
    expect(await suite.server.db('qualifications').where({ person_id: member.id }).first()).toBeUndefined();
    await page.getByTestId('qualification-expires').fill('2027-12-31');
    await page.getByTestId('qualification-save').click();
    await page.getByTestId('qualification-saved').waitFor({ timeout: 15_000 });
    const row = await suite.server.db('qualifications').where({ person_id: member.id }).first();
    expect(Number(row.authorised_kv)).toBe(30);
    expect(row.expires_on).toBe('2027-12-31');
  } finally {
    await context.close();
  }
});
