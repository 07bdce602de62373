import { likePrefix, searchWords, termsOf, TERM_MAX_LENGTH, wordsOf } from '../../../server/services/item-terms';

const item = (fields: Partial<Record<'tag' | 'name' | 'make' | 'model' | 'serial' | 'location', string>>) => ({
  tag: 'PRB-0007',
  name: '',
  make: '',
  model: '',
  serial: '',
  location: '',
  ...fields,
});

describe('termsOf', () => {
  it('splits every searchable field on anything but letters and digits, lower-cased, once each', () => {
    expect(termsOf(item({ name: 'HV probe 1000:1, 40 kV', make: 'Orrin Works', model: 'HP-40', serial: 'SN/40-7', location: 'Bay 2 (cage)' }))).toEqual([
      'prb', '0007', 'hv', 'probe', '1000', '1', '40', 'kv', 'orrin', 'works', 'hp', 'sn', '7', 'bay', '2', 'cage',
    ]);
  });

  it('normalises to NFKC before lower-casing, so composed, decomposed and full-width forms agree', () => {
    const composed = termsOf(item({ name: 'Prüfspitze' }));
    expect(composed).toContain('prüfspitze');
    expect(termsOf(item({ name: 'Pru\u0308fspitze' }))).toEqual(composed);
    expect(termsOf(item({ name: 'ＰＲÜＦＳＰＩＴＺＥ' }))).toEqual(composed);
    expect(termsOf(item({ name: 'ﬁlter Ⅻ' }))).toEqual(['prb', '0007', 'filter', 'xii']);
  });

  it('keeps letters of any script and cuts long words to the stored length', () => {
    expect(termsOf(item({ tag: 'Щ-1', name: 'Лаборатория 高压' }))).toEqual(['щ', '1', 'лаборатория', '高压']);
    const long = 'k'.repeat(TERM_MAX_LENGTH + 10);
    expect(termsOf(item({ name: long }))).toContain('k'.repeat(TERM_MAX_LENGTH));
    // Cut by characters, never through a surrogate pair.
    const astral = '\u{20000}'.repeat(TERM_MAX_LENGTH + 1);
    const cut = termsOf(item({ name: astral })).at(-1)!;
    expect(cut).toBe('\u{20000}'.repeat(TERM_MAX_LENGTH));
  });
});

describe('searchWords', () => {
  it('uses the same words as the stored terms, deduplicated, at most eight', () => {
    expect(searchWords('  Corona, corona BENCH  ')).toEqual(['corona', 'bench']);
    expect(searchWords('a b c d e f g h i j')).toEqual(['a', 'b', 'c', 'd', 'e', 'f', 'g', 'h']);
    expect(searchWords('%_\\*+-"')).toEqual([]);
    expect(searchWords('x'.repeat(50))).toEqual(wordsOf('x'.repeat(40)));
  });
});

describe('likePrefix', () => {
  it('escapes LIKE wildcards and the escape character, then matches any ending', () => {
    expect(likePrefix('corona')).toBe('corona%');
    expect(likePrefix('50%_a\\b')).toBe('50\\%\\_a\\\\b%');
  });
});
