// Gear search by words: every typed word must start one of an item's words (tag, name, make,
// model, serial, location), whatever the sort, across pages, after edits.
import { ITEM_SORTS } from '../../../shared/schemas/items';
import { createTestContext, itemBody, signedInAs, uniqueWord, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
let manager: Awaited<ReturnType<typeof signedInAs>>;

beforeAll(async () => {
  ctx = createTestContext();
  manager = await signedInAs(ctx, 'manager');
});
afterAll(() => ctx.close());

interface Summary {
  id: number;
  tag: string;
  name: string;
  kind: string;
  status: string;
  ratedKv: number | null;
  nextInspectionDue: string | null;
}

async function create(kind: string, name: string, overrides: Record<string, unknown> = {}): Promise<Summary> {
  const res = await manager.agent
    .post('/api/items')
    .set('x-csrf-token', manager.csrf())
    .send(itemBody(kind, 'x', { name, serial: '', ...overrides }));
  expect(res.status).toBe(201);
  return res.body.item;
}

async function patch(id: number, change: Record<string, unknown>) {
  const res = await manager.agent.patch(`/api/items/${id}`).set('x-csrf-token', manager.csrf()).send(change);
  expect(res.status).toBe(200);
  return res.body.item as Summary;
}

async function search(params: Record<string, string | number>): Promise<Summary[]> {
  const res = await manager.agent.get('/api/items').query({ limit: 100, ...params });
  expect(res.status).toBe(200);
  return res.body.items;
}

const ids = (items: { id: number }[]) => items.map((i) => i.id);

/** Every page of a search, following nextCursor. */
async function walk(params: Record<string, string | number>) {
  const seen: Summary[] = [];
  let cursor: string | null = null;
  let pages = 0;
  do {
    const res = await manager.agent.get('/api/items').query({ ...params, ...(cursor ? { cursor } : {}) });
    expect(res.status).toBe(200);
    seen.push(...res.body.items);
    cursor = res.body.nextCursor;
    pages += 1;
    expect(pages).toBeLessThan(20);
  } while (cursor);
  return { seen, pages };
}

describe('word search', () => {
  it('follows a rename: the old word no longer finds the item, the new one does', async () => {
    const [before, after] = [uniqueWord(), uniqueWord()];
    const item = await create('probe', `${before} divider`);
    expect(ids(await search({ q: before }))).toEqual([item.id]);
    await patch(item.id, { name: `${after} divider` });
    expect(await search({ q: before })).toEqual([]);
    expect(ids(await search({ q: after }))).toEqual([item.id]);
    // Other searchable fields too.
    const place = uniqueWord();
    await patch(item.id, { location: `Cabinet ${place}` });
    expect(ids(await search({ q: `${after} ${place}` }))).toEqual([item.id]);
  });

  it('follows a rating change for "rated at or above N kV"', async () => {
    const word = uniqueWord();
    const item = await create('probe', `${word} divider`, { ratings: { maxKv: 40, ratio: 1000, inputResistanceMohm: 1000 } });
    expect(await search({ q: word, minKv: 80 })).toEqual([]);
    await patch(item.id, { ratings: { maxKv: 90, ratio: 1000, inputResistanceMohm: 1000 } });
    expect(ids(await search({ q: word, minKv: 80 }))).toEqual([item.id]);
    expect(ids(await search({ q: word, minKv: 80, kind: 'probe', sort: 'ratedKv' }))).toEqual([item.id]);
  });

  it('needs every word, in any order, each as the start of some word of the item', async () => {
    const word = uniqueWord();
    const alpha = await create('probe', `${word} alpha`);
    const beta = await create('meter', `${word} beta`);
    expect(ids(await search({ q: `${word} alpha` }))).toEqual([alpha.id]);
    expect(ids(await search({ q: `alpha ${word}` }))).toEqual([alpha.id]);
    expect(ids(await search({ q: `${word} al` }))).toEqual([alpha.id]);
    expect(ids(await search({ q: `${word}, BETA!` }))).toEqual([beta.id]);
    expect(await search({ q: `${word} gamma` })).toEqual([]);
    expect(await search({ q: `${word} alphas` })).toEqual([]);
    expect(ids(await search({ q: word })).sort()).toEqual([alpha.id, beta.id].sort());
    // A word matches the start of a word, not its middle or end.
    expect(await search({ q: `${word} lpha` })).toEqual([]);
  });

  it('matches a prefix of a word', async () => {
    const word = uniqueWord();
    const item = await create('probe', `${word}spitze`);
    expect(ids(await search({ q: `${word}sp` }))).toEqual([item.id]);
    expect(ids(await search({ q: `${word}SPITZE` }))).toEqual([item.id]);
    expect(ids(await search({ q: word.slice(0, -1) }))).toContain(item.id);
  });

  it('matches words with accents and other scripts, in any case and Unicode form', async () => {
    const word = uniqueWord();
    const item = await create('probe', `${word} Prüfspitze`, { location: 'Лаборатория 3' });
    // Typed decomposed (u + combining diaeresis) and stored composed, or the other way round.
    const decomposed = await create('probe', `${word} Pru\u0308fkabel`);
    expect(ids(await search({ q: `${word} prüf` })).sort()).toEqual([item.id, decomposed.id].sort());
    expect(ids(await search({ q: `${word} PRÜFSPITZE` }))).toEqual([item.id]);
    expect(ids(await search({ q: `${word} pru\u0308fsp` }))).toEqual([item.id]);
    // Full-width letters are the same letters after NFKC.
    expect(ids(await search({ q: `${word} ＰＲÜＦＳ` }))).toEqual([item.id]);
    expect(ids(await search({ q: `${word} лаборатория` }))).toEqual([item.id]);
    expect(await search({ q: `${word} prüfspitzen` })).toEqual([]);
  });

  it('folds accents both ways: an unaccented word finds accented gear, an accented one plain gear', async () => {
    const word = uniqueWord();
    const accented = await create('probe', `${word} Prüfspitze`, { location: 'Salle Électrique' });
    const plain = await create('probe', `${word} Prufkabel`);
    for (const q of [`${word} pruf`, `${word} prüf`, `${word} PRÜF`, `${word} pru\u0308f`])
      expect(ids(await search({ q })).sort()).toEqual([accented.id, plain.id].sort());
    expect(ids(await search({ q: `${word} prufspitze` }))).toEqual([accented.id]);
    expect(ids(await search({ q: `${word} prüfkabel` }))).toEqual([plain.id]);
    expect(ids(await search({ q: `${word} electrique` }))).toEqual([accented.id]);
    expect(ids(await search({ q: `${word} élec` }))).toEqual([accented.id]);
  });

  it('finds an item once by a prefix that several of its words share', async () => {
    const word = uniqueWord();
    const item = await create('probe', `${word} corona coronal`, { location: 'Corona cage' });
    const other = await create('probe', `${word} coronal`);
    for (const q of [`${word} coro`, `${word} c`, `${word} corona`]) {
      const found = await search({ q });
      expect(ids(found).filter((id) => id === item.id)).toHaveLength(1);
    }
    expect(ids(await search({ q: `${word} coro` })).sort()).toEqual([item.id, other.id].sort());
    expect(ids(await search({ q: `${word} corona` })).sort()).toEqual([item.id, other.id].sort());
  });

  it('lists an item once when several of its words start with the typed word', async () => {
    const word = uniqueWord();
    const both = await create('probe', `${word}corona ${word}coronal ${word}coronas`);
    const longerOnly = await create('probe', `${word}coronal ${word}coronas`);
    for (const q of [word, `${word}coro`, `${word}corona`]) {
      const found = await search({ q });
      expect(ids(found).sort()).toEqual([both.id, longerOnly.id].sort());
    }
    expect(ids(await search({ q: `${word}coronal` })).sort()).toEqual([both.id, longerOnly.id].sort());
    expect(ids(await search({ q: `${word}coronal ${word}coronas` })).sort()).toEqual([both.id, longerOnly.id].sort());
  });

  it('cuts very long words the same way when storing and when searching', async () => {
    const word = uniqueWord();
    const long = `${word}${'k'.repeat(50)}`;
    const item = await create('other', `${long} rig`);
    expect(ids(await search({ q: long }))).toEqual([item.id]);
    expect(ids(await search({ q: `${long}extra` }))).toEqual([item.id]);
    expect(ids(await search({ q: long.slice(0, 20) }))).toEqual([item.id]);
  });

  it('finds a word of 32 or more characters by each of its first 32 characters, and once', async () => {
    const word = uniqueWord();
    const long = `${word}${'q'.repeat(40)}`;
    const item = await create('other', `${long} ${long}z rig`);
    for (const length of [word.length + 1, 31, 32, 33, long.length]) expect(ids(await search({ q: long.slice(0, length) }))).toEqual([item.id]);
    // Past 32 characters the word is cut, so what follows no longer tells words apart.
    expect(ids(await search({ q: `${long.slice(0, 32)}different` }))).toEqual([item.id]);
    expect(await search({ q: `${long.slice(0, 31)}x` })).toEqual([]);
  });

  it('hides retired gear unless retired gear is asked for; tagged-out gear stays listed', async () => {
    const word = uniqueWord();
    const retired = await create('probe', `${word} old divider`);
    const taggedOut = await create('probe', `${word} cracked divider`);
    await patch(retired.id, { status: 'retired', statusReason: 'Replaced' });
    await patch(taggedOut.id, { status: 'out-of-service', statusReason: 'Cracked housing' });
    expect(ids(await search({ q: word }))).toEqual([taggedOut.id]);
    expect(ids(await search({ q: `${word} divider`, status: 'retired' }))).toEqual([retired.id]);
    expect(ids(await search({ q: word, status: 'out-of-service' }))).toEqual([taggedOut.id]);
  });

  it('takes % and _ as plain characters, never as wildcards', async () => {
    const word = uniqueWord();
    const item = await create('probe', `${word}alpha`);
    expect(await search({ q: `%${word.slice(1)}` })).toEqual([]);
    expect(await search({ q: `_${word.slice(1)}` })).toEqual([]);
    expect(await search({ q: `${word}%pha` })).toEqual([]);
    expect(await search({ q: `${word}_lpha` })).toEqual([]);
    expect(ids(await search({ q: `${word}%` }))).toEqual([item.id]);
    expect(ids(await search({ q: `${word}\\` }))).toEqual([item.id]);
  });
});

describe('word search paging', () => {
  const word = uniqueWord();
  const made: Summary[] = [];
  const kinds = ['probe', 'multiplier', 'isolation-stand', 'meter'] as const;

  beforeAll(async () => {
    for (let i = 0; i < 60; i += 1) {
      const kind = kinds[i % kinds.length]!;
      // The word itself, two longer words starting with it, or both; repeated names tie the name sort.
      const name = [`${word} unit ${i % 5}`, `${word}x ${word}xy unit`, `${word} ${word}z unit`][i % 3]!;
      const body = itemBody(kind, 'x', { name, serial: '' });
      if (kind === 'probe') (body.ratings as Record<string, number>).maxKv = 20 + (i % 3) * 20;
      const res = await manager.agent.post('/api/items').set('x-csrf-token', manager.csrf()).send(body);
      expect(res.status).toBe(201);
      made.push(res.body.item);
    }
    // Due dates with ties and gaps, set as an inspection sets them: on the item and its search terms.
    for (const [n, due] of [
      [0, '2030-01-01'],
      [1, '2030-06-01'],
      [2, null],
    ] as const) {
      const ids = made.filter((_, i) => i % 3 === n).map((m) => m.id);
      await ctx.db('items').whereIn('id', ids).update({ next_inspection_due: due });
      await ctx.db('item_terms').whereIn('item_id', ids).update({ next_inspection_due: due });
    }
  });

  const keyOf: Record<(typeof ITEM_SORTS)[number], (i: Summary) => string | number | null> = {
    tag: (i) => i.tag,
    name: (i) => i.name,
    ratedKv: (i) => i.ratedKv,
    nextDue: (i) => i.nextInspectionDue,
  };

  it.each(ITEM_SORTS)('sort=%s: pages of 25 list each of the 60 items exactly once, in the order of one big page', async (sort) => {
    const { seen, pages } = await walk({ q: word, sort, limit: 25 });
    expect(pages).toBe(3);
    expect(seen).toHaveLength(60);
    expect(new Set(ids(seen))).toEqual(new Set(ids(made)));
    const single = await search({ q: word, sort });
    expect(ids(seen)).toEqual(ids(single));
    // Keys never go backwards (NULLs first ascending, last descending).
    const keys = seen.map(keyOf[sort]);
    for (let i = 1; i < keys.length; i += 1) {
      const [a, b] = [keys[i - 1]!, keys[i]!];
      if (sort === 'ratedKv') expect(a === null ? b === null : b === null || b <= a).toBe(true);
      else if (sort === 'tag') expect(a < b!).toBe(true);
      else expect(a === null || (b !== null && b >= a)).toBe(true);
    }
  });

  it('with status=out-of-service (searched from the items with that status), pages list each match once in every sort', async () => {
    // Every third item, of every kind.
    const out = made.filter((_, i) => i % 3 === 1);
    await ctx.db('items').whereIn('id', ids(out)).update({ status: 'out-of-service' });
    try {
      for (const sort of ITEM_SORTS) {
        const { seen } = await walk({ q: word, status: 'out-of-service', sort, limit: 4 });
        expect({ sort, ids: new Set(ids(seen)) }).toEqual({ sort, ids: new Set(ids(out)) });
        expect(ids(seen)).toEqual(ids(await search({ q: word, status: 'out-of-service', sort })));
      }
      // Two words, a kind and a rating, as the word-driven search takes them.
      const probes = out.filter((m) => m.kind === 'probe' && (m.ratedKv ?? 0) >= 40);
      expect(probes.length).toBeGreaterThan(0);
      expect(new Set(ids(await search({ q: `${word} unit`, status: 'out-of-service', kind: 'probe', minKv: 40 })))).toEqual(
        new Set(ids(probes.filter((m) => m.name.includes(' unit')))),
      );
    } finally {
      await ctx.db('items').whereIn('id', ids(out)).update({ status: 'in-service' });
    }
  });

  it.each([
    // "W" stands for the word of these items.
    [{ q: 'Wx' }, 20],
    [{ q: 'Wxy' }, 20],
    [{ q: 'W Wz', sort: 'name' }, 20],
    [{ q: 'W', kind: 'probe' }, 15],
    [{ q: 'W', kind: 'probe', minKv: 40, sort: 'ratedKv' }, 10],
    [{ q: 'W', minKv: 60, sort: 'nextDue' }, 35],
  ])('%o: every match once in pages of 7', async (params, count) => {
    const q = params.q.replaceAll('W', word);
    const { seen } = await walk({ ...params, q, limit: 7 });
    expect(seen).toHaveLength(count);
    expect(new Set(ids(seen)).size).toBe(count);
    expect(ids(seen)).toEqual(ids(await search({ ...params, q })));
  });
});

describe('word search plan', () => {
  /** EXPLAIN of the one query a search runs, as the app ran it. */
  async function planOf(params: Record<string, string | number>) {
    const seen: { sql: string; bindings: readonly unknown[] }[] = [];
    const listener = (q: { sql: string; bindings: readonly unknown[] }) => seen.push(q);
    ctx.db.on('query', listener);
    try {
      await search(params);
    } finally {
      ctx.db.removeListener('query', listener);
    }
    const query = seen.find((q) => q.sql.includes('item_terms'));
    expect(query).toBeDefined();
    const [rows] = (await ctx.db.raw(`EXPLAIN ${query!.sql}`, query!.bindings as never)) as [{ table: string; type: string; key: string | null }[]];
    return rows;
  }

  // Which of the term indexes MariaDB picks depends on the statistics of a table this small;
  // the bench database (50,000 items) is where the choice between them is measured.
  const TERM_INDEXES = [
    'item_terms_term_kind_tag_rated_kv_index',
    'item_terms_term_tag_rated_kv_index',
    'item_terms_term_name_item_id_index',
    'item_terms_term_next_inspection_due_item_id_index',
    'item_terms_term_rated_kv_item_id_index',
    'PRIMARY',
  ];
  it.each([
    [{ q: 'W', kind: 'probe', minKv: 50 }],
    [{ q: 'W' }],
    [{ q: 'W', sort: 'name' }],
    [{ q: 'W', sort: 'nextDue', kind: 'probe' }],
    [{ q: 'W divi', sort: 'ratedKv' }],
  ])('%o reads a term index and no table whole', async (params) => {
    const word = uniqueWord();
    for (let i = 0; i < 3; i += 1) await create('probe', `${word} divider ${i}`, { ratings: { maxKv: 60, ratio: 1000, inputResistanceMohm: 1000 } });
    const rows = await planOf({ ...params, q: params.q.replaceAll('W', word) });
    // The driving word's rows are read by an index starting with the term.
    const first = rows.find((r) => r.table === 't');
    expect(TERM_INDEXES).toContain(first?.key);
    for (const row of rows.filter((r) => !r.table.startsWith('<'))) expect(row.type).not.toBe('ALL');
  });
});
