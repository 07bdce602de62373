import { createTestContext, itemBody, signedInAs, uniqueWord, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
let manager: Awaited<ReturnType<typeof signedInAs>>;
const word = uniqueWord();
const created: { id: number; tag: string; kind: string; ratedKv: number | null; name: string }[] = [];

beforeAll(async () => {
  ctx = createTestContext();
  manager = await signedInAs(ctx, 'manager');
  const kinds = ['multiplier', 'probe', 'isolation-stand', 'meter'] as const;
  for (let i = 0; i < 23; i += 1) {
    const kind = kinds[i % kinds.length]!;
    const body = itemBody(kind, word);
    // Spread the ratings so sorting by voltage has ties and gaps.
    if (kind === 'probe') (body.ratings as Record<string, number>).maxKv = 20 + (i % 3) * 20;
    const res = await manager.agent.post('/api/items').set('x-csrf-token', manager.csrf()).send(body);
    expect(res.status).toBe(201);
    created.push(res.body.item);
  }
});
afterAll(() => ctx.close());

async function walk(query: string, limit: number) {
  const seen: { id: number; tag: string; name: string; ratedKv: number | null; kind: string }[] = [];
  let cursor: string | null = null;
  let pages = 0;
  do {
    const url: string = `/api/items?${query}&limit=${limit}${cursor ? `&cursor=${encodeURIComponent(cursor)}` : ''}`;
    const res = await manager.agent.get(url).expect(200);
    seen.push(...res.body.items);
    cursor = res.body.nextCursor;
    pages += 1;
    expect(pages).toBeLessThan(50);
  } while (cursor);
  return { seen, pages };
}

describe('GET /api/items', () => {
  it('finds items by a word of their name, tag or serial', async () => {
    const res = await manager.agent.get(`/api/items?q=${word}&limit=100`).expect(200);
    expect(res.body.items).toHaveLength(23);
    const first = created[0]!;
    const byTag = await manager.agent.get(`/api/items?q=${encodeURIComponent(first.tag)}`).expect(200);
    expect(byTag.body.items.map((i: { id: number }) => i.id)).toContain(first.id);
  });

  it('pages with a keyset cursor: every item once, in tag order, whatever the page size', async () => {
    const expected = [...created].sort((a, b) => (a.tag < b.tag ? -1 : 1)).map((i) => i.id);
    for (const limit of [1, 5, 7, 23, 100]) {
      const { seen, pages } = await walk(`q=${word}`, limit);
      expect(seen.map((i) => i.id)).toEqual(expected);
      expect(pages).toBe(Math.max(1, Math.ceil(23 / limit)));
    }
  });

  it('pages by rated voltage, highest first, items without a rating last, ties broken by id', async () => {
    const { seen } = await walk(`q=${word}&sort=ratedKv`, 4);
    expect(new Set(seen.map((i) => i.id)).size).toBe(23);
    const kvs = seen.map((i) => i.ratedKv);
    const rated = kvs.filter((v): v is number => v !== null);
    expect(rated).toEqual([...rated].sort((a, b) => b - a));
    expect(kvs.slice(rated.length).every((v) => v === null)).toBe(true);
  });

  it('filters by kind and by "rated at or above N kV"', async () => {
    const probes = await manager.agent.get(`/api/items?q=${word}&kind=probe&limit=100`).expect(200);
    expect(probes.body.items.length).toBe(created.filter((i) => i.kind === 'probe').length);
    const high = await manager.agent.get(`/api/items?q=${word}&minKv=60&limit=100`).expect(200);
    expect(high.body.items.length).toBe(created.filter((i) => (i.ratedKv ?? -1) >= 60).length);
    expect(high.body.items.every((i: { ratedKv: number }) => i.ratedKv >= 60)).toBe(true);
  });

  it('refuses a forged cursor and unknown filters with 400', async () => {
    expect((await manager.agent.get('/api/items?cursor=not-a-cursor')).status).toBe(400);
    expect((await manager.agent.get('/api/items?kind=toaster')).status).toBe(400);
    expect((await manager.agent.get('/api/items?minKv=-1')).status).toBe(400);
    expect((await manager.agent.get('/api/items?limit=100000')).status).toBe(400);
    expect((await manager.agent.get('/api/items?sql=1')).status).toBe(400);
  });

  it('treats search text as words, never as SQL or FULLTEXT operators', async () => {
    for (const q of [`'; DROP TABLE items; --`, '+-><()~*"@', '%_', '\u0000']) {
      const res = await manager.agent.get(`/api/items?q=${encodeURIComponent(q)}`);
      expect(res.status).toBe(200);
    }
  });
});

describe('GET /api/items with a tag-shaped search', () => {
  it('finds by tag prefix, and still finds a serial number that looks like a tag', async () => {
    const first = created[0]!;
    const prefix = first.tag.slice(0, first.tag.length - 1);
    const byPrefix = await manager.agent.get(`/api/items?q=${encodeURIComponent(prefix.toLowerCase())}&limit=100`).expect(200);
    expect(byPrefix.body.items.every((i: { tag: string }) => i.tag.startsWith(prefix))).toBe(true);
    expect(byPrefix.body.items.map((i: { id: number }) => i.id)).toContain(first.id);
    const serial = await manager.agent.get(`/api/items?q=SN-${word}`).expect(200);
    expect(serial.body.items.length).toBeGreaterThan(0);
  });
});
