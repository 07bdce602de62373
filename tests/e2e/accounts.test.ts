// Accounts end to end at a phone's size: a manager invites someone on People, the invitation mail
// is delivered by the real outbox worker to the fake SMTP server, the link sets a password and the
// new person signs in; the forgotten-password flow the same way. Plus the manager's other screens
// in this area: changing a person, the Outbox and Reports.
import path from 'node:path';
import type { Page } from 'playwright-core';
import { OutboxWorker } from '../../server/mail/outbox';
import { createTransport } from '../../server/mail/transport';
import { addDaysIso, todayIso } from '../../server/services/dates';
import { insertItem, qualify } from '../helpers/gear';
import { createPerson, uniqueEmail, uniqueWord } from '../helpers/test-app';
import { e2eSuite, newPage, PHONE, SCREENSHOT_DIR, signInThroughUi, WIDE, expectAccessible } from '../helpers/e2e';

const suite = e2eSuite();
let worker: OutboxWorker;
// Other suites may have left a backlog of queued mail in the shared test database.
const MAIL_WAIT_MS = 150_000;
const DRAINABLE_BACKLOG = 300;
const MAIL_TEST_TIMEOUT_MS = 240_000;
let manager: { id: number; email: string; password: string };
beforeAll(async () => {
  worker = new OutboxWorker(suite.server.db, createTransport(suite.server.smtp.url), 'Voltcrib <voltcrib@localhost>');
  manager = await createPerson(suite.server.db, { role: 'manager', name: 'Maren Okafor' });
});

/**
 * The mail to `to`, as delivered: the real outbox worker drains the queue into this server's fake
 * SMTP until it arrives. The test database may be shared with suites running at the same time:
 * their workers can deliver ours to their own fake SMTP (the row then reads "sent"), and a backlog
 * of their queued mail can sit ahead of ours. Past DRAINABLE_BACKLOG rows the queued row's own text
 * is used instead of waiting (with a warning), so the link is still the one the mail carries.
 */
async function mailTo(to: string, subject: string): Promise<string> {
  const deadline = Date.now() + MAIL_WAIT_MS;
  while (Date.now() < deadline) {
    const received = suite.server.smtp.list().find((m) => m.to.includes(to) && m.subject === subject);
    if (received) return received.text;
    const row = await suite.server.db('outbox').where({ to_address: to, subject }).orderBy('id', 'desc').first('id', 'state', 'text_body');
    if (row) {
      const ahead = await suite.server.db('outbox').where('state', 'pending').andWhere('id', '<', row.id).count({ n: '*' }).first();
      if (row.state === 'sent' || Number(ahead?.n) > DRAINABLE_BACKLOG) {
        console.warn(`mail to ${to} read from the outbox row (${row.state}, ${Number(ahead?.n)} queued ahead of it)`);
        return suite.server.smtp.list().find((m) => m.to.includes(to) && m.subject === subject)?.text ?? String(row.text_body);
      }
    }
    const { sent, failed } = await worker.drain(20);
    if (sent === 0 && failed === 0) await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`no "${subject}" mail to ${to}`);
}

function linkIn(text: string, route: 'invitation' | 'reset-password'): string {
  const match = text.match(new RegExp(`https?://\\S+/${route}/[A-Za-z0-9_-]+`));
  if (!match) throw new Error(`no ${route} link in: ${text}`);
  return match[0];
}

async function signInExpectingFailure(page: Page, email: string, password: string) {
  await page.goto(`${suite.server.baseUrl}/sign-in`, { waitUntil: 'load' });
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(password);
  await page.getByTestId('sign-in-submit').click();
  await page.getByTestId('sign-in-error').waitFor({ timeout: 15_000 });
}

