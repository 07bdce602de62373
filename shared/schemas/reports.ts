// Response shapes of the manager's reports, shared by the server and the app.
export interface GroupUsage {
  groupName: string;
  bookings: number;
  hours: number;
  people: number;
}

export interface UsageReport {
  /** The instants the server counted between (ISO 8601). */
  from: string;
  to: string;
  groups: GroupUsage[];
}
