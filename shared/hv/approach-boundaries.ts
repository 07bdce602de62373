import { NFPA70E_AC_TABLE, NFPA70E_DC_TABLE, type ApproachBoundaryRow, type ApproachBoundaryTable } from './data/nfpa70e';
import type { Marker } from './data/types';
import { HvInputError } from './errors';
import { requireNonNegative, requireOneOf } from './validate';

export type VoltageSystem = 'dc' | 'ac';
export const VOLTAGE_SYSTEMS: readonly VoltageSystem[] = ['dc', 'ac'];

export interface ApproachBoundaryInput {
  /** DC: the peak (no-load maximum) voltage. AC: nominal phase-to-phase rms, as the table uses. */
  readonly voltageV: number;
  readonly system: VoltageSystem;
}

export interface ApproachBoundaries {
  /** Limited approach boundary for an exposed movable conductor; null where the table sets none. */
  readonly limitedMovableM: number | null;
  /** Limited approach boundary for an exposed fixed circuit part. */
  readonly limitedFixedM: number | null;
  /** Restricted approach boundary; null for "Avoid contact" and "Not specified". */
  readonly restrictedM: number | null;
  /** The table's own printed text for each cell, never a conversion of the metric value. */
  readonly limitedMovableImperial: string;
  readonly limitedFixedImperial: string;
  readonly restrictedImperial: string;
  readonly rowLabel: string;
  readonly table: string;
  readonly edition: string;
  readonly marker: Marker;
  readonly imperialMarker: Marker;
  readonly source: string;
  /** Below the lowest row with distances: the table sets no boundary. */
  readonly notSpecified: boolean;
  /** The row exists in the table but lies beyond the equipment this tool is meant for. */
  readonly outsideToolScope: boolean;
}

const TABLES: Record<VoltageSystem, ApproachBoundaryTable> = { dc: NFPA70E_DC_TABLE, ac: NFPA70E_AC_TABLE };

/**
 * Picks the row for a voltage. The table's rows leave gaps (1 kV … 1.1 kV) and share edges
 * (5 kV opens one row and closes another); in both cases the higher row wins, because its
 * boundaries are the larger ones (the brief's protective rule). So: take the highest row whose
 * lower limit is at or below the voltage, and step up one row if the voltage is past its top.
 */
export function selectBoundaryRow(table: ApproachBoundaryTable, voltageV: number): ApproachBoundaryRow {
  let index = -1;
  table.rows.forEach((row, i) => {
    if (row.lowerV <= voltageV) index = i;
  });
  const row = table.rows[index];
  if (row === undefined) {
    throw new HvInputError('voltageV', `voltageV is below the lowest row of ${table.title}`);
  }
  if (voltageV <= row.upperV) return row;
  const next = table.rows[index + 1];
  if (next === undefined) {
    // Returning the top row above its range would understate the distances; refuse instead.
    throw new HvInputError('voltageV', `voltageV is above the highest row of ${table.title} (${row.label})`);
  }
  return next;
}

/**
 * NFPA 70E shock approach boundaries (DC Table 130.4(E)(b), AC Table 130.4(E)(a)) for one voltage.
 * Above the highest row the function throws, since the table gives no distances there.
 */
export function approachBoundaries({ voltageV, system }: ApproachBoundaryInput): ApproachBoundaries {
  const v = requireNonNegative(voltageV, 'voltageV');
  const table = TABLES[requireOneOf(system, VOLTAGE_SYSTEMS, 'system')];
  const row = selectBoundaryRow(table, v);
  return {
    limitedMovableM: row.limitedMovableM,
    limitedFixedM: row.limitedFixedM,
    restrictedM: row.restrictedM,
    limitedMovableImperial: row.limitedMovableImperial,
    limitedFixedImperial: row.limitedFixedImperial,
    restrictedImperial: row.restrictedImperial,
    rowLabel: row.label,
    table: table.title,
    edition: row.edition,
    marker: row.marker,
    imperialMarker: row.imperialMarker,
    source: row.source,
    notSpecified: row.notSpecified,
    outsideToolScope: row.outsideToolScope,
  };
}

/** Highest voltage each table covers; above it `approachBoundaries` throws. */
export function approachTableMaxV({ system }: { readonly system: VoltageSystem }): number {
  const rows = TABLES[requireOneOf(system, VOLTAGE_SYSTEMS, 'system')].rows;
  return rows[rows.length - 1]?.upperV ?? 0;
}
