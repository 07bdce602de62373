// Response shapes of the audit trail, shared by the server and the app.

/** What an entry is about, as the lab names it (read when the page is listed, not stored). */
export interface AuditSubject {
  /** Item: its tag and name. */
  tag?: string;
  name?: string;
  /** Booking: who booked it and its gear's tags. */
  personName?: string;
  tags?: string[];
  /** Checklist line: its text. */
  text?: string;
}

export interface AuditEvent {
  id: number;
  at: string;
  actorId: number | null;
  actorName: string | null;
  entity: string;
  entityId: string;
  action: string;
  before: unknown;
  after: unknown;
  subject: AuditSubject | null;
}

export interface AuditPage {
  events: AuditEvent[];
  nextCursor: string | null;
}

export interface AuditVerification {
  ok: boolean;
  checked: number;
  brokenAtId: number | null;
}
