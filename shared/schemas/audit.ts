// Response shapes of the audit trail, shared by the server and the app.
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
