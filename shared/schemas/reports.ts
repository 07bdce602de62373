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

/** One item on the "inspections due" list; `never` blocks release just as `overdue` does. */
export interface InspectionDue {
  id: number;
  tag: string;
  name: string;
  kind: string;
  location: string;
  status: string;
  nextInspectionDue: string | null;
  state: 'never' | 'overdue' | 'soon';
}

export interface InspectionsDueReport {
  items: InspectionDue[];
  /** More items are due than the list holds; the CSV has them all. */
  more: boolean;
}

/** The officer's and manager's desk on Today: counts of what needs someone now. */
export interface DeskOverview {
  gearOut: number;
  overdue: number;
  approvalsWaiting: number;
  taggedOut: number;
  inspections: { neverDone: number; overdue: number; dueSoon: number };
}
