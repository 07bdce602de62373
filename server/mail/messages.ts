// The words of every e-mail Voltcrib sends: plain text plus simple HTML, each with a link in.
// Times are written on the lab's clock (mailTime), never as raw ISO timestamps; links start at
// the address the server is reached at (config.publicUrl: PUBLIC_URL, else HOST:PORT).
import { mailDay, mailTime } from './lab-time';
export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

export function compose(subject: string, lines: string[], link: { url: string; label: string }): MailContent {
  const text = [...lines, '', `${link.label}: ${link.url}`, '', '— Voltcrib, the lab’s HV gear register'].join('\n');
  const html = [
    '<div style="font-family: sans-serif; font-size: 16px; line-height: 1.5">',
    ...lines.map((l) => (l ? `<p>${escapeHtml(l)}</p>` : '')),
    `<p><a href="${escapeHtml(link.url)}">${escapeHtml(link.label)}</a></p>`,
    '<p style="color:#555">— Voltcrib, the lab’s HV gear register</p>',
    '</div>',
  ].join('\n');
  return { subject, text, html };
}

export interface BookingFacts {
  id: number;
  personName: string;
  itemTags: string[];
  plannedKv: number;
  endsAt: string;
  purpose: string;
}

export interface DueItem {
  tag: string;
  name: string;
  dueOn: string;
}

export const messages = {
  overdueToMember(baseUrl: string, b: BookingFacts): MailContent {
    return compose(
      `Overdue: return HV gear from booking #${b.id}`,
      [
        `Hello ${b.personName},`,
        `Your booking #${b.id} ended ${mailTime(b.endsAt)} and its gear is still out: ${b.itemTags.join(', ')}.`,
        'Make it safe (switch off, unplug, ground with the stick, measure the residual voltage) and return it at the counter.',
      ],
      { url: `${baseUrl}/bookings/${b.id}`, label: 'Open the booking' },
    );
  },
  overdueToOfficer(baseUrl: string, b: BookingFacts, graceMin: number): MailContent {
    return compose(
      `Overdue more than ${graceMin} min: booking #${b.id} (${b.personName})`,
      [
        `Booking #${b.id} by ${b.personName} (${b.plannedKv} kV, ${b.purpose}) ended ${mailTime(b.endsAt)}, and the gear has not come back: ${b.itemTags.join(', ')}.`,
        'Please check that the setup has been made safe.',
      ],
      { url: `${baseUrl}/bookings/${b.id}`, label: 'Open the booking' },
    );
  },
  approvalRequested(baseUrl: string, b: BookingFacts, reasons: string[]): MailContent {
    return compose(
      `Approval needed: ${b.plannedKv} kV test by ${b.personName} (booking #${b.id})`,
      [`${b.personName} asks to run: ${b.purpose}.`, `Gear: ${b.itemTags.join(', ')}.`, 'Why approval is needed:', ...reasons.map((r) => `• ${r}`)],
      { url: `${baseUrl}/approvals`, label: 'Open the approval queue' },
    );
  },
  benchRunBeyondPlan(baseUrl: string, b: BookingFacts, run: { number: number; appliedKv: number; currentMa: number }, reasons: string[]): MailContent {
    return compose(
      `Beyond the approved plan: booking #${b.id} (${b.personName}), run ${run.number}`,
      [
        `${b.personName} recorded run ${run.number} at ${run.appliedKv} kV and ${run.currentMa} mA on booking #${b.id} (${b.purpose}), beyond the plan you approved:`,
        ...reasons.map((r) => `• ${r}`),
        'Later runs beyond the plan are recorded and flagged on the booking without another e-mail.',
      ],
      { url: `${baseUrl}/bookings/${b.id}`, label: 'Open the booking' },
    );
  },
  approvalDecided(baseUrl: string, b: BookingFacts, decision: 'approve' | 'refuse', officerName: string, note: string | null): MailContent {
    const approved = decision === 'approve';
    return compose(
      `${approved ? 'Approved' : 'Refused'}: your ${b.plannedKv} kV test (booking #${b.id})`,
      [
        `Hello ${b.personName},`,
        `${officerName} ${approved ? 'approved' : 'refused'} your test plan "${b.purpose}".`,
        note ? `${approved ? 'Conditions' : 'Reason'}: ${note}` : '',
        approved ? 'At the counter: scan each item, complete the pre-energize checklist, then release.' : 'You can change the plan and ask again.',
      ],
      { url: `${baseUrl}/bookings/${b.id}`, label: 'Open the booking' },
    );
  },
  /** `actionLines`: corrective actions of incidents past their due date (incident-messages.ts). */
  inspectionDigest(baseUrl: string, overdue: DueItem[], soon: DueItem[], today: string, actionLines: string[] = []): MailContent {
    const line = (i: DueItem) => `${i.tag} ${i.name}: due ${mailDay(i.dueOn)}`;
    return compose(
      `Inspections: ${overdue.length} overdue, ${soon.length} due within 7 days (${mailDay(today)})`,
      [
        overdue.length ? 'Overdue (cannot be released until inspected):' : '',
        ...overdue.slice(0, 50).map(line),
        soon.length ? 'Due within 7 days (cannot be released after the date):' : '',
        ...soon.slice(0, 50).map(line),
        overdue.length + soon.length > 100 ? 'More items are due; see the gear list.' : '',
        ...actionLines,
      ].filter(Boolean),
      { url: `${baseUrl}/gear`, label: 'Open the gear list' },
    );
  },
  invitation(baseUrl: string, name: string, inviterName: string, token: string, expiresAt: string): MailContent {
    return compose(
      'You are invited to Voltcrib',
      [
        `Hello ${name},`,
        `${inviterName} added you to the lab's Voltcrib, where the shared high-voltage gear is booked and released.`,
        `Set your password with the link below. It works once and expires ${mailTime(expiresAt)}.`,
      ],
      { url: `${baseUrl}/invitation/${token}`, label: 'Set your password' },
    );
  },
  passwordReset(baseUrl: string, name: string, token: string, expiresAt: string): MailContent {
    return compose(
      'Reset your Voltcrib password',
      [
        `Hello ${name},`,
        'Someone (hopefully you) asked to reset your Voltcrib password.',
        `The link below works once and expires ${mailTime(expiresAt)}. If you did not ask, ignore this e-mail.`,
      ],
      { url: `${baseUrl}/reset-password/${token}`, label: 'Choose a new password' },
    );
  },
  bookingsCancelledOnDeactivation(baseUrl: string, personName: string, bookingIds: number[]): MailContent {
    return compose(
      `Bookings of ${personName} cancelled`,
      [
        `${personName}'s account was deactivated, so their bookings that were not yet released were cancelled: ${bookingIds.map((id) => `booking ${id}`).join(', ')}.`,
        'Gear they already have out stays listed as needing return until it is back.',
      ],
      { url: `${baseUrl}/bookings`, label: 'Open the bookings' },
    );
  },
};
