// The Planner at a phone's size: results appear as the member types, computed in the browser by
// shared/hv. Expected values are the check values of the domain brief (/work/shared/domain.md §9).
import path from 'node:path';
import type { Page } from 'playwright-core';
import { SAFETY_CAUTION } from '../../shared/rules/assessment';
import { createPerson } from '../helpers/test-app';
import { e2eSuite, newPage, PHONE, SCREENSHOT_DIR, signInThroughUi, WIDE, expectAccessible } from '../helpers/e2e';

const suite = e2eSuite();
let member: { email: string; password: string };
beforeAll(async () => {
  member = await createPerson(suite.server.db, { role: 'member', name: 'Ines Planner' });
});

async function openPlanner(viewport = PHONE, colorScheme: 'light' | 'dark' = 'light') {
  const opened = await newPage(suite.browser.browser, viewport, colorScheme);
  await signInThroughUi(opened.page, suite.server.baseUrl, member.email, member.password);
  await opened.page.goto(`${suite.server.baseUrl}/planner`, { waitUntil: 'load' });
  await opened.page.getByTestId('planner-screen').waitFor();
  await expectAccessible(opened.page, 'planner');
  await opened.page.getByTestId('planner-tab-energy').waitFor({ timeout: 20_000 });
  return opened;
}

const result = (page: Page, key: string) => page.getByTestId(`planner-result-${key}`);

async function type(page: Page, field: string, text: string) {
  await page.getByTestId(`planner-field-${field}`).fill(text);
}

