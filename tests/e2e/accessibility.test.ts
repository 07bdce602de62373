// axe-core on every screen of the app, as each role reaches it, at 390x844 and 1280x800, light and
// dark (expectAccessible in tests/helpers/e2e.ts). The other browser tests check the screens of
// their own journeys the same way; this file makes sure no screen is left out, and screenshots
// each one at both viewports in both schemes for review.
import path from 'node:path';
import type { Page } from 'playwright-core';
import { createBooking } from '../../server/services/booking-plans';
import { insertKit, qualify } from '../helpers/gear';
import { createPerson } from '../helpers/test-app';
import { e2eSuite, expectAccessible, newPage, PHONE, SCREENSHOT_DIR, signInThroughUi, WIDE } from '../helpers/e2e';

const suite = e2eSuite();
// Each screen is checked four times (two viewports, two schemes) and screenshot four times.
jest.setTimeout(300_000);
const MAIL = {
  get publicUrl() {
    return suite.server.baseUrl;
  },
};

async function shootAll(page: Page, name: string): Promise<void> {
  const own = page.viewportSize();
  for (const [vp, size] of [
    ['phone', PHONE],
    ['wide', WIDE],
  ] as const) {
    await page.setViewportSize(size);
    for (const scheme of ['light', 'dark'] as const) {
      await page.emulateMedia({ colorScheme: scheme });
      await page.waitForTimeout(150);
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, `screens-${name}-${vp}-${scheme}.png`), fullPage: true });
    }
  }
  if (own) await page.setViewportSize(own);
  await page.emulateMedia({ colorScheme: 'light' });
}

/** Opens a path, waits for its screen, checks it with axe and screenshots it. */
async function visit(page: Page, url: string, screenTestId: string, name: string): Promise<void> {
  await page.goto(`${suite.server.baseUrl}${url}`, { waitUntil: 'load' });
  await page.getByTestId(screenTestId).waitFor({ timeout: 20_000 });
  // Data screens show a loading state first: wait until it has gone.
  await page
    .waitForFunction(() => !document.querySelector('[data-testid$="-loading"], [aria-busy="true"]'), undefined, { timeout: 15_000 })
    .catch(() => undefined);
  await shootAll(page, name);
  await expectAccessible(page, name);
}

let bookingId = 0;
let releasedId = 0;
let itemId = 0;

beforeAll(async () => {
  const db = suite.server.db;
  const member = await createPerson(db, { role: 'member', name: 'Wren Achterberg' });
  await qualify(db, member.id, 60);
  const kit = await insertKit(db);
  itemId = kit.supply.id;
  const actor = { id: member.id, email: member.email, name: member.name, role: 'member' as const };
  const start = new Date(Date.now() + 30 * 86400_000);
  const waiting = await createBooking(
    db,
    actor,
    {
      itemIds: kit.all.map((i) => i.id),
      startsAt: start.toISOString(),
      endsAt: new Date(start.getTime() + 2 * 3600_000).toISOString(),
      location: 'Bay 3',
      purpose: 'Corona onset, needle to plane',
      plan: { plannedKv: 25, polarity: 'negative', maxCurrentMa: 0.5, peoplePresent: 2 },
    },
    MAIL,
  );
  bookingId = waiting.id;
  const kit2 = await insertKit(db);
  const now = new Date();
  const running = await createBooking(
    db,
    actor,
    {
      itemIds: kit2.all.map((i) => i.id),
      startsAt: now.toISOString(),
      endsAt: new Date(now.getTime() + 2 * 3600_000).toISOString(),
      location: 'Bay 4',
      purpose: 'Ionic wind demo',
      plan: { plannedKv: 8, polarity: 'positive', maxCurrentMa: 0.5, peoplePresent: 2 },
    },
    MAIL,
  );
  // Test data only: put the booking straight into "released" so the return screen has one to show.
  await db('bookings').where({ id: running.id }).update({ status: 'released', released_at: now });
  releasedId = running.id;
  (suite as unknown as { member: typeof member }).member = member;
});

it('signed out: sign-in, forgot-password, a bad invitation link', async () => {
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await visit(page, '/', 'sign-in-screen', 'sign-in');
    await visit(page, '/forgot-password', 'forgot-password-screen', 'forgot-password');
    await visit(page, '/invitation/not-a-real-token', 'invitation-screen', 'invitation');
  } finally {
    await context.close();
  }
});

it('a member: every screen of theirs', async () => {
  const member = (suite as unknown as { member: { email: string; password: string } }).member;
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, member.email, member.password);
    await visit(page, '/', 'today-screen', 'today-member');
    await visit(page, '/gear', 'gear-screen', 'gear');
    await visit(page, `/gear/${itemId}`, 'item-screen', 'item');
    await visit(page, '/scan', 'scan-screen', 'scan');
    await visit(page, '/bookings', 'bookings-screen', 'bookings');
    await visit(page, '/bookings/new', 'book-screen', 'book');
    await visit(page, `/bookings/${bookingId}`, 'booking-screen', 'booking');
    await visit(page, `/bookings/${bookingId}/edit`, 'edit-booking-screen', 'booking-edit');
    await visit(page, `/bookings/${releasedId}/return`, 'return-screen', 'return');
    await visit(page, '/more', 'more-screen', 'more');
    await visit(page, '/planner', 'planner-screen', 'planner');
    await visit(page, '/no/such/page', 'not-found-screen', 'not-found');
  } finally {
    await context.close();
  }
});

it('a safety officer: approvals, lab rules, qualifications, audit trail', async () => {
  const officer = await createPerson(suite.server.db, { role: 'officer', name: 'Idris Vantongeren' });
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, officer.email, officer.password);
    await visit(page, '/', 'today-screen', 'today-officer');
    await visit(page, '/approvals', 'approvals-screen', 'approvals');
    await visit(page, '/lab-rules', 'lab-rules-screen', 'lab-rules');
    await visit(page, '/qualifications', 'qualifications-screen', 'qualifications');
    await visit(page, '/audit', 'audit-screen', 'audit');
    await visit(page, `/bookings/${bookingId}/release`, 'release-screen', 'release');
  } finally {
    await context.close();
  }
});

it('a lab manager: people, labels, reports, outbox, gear forms', async () => {
  const manager = await createPerson(suite.server.db, { role: 'manager', name: 'Oona Lindqvist' });
  const { context, page } = await newPage(suite.browser.browser, PHONE);
  try {
    await signInThroughUi(page, suite.server.baseUrl, manager.email, manager.password);
    await visit(page, '/', 'today-screen', 'today-manager');
    await visit(page, '/people', 'people-screen', 'people');
    await visit(page, '/labels', 'labels-screen', 'labels');
    await visit(page, '/reports', 'reports-screen', 'reports');
    await visit(page, '/outbox', 'outbox-screen', 'outbox');
    await visit(page, '/gear/new', 'item-form-screen', 'item-new');
    await visit(page, `/gear/${itemId}/edit`, 'item-form-screen', 'item-edit');
  } finally {
    await context.close();
  }
});
