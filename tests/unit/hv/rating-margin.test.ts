import { ratingMargin } from '../../../shared/hv';
import { expectWithin } from './expect-within';

// Kit rule of domain §7.3/§10: an item's rating must be ≥ the source's peak voltage; the lab's
// extra margin percent is lab policy (common practice, no source).
describe('ratingMargin', () => {
  it('a 110 kV item passes a 100 kV plan with a 10 % margin, despite 100 × 1.1 = 110.00000000000001 in floating point', () => {
    const result = ratingMargin({ ratedKv: 110, plannedKv: 100, marginPct: 10 });
    expectWithin(result.requiredKv, 110);
    expect(result.ok).toBe(true);
    expectWithin(result.marginKv, 10);
    expectWithin(result.marginPct, 10);
  });

  it('a 109 kV item fails the same plan', () => {
    expect(ratingMargin({ ratedKv: 109, plannedKv: 100, marginPct: 10 }).ok).toBe(false);
  });

  it('a 63 kV Type B probe on a 100 kV multiplier fails with −37 kV of margin (IEC 61010-031 63 kV scope limit, confirmed)', () => {
    const result = ratingMargin({ ratedKv: 63, plannedKv: 100, marginPct: 0 });
    expect(result.ok).toBe(false);
    expectWithin(result.marginKv, -37);
    expectWithin(result.marginPct, -37);
  });

  it('echoes the required margin beside the actual one', () => {
    const result = ratingMargin({ ratedKv: 60, plannedKv: 50, marginPct: 15 });
    expect(result.requiredMarginPct).toBe(15);
    expectWithin(result.requiredKv, 57.5);
    expectWithin(result.marginPct, 20);
    expect(result.ok).toBe(true);
  });
});
