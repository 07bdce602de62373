import type { Marker } from './types';

/**
 * NFPA 70E shock-protection approach boundaries as versioned data.
 *
 * Each row keeps the table's own imperial text: the printed feet-and-inches are not exact
 * conversions of the metric values (1.0 m is printed as 3 ft 6 in), so the UI must show the
 * text, never a conversion. A `null` distance means the table prints no distance for that cell;
 * its text ("Avoid contact", "Not specified") is in the matching `…Imperial` field.
 *
 * Row limits are inclusive as printed. Gaps between rows (1 kV … 1.1 kV) and shared edges (5 kV
 * appears in two DC rows) are resolved to the higher, more protective row by the lookup.
 */
export interface ApproachBoundaryRow {
  /** Printed lower limit, inclusive (0 for the "< 50 V" row). */
  readonly lowerV: number;
  /** Printed upper limit, inclusive except for the "< 50 V" row, which the next row overrides. */
  readonly upperV: number;
  readonly label: string;
  readonly limitedMovableM: number | null;
  readonly limitedFixedM: number | null;
  readonly restrictedM: number | null;
  readonly limitedMovableImperial: string;
  readonly limitedFixedImperial: string;
  readonly restrictedImperial: string;
  /** Trust in the metric values (and the row as a whole). */
  readonly marker: Marker;
  /** Trust in the printed imperial texts, where the brief rates them separately. */
  readonly imperialMarker: Marker;
  readonly source: string;
  readonly edition: string;
  /** True for the "< 50 V" row: the table sets no boundary there. */
  readonly notSpecified: boolean;
  /** True where the row exists in the table but is beyond the equipment this tool is meant for. */
  readonly outsideToolScope: boolean;
}

export interface ApproachBoundaryTable {
  readonly id: string;
  readonly title: string;
  readonly edition: string;
  readonly editionNote: string;
  /** Ascending by voltage. */
  readonly rows: readonly ApproachBoundaryRow[];
}

const NOT_SPECIFIED = 'Not specified';
const AVOID_CONTACT = 'Avoid contact';

const DECK_2021 = 'NFPA 70E-2021 Table 130.4(E)(b), metric values as paraphrased in a 2021 training deck';
const NOT_SEEN = 'NFPA 70E Table 130.4(E)(b), row from memory (not seen in stored material)';