describe('an invitation', () => {
  it(
    'is sent from People, sets a password through its link, and the new person signs in',
    async () => {
      const email = uniqueEmail('invitee');
      const managerView = await newPage(suite.browser.browser, PHONE);
      try {
        const page = managerView.page;
        await signInThroughUi(page, suite.server.baseUrl, manager.email, manager.password);
        await page.goto(`${suite.server.baseUrl}/people`, { waitUntil: 'load' });
        await page.getByTestId('people-invite-open').click();
        await page.getByTestId('people-invite-submit').click();
        // The shared invitation schema speaks before anything is sent.
        await expect(page.getByTestId('invite-email-error').textContent()).resolves.toBe('Enter a valid e-mail address');
        await page.getByTestId('invite-name').fill('Odile Varga');
        await page.getByTestId('invite-email').fill(email);
        await page.getByTestId('invite-role-member').click();
        await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'people-invite-phone.png') });
        await page.getByTestId('people-invite-submit').click();
        await expect(page.getByTestId('people-invite-sent').textContent()).resolves.toContain(email);
        const invited = await suite.server.db('people').where({ email }).first('id', 'role', 'password_hash');
        expect(invited).toMatchObject({ role: 'member', password_hash: null });

        // Inviting the same e-mail again is refused on the e-mail field.
        await page.getByTestId('people-invite-sent-dismiss').click();
        await page.getByTestId('people-invite-open').click();
        await page.getByTestId('invite-name').fill('Odile Varga');
        await page.getByTestId('invite-email').fill(email);
        await page.getByTestId('people-invite-submit').click();
        await expect(page.getByTestId('invite-email-error').textContent()).resolves.toContain('already in Voltcrib');
      } finally {
        await managerView.context.close();
      }

      const link = linkIn(await mailTo(email, 'You are invited to Voltcrib'), 'invitation');
      const { context, page } = await newPage(suite.browser.browser, PHONE);
      try {
        await page.goto(link, { waitUntil: 'load' });
        await page.getByTestId('invitation-screen').waitFor();
        await expectAccessible(page, 'invitation');
        await page.getByTestId('invitation-password').fill('kestrel hall bench four');
        await page.getByTestId('invitation-confirm').fill('kestrel hall bench for');
        await page.getByTestId('invitation-submit').click();
        await expect(page.getByTestId('invitation-confirm-error').textContent()).resolves.toBe('The two passwords differ');
        await page.getByTestId('invitation-confirm').fill('kestrel hall bench four');
        await page.getByTestId('invitation-submit').click();
        await page.getByTestId('invitation-done').waitFor({ timeout: 15_000 });
        await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'invitation-done-phone.png') });
        await page.getByTestId('invitation-done-sign-in').click();
        await page.getByTestId('sign-in-email').fill(email);
        await page.getByTestId('sign-in-password').fill('kestrel hall bench four');
        await page.getByTestId('sign-in-submit').click();
        await page.getByTestId('today-screen').waitFor({ timeout: 20_000 });
        await expectAccessible(page, 'today');
      } finally {
        await context.close();
      }

      // The link worked once.
      const again = await newPage(suite.browser.browser, PHONE);
      try {
        await again.page.goto(link, { waitUntil: 'load' });
        await again.page.getByTestId('invitation-password').fill('another long password');
        await again.page.getByTestId('invitation-confirm').fill('another long password');
        await again.page.getByTestId('invitation-submit').click();
        await expect(again.page.getByTestId('invitation-expired').textContent()).resolves.toContain('used or has expired');
      } finally {
        await again.context.close();
      }
    },
    MAIL_TEST_TIMEOUT_MS,
  );
});

