import { boundarySourceWords } from '@/components/assessment/boundary-source';
import { approachBoundaries, NFPA70E_AC_TABLE, NFPA70E_DC_TABLE } from '@/shared/hv';

// What members read under a barrier distance: table and edition in plain words, never the
// provenance notes kept in shared/hv/data (markers, "from memory", where a row was read).
const INTERNAL = /memory|not seen|stored material|training deck|paraphrased|confirmed|year not recorded/i;

describe('boundarySourceWords', () => {
  it('reads the DC 2021 table plainly', () => {
    const b = approachBoundaries({ voltageV: 500, system: 'dc' });
    expect(boundarySourceWords(b)).toBe('NFPA 70E-2021 Table 130.4(E)(b); check against your copy of the standard');
  });

  it.each([...NFPA70E_DC_TABLE.rows.map((r) => ['dc', r] as const), ...NFPA70E_AC_TABLE.rows.map((r) => ['ac', r] as const)])(
    'names a table number and hides provenance for the %s row %#',
    (system, row) => {
      const words = boundarySourceWords(row);
      expect(words).toMatch(system === 'dc' ? /^NFPA 70E(-\d{4})? Table 130\.4\(E\)\(b\)/ : /^NFPA 70E(-\d{4})? Table 130\.4\(E\)\(a\)/);
      expect(words).toMatch(/; check against your copy of the standard$/);
      expect(words).not.toMatch(INTERNAL);
    },
  );
});
