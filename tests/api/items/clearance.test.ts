import { createTestContext, itemBody, signedInAs, uniqueWord, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
let manager: Awaited<ReturnType<typeof signedInAs>>;
beforeAll(async () => {
  ctx = createTestContext();
  manager = await signedInAs(ctx, 'manager');
});
afterAll(() => ctx.close());

const write = (method: 'post' | 'patch', path: string, body: unknown) =>
  manager.agent[method](path)
    .set('x-csrf-token', manager.csrf())
    .send(body as object);

describe('GET /api/items/:id/clearance', () => {
  it('says an item in service is not something to clear', async () => {
    const item = (await write('post', '/api/items', itemBody('grounding-stick', uniqueWord()))).body.item as { id: number };
    const res = await manager.agent.get(`/api/items/${item.id}/clearance`).expect(200);
    expect(res.body).toEqual({ clearable: false, reason: null });
  });

  it('agrees with PATCH: a tagged-out item is clearable only after a passing inspection since the tag-out', async () => {
    const item = (await write('post', '/api/items', itemBody('grounding-stick', uniqueWord()))).body.item as { id: number };
    expect((await write('post', `/api/items/${item.id}/inspections`, { result: 'fail', notes: 'Hook cracked' })).status).toBe(201);

    const before = await manager.agent.get(`/api/items/${item.id}/clearance`).expect(200);
    expect(before.body.clearable).toBe(false);
    expect(before.body.reason).toMatch(/first record an inspection that passes/);
    expect((await write('patch', `/api/items/${item.id}`, { status: 'in-service' })).status).toBe(409);

    expect((await write('post', `/api/items/${item.id}/inspections`, { result: 'pass' })).status).toBe(201);
    const after = await manager.agent.get(`/api/items/${item.id}/clearance`).expect(200);
    expect(after.body).toEqual({ clearable: true, reason: null });
    expect((await write('patch', `/api/items/${item.id}`, { status: 'in-service' })).status).toBe(200);
  });

  it('answers 404 for an item that does not exist', async () => {
    const res = await manager.agent.get('/api/items/99999999/clearance').expect(404);
    expect(res.body.error.code).toBeDefined();
  });
});
