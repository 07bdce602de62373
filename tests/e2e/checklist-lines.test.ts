// An officer keeps the checklists from the Lab rules screen: adds a reading line, then retires it.
import { createPerson } from '../helpers/test-app';
import { e2eSuite, expectAccessible, newPage, PHONE, signInThroughUi } from '../helpers/e2e';

const suite = e2eSuite();

it('adds a reading line with limits and retires it again', async () => {
  const officer = await createPerson(suite.server.db, { role: 'officer' });
  const text = `Ozone at the bench ${Date.now()}`;
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, officer.email, officer.password);
    await page.goto(`${suite.server.baseUrl}/lab-rules`, { waitUntil: 'load' });
    const form = page.getByTestId('checklist-line-form');
    await form.waitFor({ timeout: 20_000 });
    await expectAccessible(page, 'lab-rules');
    await page.getByTestId('checklist-line-kind').getByText('Reading with limits').click();
    await page.getByTestId('checklist-line-text').fill(text);
    await page.getByTestId('checklist-line-submit').click();
    // A reading needs a unit (shared schema), said on the field.
    await page.getByText('A reading needs a unit').waitFor({ timeout: 10_000 });
    await expectAccessible(page, 'lab-rules with a field error');
    await page.getByTestId('checklist-line-unit').fill('ppm');
    await page.getByTestId('checklist-line-max').fill('0.1');
    await page.getByTestId('checklist-line-submit').click();
    await page.getByTestId('checklist-line-added').waitFor({ timeout: 15_000 });
    const row = await suite.server.db('checklist_templates').where({ text, active: true }).first();
    expect(row).toMatchObject({ kind: 'reading', unit: 'ppm', phase: 'pre' });
    expect(Number(row.max_value)).toBeCloseTo(0.1, 6);

    await page.getByTestId(`checklist-line-retire-${row.id}`).click();
    // Retiring asks once more, naming the line.
    await page.getByTestId(`checklist-line-retire-${row.id}-yes`).click();
    await page.getByTestId(`checklist-line-retire-${row.id}`).waitFor({ state: 'detached', timeout: 15_000 });
    expect((await suite.server.db('checklist_templates').where({ id: row.id }).first()).active).toBe(false);
  } finally {
    await context.close();
  }
});
