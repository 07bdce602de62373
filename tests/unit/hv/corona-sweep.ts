// Generated corona sweeps for the fit tests: I = C·V·(V − V₀) with multiplicative Gaussian noise
// from a seeded generator, so every run of the tests sees the same data.

/** mulberry32: a small, well-known 32-bit PRNG (public domain). */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates by Box–Muller. */
export function gaussian(random: () => number): () => number {
  return () => {
    const u = Math.max(random(), 1e-12);
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * random());
  };
}

export interface SweepSpec {
  cAPerV2: number;
  onsetV: number;
  voltagesV: number[];
  /** Relative standard deviation of the current readings, e.g. 0.02 for 2 %. */
  noise: number;
  seed: number;
  /**
   * 'reading' (default): noise proportional to each current reading, as a meter's percentage
   * error. 'constant': the same absolute scatter on every I/V, the least-squares assumption.
   */
  scatter?: 'reading' | 'constant';
}

export function coronaSweep({ cAPerV2, onsetV, voltagesV, noise, seed, scatter = 'reading' }: SweepSpec) {
  const normal = gaussian(seededRandom(seed));
  const top = cAPerV2 * Math.max(...voltagesV.map((v) => v - onsetV));
  return voltagesV.map((voltageV) => {
    const perVoltage = Math.max(0, cAPerV2 * (voltageV - onsetV));
    const noisy = scatter === 'reading' ? perVoltage * (1 + noise * normal()) : perVoltage + noise * top * normal();
    return { voltageV, currentA: voltageV * noisy };
  });
}

/** 7 kV to 14 kV in 0.5 kV steps. */
export const SWEEP_VOLTAGES_V = Array.from({ length: 15 }, (_, i) => 7000 + 500 * i);
