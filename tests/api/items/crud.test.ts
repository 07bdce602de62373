import request from 'supertest';
import { ITEM_KINDS } from '../../../shared/schemas/items';
import { createTestContext, itemBody, signedInAs, uniqueWord, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
let manager: Awaited<ReturnType<typeof signedInAs>>;
beforeAll(async () => {
  ctx = createTestContext();
  manager = await signedInAs(ctx, 'manager');
});
afterAll(() => ctx.close());

const post = (who: typeof manager, body: unknown) =>
  who.agent
    .post('/api/items')
    .set('x-csrf-token', who.csrf())
    .send(body as object);

describe('POST /api/items', () => {
  describe.each(ITEM_KINDS)('a %s', (kind) => {
    it('round-trips its typed ratings, derives ratedKv and issues a readable tag', async () => {
      const body = itemBody(kind, uniqueWord());
      const res = await post(manager, body);
      expect(res.status).toBe(201);
      const { item } = res.body;
      expect(item).toMatchObject({ kind, name: body.name, status: 'in-service', ratings: body.ratings, inspectionState: 'never' });
      expect(item.tag).toMatch(/^[A-Z]{3}-\d{4}$/);
      expect(item.labelUrl).toBe(`${ctx.config.publicUrl}/i/${item.tag}`);
      const fetched = await manager.agent.get(`/api/items/${item.id}`).expect(200);
      expect(fetched.body.item).toEqual(item);
      const byTag = await manager.agent.get(`/api/items/by-tag/${item.tag.toLowerCase()}`).expect(200);
      expect(byTag.body.item.id).toBe(item.id);
    });
  });

  it('derives ratedKv from the kind-specific field', async () => {
    const multiplier = await post(manager, itemBody('multiplier', uniqueWord()));
    expect(multiplier.body.item.ratedKv).toBe(80);
    const stand = await post(manager, itemBody('isolation-stand', uniqueWord()));
    expect(stand.body.item.ratedKv).toBe(100);
    const meter = await post(manager, itemBody('meter', uniqueWord()));
    expect(meter.body.item.ratedKv).toBeNull();
  });

  it('refuses ratings of another kind with field errors naming the field', async () => {
    const body = itemBody('probe', uniqueWord(), { ratings: { withstandKv: 100 } });
    const res = await post(manager, body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('VALIDATION_FAILED');
    expect(Object.keys(res.body.error.fieldErrors).some((k) => k.startsWith('ratings'))).toBe(true);
  });

  it('refuses negative, non-finite or missing ratings', async () => {
    for (const ratings of [{ withstandKv: -5 }, { withstandKv: 'lots' }, {}]) {
      const res = await post(manager, itemBody('isolation-stand', uniqueWord(), { ratings }));
      expect(res.status).toBe(400);
    }
  });

  it('never issues a tag twice: a chosen tag already used is a 409 and changes nothing', async () => {
    const word = uniqueWord();
    const tag = `KH-${word.slice(-6).toUpperCase()}`;
    const first = await post(manager, itemBody('probe', word, { tag }));
    expect(first.status).toBe(201);
    const count = await ctx.db('items').count({ n: '*' }).first();
    const again = await post(manager, itemBody('probe', uniqueWord(), { tag }));
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('TAG_TAKEN');
    expect(await ctx.db('items').count({ n: '*' }).first()).toEqual(count);
  });

  it.each(['member', 'officer'] as const)('is for managers only: a %s gets 403', async (role) => {
    const who = await signedInAs(ctx, role);
    const res = await post(who, itemBody('probe', uniqueWord()));
    expect(res.status).toBe(403);
  });

  it('answers 401 when signed out', async () => {
    const res = await request(ctx.app).get('/api/items');
    expect(res.status).toBe(401);
  });
});

describe('PATCH /api/items/:id', () => {
  it('edits, tags out with a reason, clears and retires, keeping every change in the history', async () => {
    const { body } = await post(manager, itemBody('hv-supply', uniqueWord()));
    const id = body.item.id;
    const patch = (change: unknown) =>
      manager.agent
        .patch(`/api/items/${id}`)
        .set('x-csrf-token', manager.csrf())
        .send(change as object);

    const edited = await patch({ location: 'Bay 4', ratings: { ...body.item.ratings, maxKv: 35 } });
    expect(edited.status).toBe(200);
    expect(edited.body.item).toMatchObject({ location: 'Bay 4', ratedKv: 35 });

    const noReason = await patch({ status: 'out-of-service' });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fieldErrors.statusReason).toBeDefined();

    const taggedOut = await patch({ status: 'out-of-service', statusReason: 'Output lead insulation cracked' });
    expect(taggedOut.body.item).toMatchObject({ status: 'out-of-service', statusReason: 'Output lead insulation cracked' });
    // Lockout/tagout: the tag comes off only after a passing inspection since the tag-out.
    const tooSoon = await patch({ status: 'in-service' });
    expect(tooSoon.status).toBe(409);
    expect(tooSoon.body.error.code).toBe('INSPECTION_REQUIRED');
    await manager.agent
      .post(`/api/items/${id}/inspections`)
      .set('x-csrf-token', manager.csrf())
      .send({ result: 'pass', notes: 'New output lead fitted' })
      .expect(201);
    const cleared = await patch({ status: 'in-service' });
    expect(cleared.body.item).toMatchObject({ status: 'in-service', statusReason: null, lastInspectionResult: 'pass' });
    const retired = await patch({ status: 'retired', statusReason: 'Replaced by a newer supply' });
    expect(retired.body.item.status).toBe('retired');
    const afterRetire = await patch({ name: 'Back from the dead' });
    expect(afterRetire.status).toBe(409);

    const history = await manager.agent.get(`/api/items/${id}/history`).expect(200);
    expect(history.body.events.map((e: { action: string }) => e.action)).toEqual([
      'item.retired',
      'item.cleared',
      'inspection.pass',
      'item.tagged-out',
      'item.updated',
      'item.created',
    ]);
    const update = history.body.events.find((e: { action: string }) => e.action === 'item.updated');
    expect(update.before.location).toBe('Bay 2, cabinet B');
    expect(update.after.location).toBe('Bay 4');
  });

  it('checks new ratings against the item kind', async () => {
    const { body } = await post(manager, itemBody('grounding-stick', uniqueWord()));
    const res = await manager.agent
      .patch(`/api/items/${body.item.id}`)
      .set('x-csrf-token', manager.csrf())
      .send({ ratings: { maxKv: 10 } });
    expect(res.status).toBe(400);
    // Field errors name the field as the form knows it.
    expect(Object.keys(res.body.error.fieldErrors).every((k) => k === 'ratings' || k.startsWith('ratings.'))).toBe(true);
    const unchanged = await manager.agent.get(`/api/items/${body.item.id}`);
    expect(unchanged.body.item.ratings).toEqual(body.item.ratings);
  });

  it('refuses to change the kind', async () => {
    const { body } = await post(manager, itemBody('probe', uniqueWord()));
    const res = await manager.agent.patch(`/api/items/${body.item.id}`).set('x-csrf-token', manager.csrf()).send({ kind: 'multiplier' });
    expect(res.status).toBe(400);
  });

  it('answers 404 for an unknown item and 400 for a malformed id', async () => {
    expect((await manager.agent.get('/api/items/99999999')).status).toBe(404);
    expect((await manager.agent.get('/api/items/abc')).status).toBe(400);
    expect((await manager.agent.get('/api/items/by-tag/NOPE-0000')).status).toBe(404);
  });
});
