/**
 * How far a value can be trusted. Mirrors the markers of the domain brief so the UI can show,
 * beside every computed number, whether it rests on a confirmed standard or on memory.
 */
export type Marker =
  | 'confirmed' // [C] read in a stored copy of the source
  | 'partly-confirmed' // [P] secondary source, or only part of the row/edition seen
  | 'from-memory' // [M] unconfirmed: check against the purchased standard before relying on it
  | 'common-practice' // [CP] lab practice without one normative source: keep it configurable
  | 'derived'; // [D] arithmetic on confirmed formulas

/** A threshold taken from a standard or from lab practice, kept as data so editions can change. */
export interface SourcedValue {
  readonly value: number;
  readonly unit: string;
  readonly source: string;
  readonly edition: string;
  readonly marker: Marker;
}