describe('a forgotten password', () => {
  it(
    'is reset through the e-mailed link; the link then reads as used, with a way to ask again',
    async () => {
      const person = await createPerson(suite.server.db, { role: 'member', name: 'Teodor Lund' });
      const { context, page } = await newPage(suite.browser.browser, PHONE);
      try {
        await page.goto(`${suite.server.baseUrl}/`, { waitUntil: 'load' });
        await page.getByTestId('sign-in-forgot').click();
        await page.getByTestId('forgot-password-screen').waitFor();
        await expectAccessible(page, 'forgot-password');
        await page.getByTestId('forgot-password-email').fill('nobody-here@test.voltcrib.example');
        await page.getByTestId('forgot-password-submit').click();
        const unknownAnswer = await page.getByTestId('forgot-password-sent').textContent({ timeout: 15_000 });

        await page.goto(`${suite.server.baseUrl}/forgot-password`, { waitUntil: 'load' });
        await page.getByTestId('forgot-password-email').fill(person.email);
        await page.getByTestId('forgot-password-submit').click();
        // The same words whether or not the e-mail has an account.
        await expect(page.getByTestId('forgot-password-sent').textContent({ timeout: 15_000 })).resolves.toBe(unknownAnswer);
        expect(unknownAnswer).toContain('If that e-mail belongs to an account');
        await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'forgot-password-sent-phone.png') });

        const link = linkIn(await mailTo(person.email, 'Reset your Voltcrib password'), 'reset-password');
        await page.goto(link, { waitUntil: 'load' });
        await page.getByTestId('reset-password-password').fill('short');
        await page.getByTestId('reset-password-confirm').fill('short');
        await page.getByTestId('reset-password-submit').click();
        await expect(page.getByTestId('reset-password-password-error').textContent()).resolves.toBe('Use at least 10 characters');
        await page.getByTestId('reset-password-password').fill('orrin polytechnic ladder');
        await page.getByTestId('reset-password-confirm').fill('orrin polytechnic ladder');
        await page.getByTestId('reset-password-submit').click();
        await page.getByTestId('reset-password-done').waitFor({ timeout: 15_000 });
        await page.getByTestId('reset-password-done-sign-in').click();
        await signInExpectingFailure(page, person.email, person.password);
        await page.getByTestId('sign-in-password').fill('orrin polytechnic ladder');
        await page.getByTestId('sign-in-submit').click();
        await page.getByTestId('today-screen').waitFor({ timeout: 20_000 });
        await expectAccessible(page, 'today');
      } finally {
        await context.close();
      }

      const { context: later, page: laterPage } = await newPage(suite.browser.browser, PHONE);
      try {
        const link = linkIn(await mailTo(person.email, 'Reset your Voltcrib password'), 'reset-password');
        await laterPage.goto(link, { waitUntil: 'load' });
        await laterPage.getByTestId('reset-password-password').fill('yet another long one');
        await laterPage.getByTestId('reset-password-confirm').fill('yet another long one');
        await laterPage.getByTestId('reset-password-submit').click();
        await expect(laterPage.getByTestId('reset-password-expired').textContent()).resolves.toMatch(/used or expired/i);
        await laterPage.screenshot({ path: path.join(SCREENSHOT_DIR, 'reset-password-expired-phone.png') });
        await laterPage.getByTestId('reset-password-expired-retry').click();
        await laterPage.getByTestId('forgot-password-email').waitFor();
      } finally {
        await later.close();
      }
    },
    MAIL_TEST_TIMEOUT_MS,
  );

  it('treats a link that was never issued as used or expired', async () => {
    const { context, page } = await newPage(suite.browser.browser, PHONE);
    try {
      await page.goto(`${suite.server.baseUrl}/reset-password/not-a-real-token-${uniqueWord()}`, { waitUntil: 'load' });
      await page.getByTestId('reset-password-password').fill('a long enough password');
      await page.getByTestId('reset-password-confirm').fill('a long enough password');
      await page.getByTestId('reset-password-submit').click();
      await page.getByTestId('reset-password-expired').waitFor({ timeout: 15_000 });
      await page.goto(`${suite.server.baseUrl}/invitation/x`, { waitUntil: 'load' });
      await page.getByTestId('invitation-expired').waitFor();
    } finally {
      await context.close();
    }
  });
});

