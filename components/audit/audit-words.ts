// An audit entry in the lab's words: one sentence saying who did what to which booking, item or
// person, an optional detail line, and where the entry's subject can be opened. The stored
// values (before/after) stay available under the row for an inspector.
import type { Href } from 'expo-router';

import { formatKv } from '@/components/assessment/quantities';
import { roleLabels } from '@/components/common/roles';
import { formatDay } from '@/components/items/format-dates';
import type { AuditEvent } from '@/shared/schemas/audit';
import { incidentKindWords, type IncidentKind } from '@/shared/schemas/incidents';
import type { Role } from '@/shared/schemas/session';

export interface AuditWords {
  sentence: string;
  detail: string | null;
  link: { href: Href; label: string } | null;
}

type Values = Record<string, unknown>;

function values(value: unknown): Values {
  return typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as Values) : {};
}

function text(value: unknown): string | null {
  return typeof value === 'string' && value.trim() !== '' ? value : null;
}

function num(value: unknown): number | null {
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}

function list(tags: readonly string[] | undefined): string {
  if (!tags || tags.length === 0) return 'its gear';
  return tags.length <= 4 ? tags.join(', ') : `${tags.slice(0, 3).join(', ')} and ${tags.length - 3} more`;
}

const LAB_RULE_WORDS: Record<string, string> = {
  approvalKv: 'approval voltage',
  energyThresholdJ: 'energy threshold',
  ratingMarginPct: 'rating margin',
  interlockKv: 'interlock voltage',
  safeResidualV: 'safe residual voltage',
  earlyPickupMin: 'early pick-up',
  overdueGraceMin: 'overdue grace',
};

const ITEM_FIELD_WORDS: Record<string, string> = {
  name: 'name',
  kind: 'kind',
  make: 'make',
  model: 'model',
  serial: 'serial number',
  location: 'location',
  notes: 'notes',
  ratings: 'ratings',
  inspectionIntervalDays: 'inspection interval',
  status: 'status',
  statusReason: 'status reason',
};

/** Keys whose values differ between before and after, in words where known. */
function changedFields(before: unknown, after: unknown, words: Record<string, string>): string | null {
  const b = values(before);
  const a = values(after);
  const changed = Object.keys(a).filter((key) => JSON.stringify(b[key]) !== JSON.stringify(a[key]));
  if (changed.length === 0) return null;
  return `Changed: ${changed.map((key) => words[key] ?? key).join(', ')}`;
}