export const NFPA70E_DC_TABLE: ApproachBoundaryTable = {
  id: 'nfpa70e-2021-130.4(E)(b)',
  title: 'NFPA 70E Table 130.4(E)(b), shock approach boundaries, DC voltage systems',
  edition: 'NFPA 70E-2021 (numbered 130.4(D)(b) in the 2015 and 2018 editions)',
  editionNote:
    'The 2021 table starts at 50 V; a 2024 explainer says the DC table covers systems from below 100 V, and the 2015 edition used 100 V. Anything ≥ 50 V DC is treated as inside the table, the protective choice.',
  rows: [
    {
      lowerV: 0,
      upperV: 50,
      label: '< 50 V',
      limitedMovableM: null,
      limitedFixedM: null,
      restrictedM: null,
      limitedMovableImperial: NOT_SPECIFIED,
      limitedFixedImperial: NOT_SPECIFIED,
      restrictedImperial: NOT_SPECIFIED,
      marker: 'partly-confirmed',
      imperialMarker: 'partly-confirmed',
      source: DECK_2021,
      edition: 'NFPA 70E-2021',
      notSpecified: true,
      outsideToolScope: false,
    },
    {
      lowerV: 50,
      upperV: 300,
      label: '50 V – 300 V',
      limitedMovableM: 3.0,
      limitedFixedM: 1.0,
      restrictedM: null,
      limitedMovableImperial: '10 ft 0 in',
      limitedFixedImperial: '3 ft 6 in',
      restrictedImperial: AVOID_CONTACT,
      marker: 'partly-confirmed',
      imperialMarker: 'from-memory',
      source: `${DECK_2021}; imperial texts from memory`,
      edition: 'NFPA 70E-2021',
      notSpecified: false,
      outsideToolScope: false,
    },
    {
      lowerV: 301,
      upperV: 1_000,
      label: '301 V – 1 kV',
      limitedMovableM: 3.0,
      limitedFixedM: 1.0,
      restrictedM: 0.3,
      limitedMovableImperial: '10 ft 0 in',
      limitedFixedImperial: '3 ft 6 in',
      restrictedImperial: '1 ft 0 in',
      marker: 'confirmed',
      imperialMarker: 'confirmed',
      source: `${DECK_2021}; 500 V DC worked example (fixed LAB 3 ft 6 in, RAB 1 ft) in a published code-course text`,
      edition: 'NFPA 70E-2021',
      notSpecified: false,
      outsideToolScope: false,
    },
    {
      lowerV: 1_100,
      upperV: 5_000,
      label: '1.1 kV – 5 kV',
      limitedMovableM: 3.0,
      limitedFixedM: 1.5,
      restrictedM: 0.5,
      limitedMovableImperial: '10 ft 0 in',
      limitedFixedImperial: '5 ft 0 in',
      restrictedImperial: '1 ft 5 in',
      marker: 'partly-confirmed',
      imperialMarker: 'from-memory',
      source: `${DECK_2021}; imperial texts from memory`,
      edition: 'NFPA 70E-2021',
      notSpecified: false,
      outsideToolScope: false,
    },
    {
      lowerV: 5_000,
      upperV: 15_000,
      label: '5 kV – 15 kV',
      limitedMovableM: 3.0,
      limitedFixedM: 1.5,
      restrictedM: 0.7,
      limitedMovableImperial: '10 ft 0 in',
      limitedFixedImperial: '5 ft 0 in',
      restrictedImperial: '2 ft 2 in',
      marker: 'partly-confirmed',
      imperialMarker: 'from-memory',
      source: `${DECK_2021}; imperial texts from memory`,
      edition: 'NFPA 70E-2021',
      notSpecified: false,
      outsideToolScope: false,
    },
    {
      lowerV: 15_100,
      upperV: 45_000,
      label: '15.1 kV – 45 kV',
      limitedMovableM: 3.0,
      limitedFixedM: 2.5,
      restrictedM: 0.8,
      limitedMovableImperial: '10 ft 0 in',
      limitedFixedImperial: '8 ft 0 in',
      restrictedImperial: '2 ft 9 in',
      marker: 'from-memory',
      imperialMarker: 'from-memory',
      source: NOT_SEEN,
      edition: 'NFPA 70E-2021',
      notSpecified: false,
      outsideToolScope: false,
    },
    {
      lowerV: 45_100,
      upperV: 75_000,
      label: '45.1 kV – 75 kV',
      limitedMovableM: 3.0,
      limitedFixedM: 2.5,
      restrictedM: 1.0,
      limitedMovableImperial: '10 ft 0 in',
      limitedFixedImperial: '8 ft 0 in',
      restrictedImperial: '3 ft 2 in',
      marker: 'from-memory',
      imperialMarker: 'from-memory',
      source: `${NOT_SEEN}; a continuing-education quiz offering 8 ft for the fixed LAB at 70 kV DC is consistent`,
      edition: 'NFPA 70E-2021',
      notSpecified: false,
      outsideToolScope: false,
    },
    {
      lowerV: 75_100,
      upperV: 150_000,
      label: '75.1 kV – 150 kV',
      limitedMovableM: 3.3,
      limitedFixedM: 3.0,
      restrictedM: 1.2,
      limitedMovableImperial: '10 ft 8 in',
      limitedFixedImperial: '10 ft 0 in',
      restrictedImperial: '4 ft 0 in',
      marker: 'from-memory',
      imperialMarker: 'from-memory',
      source: NOT_SEEN,
      edition: 'NFPA 70E-2021',
      notSpecified: false,
      outsideToolScope: false,
    },
    {
      lowerV: 150_100,
      upperV: 250_000,
      label: '150.1 kV – 250 kV',
      limitedMovableM: 3.6,
      limitedFixedM: 3.6,
      restrictedM: 1.6,
      limitedMovableImperial: '11 ft 8 in',
      limitedFixedImperial: '11 ft 8 in',
      restrictedImperial: '5 ft 3 in',
      marker: 'from-memory',
      imperialMarker: 'from-memory',
      source: NOT_SEEN,
      edition: 'NFPA 70E-2021',
      notSpecified: false,
      outsideToolScope: true,
    },
  ],
};

const OLDER_AC = 'NFPA 70E AC approach-boundary table of an older edition (year not recorded)';

