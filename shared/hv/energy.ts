import { requireFiniteResult, requireNonNegative } from './validate';

export interface CapacitorInput {
  readonly capacitanceF: number;
  readonly voltageV: number;
}

export interface CapacitorState {
  readonly energyJ: number;
  readonly chargeC: number;
  readonly source: string;
}

const SOURCE = 'E = ½CV², Q = CV (textbook electrostatics)';

/** E = ½ C V². Voltage is a magnitude: give the peak, whatever the polarity. */
export function storedEnergyJ({ capacitanceF, voltageV }: CapacitorInput): number {
  const c = requireNonNegative(capacitanceF, 'capacitanceF');
  const v = requireNonNegative(voltageV, 'voltageV');
  return requireFiniteResult(0.5 * c * v * v, 'voltageV');
}

/** Q = C V. */
export function storedChargeC({ capacitanceF, voltageV }: CapacitorInput): number {
  const c = requireNonNegative(capacitanceF, 'capacitanceF');
  const v = requireNonNegative(voltageV, 'voltageV');
  return requireFiniteResult(c * v, 'voltageV');
}

/** Both at once, with the source, for the energy calculator. */
export function capacitorEnergy(input: CapacitorInput): CapacitorState {
  return { energyJ: storedEnergyJ(input), chargeC: storedChargeC(input), source: SOURCE };
}