export function auditWords(event: AuditEvent): AuditWords {
  const who = event.actorName ?? 'Voltcrib';
  const after = values(event.after);
  const subject = event.subject ?? {};
  const id = event.entityId;
  const booking = `booking #${id}`;
  const bookingLink = { href: `/bookings/${id}` as Href, label: `Open booking #${id}` };
  const item = subject.tag ? `${subject.tag} (${subject.name ?? 'item'})` : `item #${id}`;
  const itemLink = { href: `/gear/${id}` as Href, label: `Open ${subject.tag ?? `item #${id}`}` };
  const personName = subject.personName ?? `person #${id}`;
  const incidentLink = { href: `/incidents/${id}` as Href, label: `Open incident #${id}` };
  const say = (sentence: string, detail: string | null, link: AuditWords['link']): AuditWords => ({ sentence, detail, link });

  switch (event.action) {
    case 'booking.created': {
      const plan = values(after.plan);
      const kv = num(plan.plannedKv);
      const waits = after.status === 'awaiting-approval' ? '; it waits for a safety officer' : '';
      return say(
        `${who} booked ${list(subject.tags)}${kv !== null ? ` for a test at ${formatKv(kv)}` : ''} (${booking})${waits}.`,
        text(plan.purpose),
        bookingLink,
      );
    }
    case 'booking.updated':
      return say(`${who} changed the window or gear of ${booking}.`, null, bookingLink);
    case 'booking.plan-changed':
      return say(`${who} changed the test plan of ${booking}, so it is assessed (and, where needed, approved) again.`, null, bookingLink);
    case 'booking.cancelled':
      return say(`${who} cancelled ${booking}.`, null, bookingLink);
    case 'booking.cancelled-on-deactivation':
      return say(`${who} deactivated the person who booked ${booking}, so it was cancelled.`, null, bookingLink);
    case 'booking.gear-changed':
      return say(`${who} changed the ratings of gear in ${booking}, so it is assessed (and, where needed, approved) again.`, null, bookingLink);
    case 'approval.voided':
      return say(`The approval of ${booking} no longer counts: what it covered changed.`, null, bookingLink);
    case 'approval.granted':
      return say(
        `${who} approved ${booking}${subject.personName ? ` for ${subject.personName}` : ''}.`,
        text(after.conditions) ? `Conditions: ${text(after.conditions)}` : null,
        bookingLink,
      );
    case 'approval.refused':
      return say(
        `${who} refused ${booking}${subject.personName ? ` for ${subject.personName}` : ''}.`,
        text(after.reason) ? `Reason: ${text(after.reason)}` : null,
        bookingLink,
      );
    case 'booking.item-scanned':
      return say(`${who} scanned ${text(after.tag) ?? 'an item'} at the counter for ${booking}.`, null, bookingLink);
    case 'booking.photo-added':
      return say(`${who} added a checklist photo to ${booking}.`, null, bookingLink);
    case 'checklist.pre-completed':
    case 'checklist.return-completed': {
      const which = event.action === 'checklist.pre-completed' ? 'pre-energize' : 'make-safe';
      const within = after.withinLimits === false ? 'a reading was outside its limits' : 'every reading within its limits';
      return say(`${who} answered the ${which} checklist of ${booking}: ${within}.`, null, bookingLink);
    }
    case 'booking.released': {
      const kv = num(after.plannedKv);
      return say(`${who} released ${list(subject.tags)} for ${booking}${kv !== null ? `, up to ${formatKv(kv)}` : ''}.`, null, bookingLink);
    }
    case 'booking.returned': {
      const damaged = Array.isArray(after.damagedItemIds) ? after.damagedItemIds.length : 0;
      const late = after.late === true ? ' late' : '';
      const damage = damaged > 0 ? `, ${damaged} item${damaged === 1 ? '' : 's'} reported damaged` : '';
      return say(`${who} took back the gear of ${booking}${late}${damage}.`, text(after.notes), bookingLink);
    }
    case 'item.created':
      return say(`${who} registered ${item}.`, null, itemLink);
    case 'item.updated':
      return say(`${who} changed the details of ${item}.`, changedFields(event.before, event.after, ITEM_FIELD_WORDS), itemLink);
    case 'item.tagged-out':
      return say(`${who} tagged ${item} out of service.`, text(after.statusReason), itemLink);
    case 'item.tagged-out-at-return':
      return say(`${who} tagged ${item} out of service when it came back damaged.`, text(after.statusReason), itemLink);
    case 'item.tagged-out-for-incident':
      return say(`${who} tagged ${item} out of service with an incident report.`, text(after.statusReason), itemLink);
    case 'incident.reported': {
      const kind = text(after.kind);
      const severity = text(after.severity);
      const words = kind && kind in incidentKindWords ? incidentKindWords[kind as IncidentKind].label.toLowerCase() : 'an incident';
      const out = Array.isArray(after.taggedOut) && after.taggedOut.length > 0 ? `; ${(after.taggedOut as string[]).join(', ')} taken out of service` : '';
      return say(`${who} reported ${words}${severity ? ` (${severity})` : ''} as incident #${id}${out}.`, text(after.description), incidentLink);
    }
    case 'incident.under-review':
      return say(`${who} started reviewing incident #${id}.`, null, incidentLink);
    case 'incident.reopened':
      return say(`${who} set incident #${id} back to open.`, null, incidentLink);
    case 'incident.updated':
      return say(`${who} updated the review of incident #${id}.`, text(after.cause) ? `Cause: ${text(after.cause)}` : null, incidentLink);
    case 'incident.closed':
      return say(
        `${who} closed incident #${id} with its cause and corrective actions.`,
        text(after.cause) ? `Cause: ${text(after.cause)}` : null,
        incidentLink,
      );
    case 'incident.action-done':
      return say(`${who} marked a corrective action of incident #${id} done.`, text(after.action), incidentLink);
    case 'incident.action-reopened':
      return say(`${who} marked a corrective action of incident #${id} not done after all.`, text(after.action), incidentLink);
    case 'incident.photo-added':
      return say(`${who} added a photo to incident #${id}.`, null, incidentLink);
    case 'calendar-feed.created':
      return say(`${who} turned on their private calendar feed.`, null, null);
    case 'calendar-feed.rotated':
      return say(`${who} gave their calendar feed a new address; the old one no longer works.`, null, null);
    case 'calendar-feed.revoked':
      return say(`${who} turned off their calendar feed.`, null, null);
    case 'item.cleared':
      return say(`${who} put ${item} back in service.`, null, itemLink);
    case 'item.retired':
      return say(`${who} retired ${item}.`, text(after.statusReason), itemLink);
    case 'item.file-added':
      return say(`${who} added ${text(after.fileName) ? `the file “${text(after.fileName)}”` : 'a file'} to ${item}.`, null, itemLink);
    case 'inspection.pass': {
      const due = text(after.nextDue);
      return say(`${who} recorded a passed inspection of ${item}${due ? `; next due ${formatDay(due)}` : ''}.`, text(after.notes), itemLink);
    }
    case 'inspection.fail':
      return say(`${who} recorded a failed inspection of ${item}; it is out of service until repaired.`, text(after.notes), itemLink);
    case 'lab-rules.confirmed':
      return say(`${who} confirmed the lab rules, so they now apply to everyone.`, null, { href: '/lab-rules', label: 'Open the lab rules' });
    case 'lab-rules.updated':
      return say(`${who} changed the lab rules.`, changedFields(event.before, event.after, LAB_RULE_WORDS), {
        href: '/lab-rules',
        label: 'Open the lab rules',
      });
    case 'checklist-template.created':
    case 'checklist-template.updated':
    case 'checklist-template.retired': {
      const verb = { 'checklist-template.created': 'added', 'checklist-template.updated': 'changed', 'checklist-template.retired': 'retired' }[event.action];
      const line = text(after.text) ?? subject.text ?? text(values(event.before).text);
      return say(`${who} ${verb} the checklist line ${line ? `“${line}”` : `#${id}`}.`, null, { href: '/lab-rules', label: 'Open the checklist lines' });
    }
    case 'person.invited': {
      const role = text(after.role) as Role | null;
      return say(
        `${who} invited ${text(after.name) ?? personName}${role && roleLabels[role] ? ` as ${roleLabels[role].toLowerCase()}` : ''}.`,
        text(after.email),
        null,
      );
    }
    case 'person.invitation-accepted':
      return say(`${personName} accepted the invitation and set a password.`, null, null);
    case 'person.password-reset':
      return say(`${personName} chose a new password with a reset link.`, null, null);
    case 'person.password-reset-requested':
      return say(`A password reset link was sent to ${personName}.`, null, null);
    case 'person.deactivated':
      return say(`${who} deactivated ${personName}'s account.`, null, null);
    case 'person.reactivated':
      return say(`${who} reactivated ${personName}'s account.`, null, null);
    case 'person.updated':
      return say(`${who} changed ${personName}'s role or group.`, null, null);
    case 'qualification.set': {
      const kv = num(after.authorisedKv);
      const until = text(after.expiresOn);
      return say(
        `${who} recorded ${personName}'s qualification${kv !== null ? `: up to ${formatKv(kv)}` : ''}${until ? `, valid until ${formatDay(until)}` : ''}.`,
        text(after.notes),
        { href: '/qualifications', label: 'Open qualifications' },
      );
    }
    default:
      // A new kind of entry not worded yet: still say who and what it concerns, never nothing.
      return say(`${who} made a change to ${event.entity} #${id}.`, null, event.entity === 'booking' ? bookingLink : event.entity === 'item' ? itemLink : null);
  }
}