describe('the Planner on a phone', () => {
  it('shows the stored energy and the real bleed-down time as the values are typed', async () => {
    const { context, page } = await openPlanner();
    try {
      await expect(page.getByTestId('planner-caution').textContent()).resolves.toContain(SAFETY_CAUTION);
      await page.getByTestId('planner-field-capacitance-unit-uF').click();
      await type(page, 'capacitance', '1');
      await type(page, 'voltage', '10');
      // §9 #1: energy(C = 1 µF, V = 10 kV) = 50.0 J; #2: Q = 10 mC.
      await expect(result(page, 'energy').textContent()).resolves.toBe('50 J');
      await expect(result(page, 'charge').textContent()).resolves.toBe('10 mC');
      await expect(page.getByTestId('planner-waiting-discharge').textContent()).resolves.toContain('bleeder resistance');

      await type(page, 'bleeder', '100');
      // §9 #3: t_safe(100 MΩ, 1 µF, 10 kV → 50 V) = 529.8 s, N = 5.298; #4: 67.38 V after 5τ.
      await expect(result(page, 'time-to-safe').textContent()).resolves.toBe('529.8 s (8.8 min)');
      await expect(result(page, 'time-constants').textContent()).resolves.toBe('5.30 τ');
      await expect(result(page, 'residual-5tau').textContent()).resolves.toBe('67.4 V');
      const warning = await page.getByTestId('planner-notice-five-tau').textContent();
      expect(warning).toContain('5τ is not enough');
      expect(warning).toContain('7.42 kV');
      await expect(page.getByTestId('planner-source-discharge').textContent()).resolves.toContain('RC·ln(V₀/V_safe)');
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'planner-energy-phone.png'), fullPage: true });

      // Below the 5τ limit the habit is enough, and the notice says so instead.
      await type(page, 'voltage', '5');
      await expect(page.getByTestId('planner-notice-five-tau').textContent()).resolves.toContain('would also do');
    } finally {
      await context.close();
    }
  });

  it('shows a field message, never NaN, for input it cannot use', async () => {
    const { context, page } = await openPlanner();
    try {
      await type(page, 'capacitance', 'abc');
      await type(page, 'voltage', '10');
      await expect(page.getByTestId('planner-field-capacitance-error').textContent()).resolves.toBe('Enter a number, e.g. 4.7');
      await type(page, 'capacitance', '-2');
      await expect(page.getByTestId('planner-field-capacitance-error').textContent()).resolves.toBe('Must be more than 0');

      // The shared discharge schema's own refinement: the safe level must be below the start.
      await type(page, 'capacitance', '10');
      await type(page, 'bleeder', '100');
      await type(page, 'safe', '20000');
      await expect(page.getByTestId('planner-field-safe-error').textContent()).resolves.toBe('The safe voltage must be below the initial voltage');
      await expect(result(page, 'energy').textContent()).resolves.toBe('500 mJ');
      expect(await page.getByTestId('planner-result-time-to-safe').count()).toBe(0);
      expect(await page.getByTestId('planner-screen').textContent()).not.toMatch(/NaN|Infinity/);
    } finally {
      await context.close();
    }
  });

  it('gives the NFPA 70E DC boundaries for 500 V in metres and in the table’s own feet and inches', async () => {
    const { context, page } = await openPlanner();
    try {
      await page.getByTestId('planner-tab-boundaries').click();
      await page.getByTestId('planner-field-voltage-unit-V').click();
      await type(page, 'voltage', '500');
      // §9 #10: nfpa_dc(500 V) → limited movable 3.0 m, fixed 1.0 m (3 ft 6 in), restricted 0.3 m (1 ft 0 in).
      await expect(result(page, 'limited-fixed').textContent()).resolves.toBe('1.0 m');
      await expect(result(page, 'limited-movable').textContent()).resolves.toBe('3.0 m');
      await expect(result(page, 'restricted').textContent()).resolves.toBe('0.3 m');
      // The member reads which table and edition, and that their own copy is the authority; how far
      // each row was confirmed stays in shared/hv/data and its README.
      await expect(page.getByTestId('planner-source-boundaries').textContent()).resolves.toBe(
        'Source: NFPA 70E-2021 Table 130.4(E)(b); check against your copy of the standard',
      );

      await page.getByTestId('planner-choice-display-imperial').click();
      await expect(result(page, 'limited-fixed').textContent()).resolves.toBe('3 ft 6 in');
      await expect(result(page, 'restricted').textContent()).resolves.toBe('1 ft 0 in');
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'planner-boundaries-phone.png'), fullPage: true });

      // Above the highest DC row the table has no honest distance: a field message, no numbers.
      await page.getByTestId('planner-field-voltage-unit-kV').click();
      await type(page, 'voltage', '300');
      await expect(page.getByTestId('planner-field-voltage-error').textContent()).resolves.toContain('above the highest row');
      expect(await result(page, 'limited-fixed').count()).toBe(0);
    } finally {
      await context.close();
    }
  });

  it('gives the multiplier output under load', async () => {
    const { context, page } = await openPlanner();
    try {
      await page.getByTestId('planner-tab-multiplier').click();
      await type(page, 'stages', '5');
      await type(page, 'peakInput', '10');
      await type(page, 'frequency', '50');
      await type(page, 'stageCapacitance', '1');
      await type(page, 'load', '1');
      // §9 #16: cw(n=5, 10 kV, 50 kHz, 1 nF, 1 mA) → V0 = 100 kV, ΔV = 1 900 V, ripple 300 V, ≈ 98.1 kV, n_opt 22.36.
      await expect(result(page, 'no-load').textContent()).resolves.toBe('100 kV');
      await expect(result(page, 'drop').textContent()).resolves.toBe('1.9 kV');
      await expect(result(page, 'ripple').textContent()).resolves.toBe('300 V');
      await expect(result(page, 'loaded').textContent()).resolves.toBe('98.1 kV');
      await expect(result(page, 'optimum-stages').textContent()).resolves.toBe('22.4');
      // §9 #18: C_eq = 0.2 nF, E_out = 1.00 J, E_total = 1.85 J.
      await expect(result(page, 'output-capacitance').textContent()).resolves.toBe('200 pF');
      await expect(result(page, 'output-energy').textContent()).resolves.toBe('1 J');
      await expect(result(page, 'stack-energy').textContent()).resolves.toBe('1.85 J');
      await expect(page.getByTestId('planner-notice-stack').textContent()).resolves.toContain('Hazardous live');

      await type(page, 'stages', '2.5');
      await expect(page.getByTestId('planner-field-stages-error').textContent()).resolves.toBe('Enter a whole number');
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'planner-multiplier-phone.png'), fullPage: true });
    } finally {
      await context.close();
    }
  });

  it('classifies a node as hazardous live and names the deciding criterion', async () => {
    const { context, page } = await openPlanner();
    try {
      await page.getByTestId('planner-tab-hazard').click();
      await type(page, 'voltage', '10');
      await page.getByTestId('planner-field-current-unit-uA').click();
      await type(page, 'current', '100');
      await type(page, 'capacitance', '5');
      // §9 #6: 10 kV, 0.1 mA, 5 nF → hazardous (Q = 50 µC > 45 µC, line A).
      await expect(result(page, 'hazardous').textContent()).resolves.toBe('Hazardous live');
      await expect(result(page, 'criterion').textContent()).resolves.toContain('45 µC');
      await expect(result(page, 'charge').textContent()).resolves.toBe('50 µC');
      // §9 #8: max_nonhaz_C(10 kV) = 4.5 nF.
      await expect(result(page, 'max-capacitance').textContent()).resolves.toBe('4.5 nF');
      await type(page, 'capacitance', '4');
      await expect(result(page, 'hazardous').textContent()).resolves.toBe('Not hazardous live');
    } finally {
      await context.close();
    }
  });

  it('gives Peek’s corona onset', async () => {
    const { context, page } = await openPlanner();
    try {
      await page.getByTestId('planner-tab-corona').click();
      await type(page, 'wireRadius', '0.1');
      // §9 #20: g_v(r = 0.01 cm, δ = 1) = 120.3 kV/cm; #19: δ(76 cmHg, 25 °C) = 0.9997.
      await expect(result(page, 'onset-gradient').textContent()).resolves.toBe('120.3 kV/cm');
      await expect(result(page, 'density-factor').textContent()).resolves.toBe('1.000');
      await page.getByTestId('planner-field-outerRadius-unit-cm').click();
      await type(page, 'outerRadius', '2.54');
      // §9 #21: coaxial onset with R = 2.54 cm: 6.66 kV.
      await expect(result(page, 'onset-voltage').textContent()).resolves.toBe('6.66 kV');
    } finally {
      await context.close();
    }
  });

  it('copies the results as plain text for a lab notebook', async () => {
    const { context, page } = await openPlanner();
    try {
      await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: suite.server.baseUrl });
      await page.getByTestId('planner-field-capacitance-unit-uF').click();
      await type(page, 'capacitance', '1');
      await type(page, 'voltage', '10');
      await type(page, 'bleeder', '100');
      await page.getByTestId('planner-copy').click();
      // The label changes once the clipboard write has finished, which may take a moment.
      await page.getByTestId('planner-copy').getByText('Copied', { exact: true }).waitFor({ timeout: 10_000 });
      const copied = await page.evaluate(() => navigator.clipboard.readText());
      expect(copied).toContain('Capacitance: 1 µF');
      expect(copied).toContain('Stored energy: 50 J   [E = ½CV²]');
      expect(copied).toContain('529.8 s');
      expect(copied).toContain('Source: V(t) = V₀·e^(−t/RC)');
      expect(copied).toContain(SAFETY_CAUTION);
    } finally {
      await context.close();
    }
  });

  it('loads the calculators only when the Planner is opened', async () => {
    const { context, page } = await newPage(suite.browser.browser, PHONE);
    try {
      const scripts: string[] = [];
      page.on('request', (request) => {
        if (request.resourceType() === 'script') scripts.push(request.url());
      });
      await signInThroughUi(page, suite.server.baseUrl, member.email, member.password);
      expect(scripts.some((url) => url.includes('planner-calculators'))).toBe(false);
      await page.getByTestId('nav-more').click();
      await page.getByTestId('nav-planner').click();
      await page.getByTestId('planner-tab-energy').waitFor({ timeout: 20_000 });
      expect(scripts.some((url) => url.includes('planner-calculators'))).toBe(true);
    } finally {
      await context.close();
    }
  });
});

describe('the Planner on a wide screen', () => {
  it.each(['light', 'dark'] as const)('lays inputs and results side by side (%s)', async (scheme) => {
    const { context, page } = await openPlanner(WIDE, scheme);
    try {
      await page.getByTestId('planner-tab-multiplier').click();
      await type(page, 'stages', '5');
      await type(page, 'peakInput', '10');
      await type(page, 'frequency', '50');
      await type(page, 'stageCapacitance', '1');
      await type(page, 'load', '1');
      await expect(result(page, 'no-load').textContent()).resolves.toBe('100 kV');
      const inputs = await page.getByTestId('planner-inputs-multiplier').boundingBox();
      const results = await page.getByTestId('planner-section-multiplier').boundingBox();
      expect(inputs && results && results.x > inputs.x + inputs.width - 1).toBe(true);
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, `planner-multiplier-wide-${scheme}.png`) });
    } finally {
      await context.close();
    }
  });
});
