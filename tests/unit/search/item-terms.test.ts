import { prefixesOf, searchWords, termsOf, TERM_MAX_LENGTH, wordsOf } from '../../../server/services/item-terms';

const item = (fields: Partial<Record<'tag' | 'name' | 'make' | 'model' | 'serial' | 'location', string>>) => ({
  tag: 'PRB-0007',
  name: '',
  make: '',
  model: '',
  serial: '',
  location: '',
  ...fields,
});

describe('wordsOf', () => {
  it('splits on anything but letters and digits, lower-cased', () => {
    expect(wordsOf('PRB-0007 HV probe 1000:1, 40 kV Orrin Works HP-40 SN/40-7 Bay 2 (cage)')).toEqual([
      'prb',
      '0007',
      'hv',
      'probe',
      '1000',
      '1',
      '40',
      'kv',
      'orrin',
      'works',
      'hp',
      '40',
      'sn',
      '40',
      '7',
      'bay',
      '2',
      'cage',
    ]);
  });

  it('folds composed, decomposed, full-width and unaccented forms to one word', () => {
    for (const form of ['Prüfspitze', 'Pru\u0308fspitze', 'ＰＲÜＦＳＰＩＴＺＥ', 'PRUFSPITZE', 'prufspitze']) expect(wordsOf(form)).toEqual(['prufspitze']);
    expect(wordsOf('ﬁlter Ⅻ')).toEqual(['filter', 'xii']);
    expect(wordsOf('Ångström Ελλάδα İzmir')).toEqual(['angstrom', 'ελλαδα', 'izmir']);
  });

  it('keeps letters that do not decompose, and the marks of scripts where they are part of the letter', () => {
    expect(wordsOf('Straße Łódź')).toEqual(['straße', 'łodz']);
    // A Devanagari vowel sign and the Japanese voicing mark change the word; they stay, inside it.
    expect(wordsOf('हिंदी ガス')).toEqual(['हिंदी', 'ガス']);
    expect(wordsOf('Лаборатория 高压')).toEqual(['лаборатория', '高压']);
  });

  it('cuts long words to the stored length, by characters, never through a surrogate pair', () => {
    expect(wordsOf('k'.repeat(TERM_MAX_LENGTH + 10))).toEqual(['k'.repeat(TERM_MAX_LENGTH)]);
    expect(wordsOf('\u{20000}'.repeat(TERM_MAX_LENGTH + 1))).toEqual(['\u{20000}'.repeat(TERM_MAX_LENGTH)]);
    // Folding comes first, so an accent does not count towards the length.
    expect(wordsOf('é'.repeat(TERM_MAX_LENGTH + 1))).toEqual(['e'.repeat(TERM_MAX_LENGTH)]);
  });
});

describe('prefixesOf', () => {
  it('lists every prefix, one character longer each time, the word last', () => {
    expect(prefixesOf('kv')).toEqual(['k', 'kv']);
    expect(prefixesOf('probe')).toEqual(['p', 'pr', 'pro', 'prob', 'probe']);
    expect(prefixesOf('x')).toEqual(['x']);
  });

  it('counts characters, not UTF-16 units', () => {
    expect(prefixesOf('\u{20000}\u{20001}')).toEqual(['\u{20000}', '\u{20000}\u{20001}']);
  });
});

describe('termsOf', () => {
  it('is every prefix of every word of every searchable field', () => {
    expect(termsOf(item({ tag: 'PRB-07', name: 'Kv', location: 'bay' }))).toEqual(['p', 'pr', 'prb', '0', '07', 'k', 'kv', 'b', 'ba', 'bay']);
  });

  it('lists a prefix shared by several words once', () => {
    const terms = termsOf(item({ tag: 'C-1', name: 'corona coronal', make: 'Coronal' }));
    expect(terms).toEqual(['c', '1', 'co', 'cor', 'coro', 'coron', 'corona', 'coronal']);
    expect(new Set(terms).size).toBe(terms.length);
  });

  it('ends a long word at the stored length', () => {
    const terms = termsOf(item({ tag: '', name: 'k'.repeat(TERM_MAX_LENGTH + 10) }));
    expect(terms).toHaveLength(TERM_MAX_LENGTH);
    expect(terms.at(-1)).toBe('k'.repeat(TERM_MAX_LENGTH));
  });
});

describe('searchWords', () => {
  it('uses the same words as the stored terms, deduplicated, at most eight', () => {
    expect(searchWords('  Corona, corona BENCH  ')).toEqual(['corona', 'bench']);
    expect(searchWords('Prüf pruf')).toEqual(['pruf']);
    expect(searchWords('a b c d e f g h i j')).toEqual(['a', 'b', 'c', 'd', 'e', 'f', 'g', 'h']);
    expect(searchWords('%_\\*+-"')).toEqual([]);
    expect(searchWords('x'.repeat(50))).toEqual(wordsOf('x'.repeat(40)));
  });
});