export const NFPA70E_AC_TABLE: ApproachBoundaryTable = {
  id: 'nfpa70e-130.4(E)(a)',
  title: 'NFPA 70E Table 130.4(E)(a), shock approach boundaries, AC systems (nominal phase-to-phase, rms)',
  edition: 'NFPA 70E, Table 130.4(E)(a) numbering (2021 onward); upper rows from an older edition',
  editionNote:
    'Rows up to 15 kV were seen in current-edition examples; rows above 15 kV come from an older-edition table and should be checked against the edition the lab follows.',
  rows: [
    {
      lowerV: 0,
      upperV: 50,
      label: '< 50 V',
      limitedMovableM: null,
      limitedFixedM: null,
      restrictedM: null,
      limitedMovableImperial: NOT_SPECIFIED,
      limitedFixedImperial: NOT_SPECIFIED,
      restrictedImperial: NOT_SPECIFIED,
      marker: 'from-memory',
      imperialMarker: 'from-memory',
      source: 'NFPA 70E Table 130.4(E)(a), row from memory',
      edition: 'NFPA 70E (edition not recorded)',
      notSpecified: true,
      outsideToolScope: false,
    },
    {
      lowerV: 50,
      upperV: 150,
      label: '50 V – 150 V',
      limitedMovableM: 3.0,
      limitedFixedM: 1.0,
      restrictedM: null,
      limitedMovableImperial: '10 ft 0 in',
      limitedFixedImperial: '3 ft 6 in',
      restrictedImperial: AVOID_CONTACT,
      marker: 'from-memory',
      imperialMarker: 'from-memory',
      source: 'NFPA 70E Table 130.4(E)(a), row from memory',
      edition: 'NFPA 70E (edition not recorded)',
      notSpecified: false,
      outsideToolScope: false,
    },
    {
      lowerV: 151,
      upperV: 750,
      label: '151 V – 750 V',
      limitedMovableM: 3.0,
      limitedFixedM: 1.0,
      restrictedM: 0.3,
      limitedMovableImperial: '10 ft 0 in',
      limitedFixedImperial: '3 ft 6 in',
      restrictedImperial: '1 ft 0 in',
      marker: 'confirmed',
      imperialMarker: 'confirmed',
      source: 'NFPA 70E Table 130.4(E)(a); 208 V worked example (fixed LAB 3 ft 6 in, RAB 1 ft) and a 480 V clearance calculator',
      edition: 'NFPA 70E (130.4(E) numbering, 2021 onward)',
      notSpecified: false,
      outsideToolScope: false,
    },
    {
      lowerV: 751,
      upperV: 15_000,
      label: '751 V – 15 kV',
      limitedMovableM: 3.0,
      limitedFixedM: 1.5,
      restrictedM: 0.7,
      limitedMovableImperial: '10 ft 0 in',
      limitedFixedImperial: '5 ft 0 in',
      restrictedImperial: '2 ft 2 in',
      marker: 'confirmed',
      imperialMarker: 'confirmed',
      source: 'NFPA 70E Table 130.4(E)(a); clearance calculator at 15 kV (5 ft, 2 ft 2 in)',
      edition: 'NFPA 70E (130.4(E) numbering, 2021 onward)',
      notSpecified: false,
      outsideToolScope: false,
    },
    {
      lowerV: 15_100,
      upperV: 36_000,
      label: '15.1 kV – 36 kV',
      limitedMovableM: 3.0,
      limitedFixedM: 1.8,
      restrictedM: 0.8,
      limitedMovableImperial: '10 ft 0 in',
      limitedFixedImperial: '6 ft 0 in',
      restrictedImperial: '2 ft 7 in',
      marker: 'from-memory',
      imperialMarker: 'partly-confirmed',
      source: `${OLDER_AC} (6 ft 0 in / 2 ft 7 in); metric values from memory`,
      edition: 'older edition (year not recorded)',
      notSpecified: false,
      outsideToolScope: false,
    },
    {
      lowerV: 36_100,
      upperV: 46_000,
      label: '36.1 kV – 46 kV',
      limitedMovableM: 3.0,
      limitedFixedM: 2.5,
      restrictedM: 0.8,
      limitedMovableImperial: '10 ft 0 in',
      limitedFixedImperial: '8 ft 0 in',
      restrictedImperial: '2 ft 9 in',
      marker: 'partly-confirmed',
      imperialMarker: 'partly-confirmed',
      source: `${OLDER_AC} (8 ft / 2 ft 9 in)`,
      edition: 'older edition (year not recorded)',
      notSpecified: false,
      outsideToolScope: false,
    },
    {
      lowerV: 46_100,
      upperV: 72_500,
      label: '46.1 kV – 72.5 kV',
      limitedMovableM: 3.0,
      limitedFixedM: 2.5,
      restrictedM: 1.0,
      limitedMovableImperial: '10 ft 0 in',
      limitedFixedImperial: '8 ft 0 in',
      restrictedImperial: '3 ft 3 in',
      marker: 'partly-confirmed',
      imperialMarker: 'partly-confirmed',
      source: `${OLDER_AC} (8 ft / 3 ft 3 in)`,
      edition: 'older edition (year not recorded)',
      notSpecified: false,
      outsideToolScope: false,
    },
    {
      lowerV: 72_600,
      upperV: 121_000,
      label: '72.6 kV – 121 kV',
      limitedMovableM: 3.3,
      limitedFixedM: 2.5,
      restrictedM: 1.0,
      limitedMovableImperial: '10 ft 8 in',
      limitedFixedImperial: '8 ft 0 in',
      restrictedImperial: '3 ft 4 in',
      marker: 'partly-confirmed',
      imperialMarker: 'partly-confirmed',
      source: `${OLDER_AC} (10 ft 8 in / 8 ft / 3 ft 4 in)`,
      edition: 'older edition (year not recorded)',
      notSpecified: false,
      outsideToolScope: false,
    },
  ],
};