describe('a manager on People', () => {
  it('changes a role and group, sees an expired qualification, and deactivates with sessions ended at once', async () => {
    const groupName = `Corona group ${uniqueWord()}`;
    const [groupId] = (await suite.server.db('groups').insert({ name: groupName })) as [number];
    const member = await createPerson(suite.server.db, { role: 'member', name: 'Priya Halden' });
    await qualify(suite.server.db, member.id, 30, addDaysIso(todayIso(), -3));

    // The member is signed in elsewhere; deactivation must end that session.
    const memberView = await newPage(suite.browser.browser, PHONE);
    await signInThroughUi(memberView.page, suite.server.baseUrl, member.email, member.password);

    const { context, page } = await newPage(suite.browser.browser, PHONE);
    try {
      await signInThroughUi(page, suite.server.baseUrl, manager.email, manager.password);
      await page.goto(`${suite.server.baseUrl}/people?person=${member.id}`, { waitUntil: 'load' });
      await page.getByTestId('person-panel').waitFor({ timeout: 15_000 });
      await expect(page.getByTestId('person-qualification').textContent()).resolves.toContain('Expired');

      await page.getByTestId('person-role-manager').click();
      await expect(page.getByTestId('person-role-note').textContent()).resolves.toContain('signs Priya Halden out everywhere');
      await page.getByTestId(`person-group-${groupId}`).click();
      await page.getByTestId('person-save').click();
      await page.getByTestId('person-saved').waitFor({ timeout: 15_000 });
      await expect(suite.server.db('people').where({ id: member.id }).first('role', 'group_id')).resolves.toEqual({ role: 'manager', group_id: groupId });
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'people-person-phone.png'), fullPage: true });

      // The role change ended the session; sign the member in again for the deactivation check.
      await signInThroughUi(memberView.page, suite.server.baseUrl, member.email, member.password);

      await page.getByTestId('person-deactivate').click();
      await expect(page.getByTestId('person-deactivate-question').textContent()).resolves.toContain('Their sessions end at once');
      await page.getByTestId('person-deactivate-confirm').click();
      await page.getByTestId('person-reactivate').waitFor({ timeout: 15_000 });
      const after = await suite.server.db('people').where({ id: member.id }).first('active');
      expect(Number(after.active)).toBe(0);
      const sessions = await suite.server.db('sessions').where({ person_id: member.id }).count({ n: '*' }).first();
      expect(Number(sessions?.n)).toBe(0);

      // Their open app notices on its next request and returns to sign-in.
      await memberView.page.goto(`${suite.server.baseUrl}/`, { waitUntil: 'load' });
      await memberView.page.getByTestId('sign-in-screen').waitFor({ timeout: 15_000 });
      await expectAccessible(memberView.page, 'sign-in');

      await page.getByTestId('person-reactivate').click();
      await expect(page.getByTestId('person-reactivate-question').textContent()).resolves.toContain('sign in again');
      await page.getByTestId('person-reactivate-confirm').click();
      await page.getByTestId('person-deactivate').waitFor({ timeout: 15_000 });

      // Back to the list: the person shows with the new role.
      await page.getByTestId('person-back').click();
      await expect(page.getByTestId(`person-${member.id}`).textContent()).resolves.toContain('Lab manager');
    } finally {
      await context.close();
      await memberView.context.close();
      await suite.server.db('people').where({ id: member.id }).update({ group_id: null, role: 'member' });
      await suite.server.db('groups').where({ id: groupId }).delete();
    }
  });

  it('cannot change their own role or deactivate themselves', async () => {
    const { context, page } = await newPage(suite.browser.browser, WIDE);
    try {
      await signInThroughUi(page, suite.server.baseUrl, manager.email, manager.password);
      await page.goto(`${suite.server.baseUrl}/people?person=${manager.id}`, { waitUntil: 'load' });
      await page.getByTestId('person-panel').waitFor({ timeout: 15_000 });
      expect(await page.getByTestId('person-role-officer').count()).toBe(0);
      expect(await page.getByTestId('person-deactivate').count()).toBe(0);
      await expect(page.getByTestId('person-panel').textContent()).resolves.toContain('You cannot deactivate yourself');
    } finally {
      await context.close();
    }
  });
});

describe('a manager on the Outbox', () => {
  it('lists the mail received, newest first, and opens one with its link', async () => {
    // Straight into this server's fake SMTP: the Outbox shows the mailbox, whatever queued the mail.
    const subject = `Bench 3 handover ${uniqueWord()}`;
    const link = `${suite.server.baseUrl}/bookings/42`;
    await createTransport(suite.server.smtp.url).sendMail({
      from: 'Voltcrib <voltcrib@localhost>',
      to: 'lena.marsh@kestrel-hall.example',
      subject,
      text: ['Hello Lena Marsh,', '', 'The 30 kV supply is back at the counter.', '', `Open the booking: ${link}.`].join('\n'),
    });
    const message = suite.server.smtp.list().find((m) => m.subject === subject)!;
    const { context, page } = await newPage(suite.browser.browser, PHONE);
    try {
      await signInThroughUi(page, suite.server.baseUrl, manager.email, manager.password);
      await page.goto(`${suite.server.baseUrl}/outbox`, { waitUntil: 'load' });
      await page.getByTestId('outbox-list').waitFor({ timeout: 15_000 });
      // Newest first: the message just sent is the first row.
      await expect(page.getByTestId('outbox-list').getByRole('button').first().textContent()).resolves.toContain(subject);
      await page.getByTestId(`outbox-message-${message.id}`).click();
      await expect(page.getByTestId('outbox-message-subject').textContent()).resolves.toBe(subject);
      await expect(page.getByTestId('outbox-message-text').textContent()).resolves.toContain('Hello Lena Marsh');
      // The sentence's full stop is not part of the link.
      await expect(page.getByTestId('outbox-message-link').getAttribute('href')).resolves.toBe(link);
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'outbox-message-phone.png'), fullPage: true });
      await page.getByTestId('outbox-back').click();
      await page.getByTestId('outbox-list').waitFor();
    } finally {
      await context.close();
    }
  });
});

