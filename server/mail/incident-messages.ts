// The e-mail words for incidents: the officers' (and, for a shock or burn, the lab manager's)
// notice of a new report, and the line the inspection digest adds for past-due corrective actions.
import { incidentKindWords, incidentSeverityWords, type IncidentKind, type IncidentSeverity } from '../../shared/schemas/incidents';
import { mailDay, mailTime } from './lab-time';
import { compose, type MailContent } from './messages';

export interface IncidentFacts {
  id: number;
  kind: IncidentKind;
  severity: IncidentSeverity;
  occurredAt: string;
  location: string;
  description: string;
  reporterName: string;
  itemTags: string[];
  taggedOutTags: string[];
  bookingId: number | null;
}

export function incidentReported(baseUrl: string, i: IncidentFacts): MailContent {
  const kind = incidentKindWords[i.kind].label;
  const severity = incidentSeverityWords[i.severity];
  return compose(
    `Incident reported: ${kind.toLowerCase()}, ${severity.label.toLowerCase()} (#${i.id})`,
    [
      `${i.reporterName} reported ${kind.toLowerCase()} at ${i.location}, ${mailTime(i.occurredAt)}.`,
      `Severity: ${severity.label} — ${severity.definition}`,
      `What happened: ${i.description}`,
      i.itemTags.length > 0 ? `Gear involved: ${i.itemTags.join(', ')}.` : 'No gear was named.',
      i.taggedOutTags.length > 0 ? `Taken out of service now: ${i.taggedOutTags.join(', ')}.` : '',
      i.bookingId !== null ? `Booking: #${i.bookingId}.` : '',
      'Please review it: move it to under review, record the cause and the corrective actions, then close it.',
    ].filter(Boolean),
    { url: `${baseUrl}/incidents/${i.id}`, label: 'Open the incident' },
  );
}

export interface PastDueAction {
  incidentId: number;
  action: string;
  ownerName: string;
  dueOn: string;
}

export function pastDueActionLines(actions: PastDueAction[]): string[] {
  if (actions.length === 0) return [];
  return [
    'Corrective actions past due:',
    ...actions.slice(0, 50).map((a) => `${a.action} (${a.ownerName}, due ${mailDay(a.dueOn)}, incident #${a.incidentId})`),
  ];
}
