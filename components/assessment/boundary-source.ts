// What a member reads under a barrier distance: which table, which edition, and that their own
// copy of the standard is the authority. How far each row was confirmed (markers, where a row was
// read) stays in shared/hv/data and shared/hv/README.md, where the people maintaining it look.

// Bookings store their assessment (shared/rules/assessment.ts) with the row's `source` and
// `edition` only, so the words are read from those texts; the Planner also has the table title.
interface BoundarySource {
  /** The row's source, e.g. "NFPA 70E Table 130.4(E)(b), row from memory …". */
  readonly source: string;
  /** The row's edition, e.g. "NFPA 70E-2021" or "older edition (year not recorded)". */
  readonly edition: string;
  /** The table's title, when known: "NFPA 70E Table 130.4(E)(b), shock approach boundaries, DC …". */
  readonly table?: string;
}

const TABLE_NUMBER = /Table\s+[\d.]+(?:\([A-Za-z]\))*/;
// The AC rows taken from an older edition name no table number in their source text.
const AC_TABLE = 'Table 130.4(E)(a)';

export const CHECK_YOUR_COPY = 'check against your copy of the standard';

/** "NFPA 70E-2021 Table 130.4(E)(b); check against your copy of the standard". */
export function boundarySourceWords(b: BoundarySource): string {
  const tableNumber =
    TABLE_NUMBER.exec(b.table ?? '')?.[0] ?? TABLE_NUMBER.exec(b.source)?.[0] ?? (/\bAC\b/.test(b.source) ? AC_TABLE : 'approach-boundary table');
  const year = /NFPA 70E-(\d{4})/.exec(b.edition)?.[1] ?? /NFPA 70E-(\d{4})/.exec(b.source)?.[1];
  const standard = year ? `NFPA 70E-${year}` : 'NFPA 70E';
  const older = /older edition/i.test(b.edition) ? ' (values from an earlier edition)' : '';
  return `${standard} ${tableNumber}${older}; ${CHECK_YOUR_COPY}`;
}