describe('a manager on Reports', () => {
  it('shows use per group, overdue bookings and inspections due, each with its CSV link', async () => {
    const groupName = `Ionic wind group ${uniqueWord()}`;
    const [groupId] = (await suite.server.db('groups').insert({ name: groupName })) as [number];
    const booker = await createPerson(suite.server.db, { role: 'member', name: 'Ada Brandt' });
    await suite.server.db('people').where({ id: booker.id }).update({ group_id: groupId });
    const hour = 3600_000;
    const now = Date.now();
    const booking = {
      person_id: booker.id,
      location: 'Kestrel Hall, bay 2',
      purpose: 'Ionic wind thrust sweep',
      planned_kv: 20,
      polarity: 'positive',
      max_current_ma: 1,
      people_present: 2,
      assessment: JSON.stringify({}),
      approval_required: false,
    };
    // A three-hour test two days ago, and one whose gear is two hours overdue now.
    await suite.server.db('bookings').insert({
      ...booking,
      status: 'returned',
      starts_at: new Date(now - 50 * hour),
      ends_at: new Date(now - 47 * hour),
      released_at: new Date(now - 50 * hour),
      returned_at: new Date(now - 47 * hour),
    });
    const [overdueId] = (await suite.server.db('bookings').insert({
      ...booking,
      status: 'released',
      starts_at: new Date(now - 5 * hour),
      ends_at: new Date(now - 2 * hour),
      released_at: new Date(now - 5 * hour),
    })) as [number];
    const dueItem = await insertItem(suite.server.db, 'probe', { nextDue: addDaysIso(todayIso(), -1) });

    const { context, page } = await newPage(suite.browser.browser, PHONE);
    try {
      await signInThroughUi(page, suite.server.baseUrl, manager.email, manager.password);
      await page.goto(`${suite.server.baseUrl}/reports`, { waitUntil: 'load' });

      await expect(page.getByTestId(`reports-overdue-${overdueId}`).textContent({ timeout: 15_000 })).resolves.toMatch(/Ada Brandt[\s\S]*2 h overdue/);
      await expect(page.getByTestId('reports-overdue-csv').getAttribute('href')).resolves.toBe('/api/reports/overdue.csv');

      // Never inspected first, then soonest, at most 50: an item a day overdue is listed unless 50
      // never-inspected or older ones exist.
      await page
        .getByTestId('reports-inspections')
        .getByText(/Never inspected|Overdue|Due soon/)
        .first()
        .waitFor({ timeout: 15_000 });
      const older = await suite.server
        .db('items')
        .whereNot('status', 'retired')
        .andWhere((w) => w.whereNull('next_inspection_due').orWhere('next_inspection_due', '<', addDaysIso(todayIso(), -1)))
        .count({ n: '*' })
        .first();
      if (Number(older?.n) < 50) await page.getByTestId(`reports-inspection-${dueItem.id}`).waitFor();
      await expect(page.getByTestId('reports-inspections-csv').getAttribute('href')).resolves.toBe('/api/reports/inspections.csv');

      // Use per group: the last 30 days by default (local midnights, as instants). Released and
      // returned bookings count: two of three hours each, by one person.
      const row = page.getByTestId('reports-usage-table').getByRole('row').filter({ hasText: groupName });
      await expect(row.textContent({ timeout: 15_000 })).resolves.toBe(`${groupName}26 h1`);
      const usageHref = await page.getByTestId('reports-usage-csv').getAttribute('href');
      const period = Object.fromEntries(new URL(usageHref!, suite.server.baseUrl).searchParams);
      const days = (new Date(period.to!).getTime() - new Date(period.from!).getTime()) / (24 * hour);
      expect(Math.round(days)).toBe(30);
      const csv = await page.evaluate(async (href) => (await fetch(href)).text(), usageHref!);
      expect(csv).toContain(`${groupName},2,6,1`);
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'reports-phone.png'), fullPage: true });

      // The last 7 days still hold it; a custom period before it does not.
      await page.getByTestId('reports-period-7').click();
      await expect(row.textContent()).resolves.toBe(`${groupName}26 h1`);
      await page.getByTestId('reports-period-custom').click();
      await page.getByTestId('reports-period-from').fill(addDaysIso(todayIso(), -20));
      await page.getByTestId('reports-period-to').fill(addDaysIso(todayIso(), -10));
      await row.waitFor({ state: 'detached', timeout: 15_000 });
      await page.getByTestId('reports-period-to').fill('2026-13-01');
      await expect(page.getByTestId('reports-period-to-error').textContent()).resolves.toBe('Use the form YYYY-MM-DD');
    } finally {
      await context.close();
      // Leave no overdue booking or extra group behind for other suites.
      await suite.server.db('bookings').where({ id: overdueId }).update({ status: 'returned', returned_at: new Date() });
      await suite.server.db('people').where({ id: booker.id }).update({ group_id: null });
      await suite.server.db('groups').where({ id: groupId }).delete();
    }
  });
});
