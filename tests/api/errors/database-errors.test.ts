// Database errors a user can cause are answered as 4xx domain errors and change nothing: one
// case of each kind MariaDB reports (duplicate key 1062, unknown parent row 1452, data too long 1406).
import { PNG } from 'pngjs';
import { post } from '../../helpers/booking-flow';
import { createTestContext, itemBody, signedInAs, uniqueEmail, uniqueWord, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
beforeAll(() => {
  ctx = createTestContext();
});
afterAll(() => ctx.close());

const peopleCalled = async (email: string) => Number((await ctx.db('people').where({ email }).count({ n: '*' }).first())?.n);

describe('POST /api/invitations', () => {
  describe('when someone with that e-mail is already in (duplicate key)', () => {
    it('answers 409 EMAIL_TAKEN and adds nobody', async () => {
      const manager = await signedInAs(ctx, 'manager');
      const email = uniqueEmail('dup');
      expect((await post(manager, '/api/invitations', { email, name: 'Orla Fenwick', role: 'member' })).status).toBe(201);
      const again = await post(manager, '/api/invitations', { email, name: 'Orla Again', role: 'member' });
      expect(again.status).toBe(409);
      expect(again.body.error.code).toBe('EMAIL_TAKEN');
      expect(await peopleCalled(email)).toBe(1);
    });
  });

  describe('when the group does not exist (foreign key)', () => {
    it('answers 400 with a field error on groupId and adds nobody', async () => {
      const manager = await signedInAs(ctx, 'manager');
      const email = uniqueEmail('nogroup');
      const res = await post(manager, '/api/invitations', { email, name: 'Tobin Ashgrove', role: 'member', groupId: 2_000_000_000 });
      expect(res.status).toBe(400);
      expect(res.body.error).toMatchObject({ code: 'VALIDATION_FAILED', fieldErrors: { groupId: ['Pick one of the lab’s groups'] } });
      expect(await peopleCalled(email)).toBe(0);
    });
  });
});

describe('POST /api/items/:id/files', () => {
  describe('when the stored name would be longer than its column (data too long)', () => {
    it('answers 400 with a field error on the file and stores no row', async () => {
      const manager = await signedInAs(ctx, 'manager');
      const item = await post(manager, '/api/items', itemBody('probe', uniqueWord()));
      const png = new PNG({ width: 4, height: 4 });
      png.data.fill(120);
      // 200 characters pass the name check; the bytes' extension (.png) makes 204.
      const name = 'p'.repeat(200);
      const res = await manager.agent
        .post(`/api/items/${item.body.item.id}/files`)
        .set('x-csrf-token', manager.csrf())
        .attach('file', PNG.sync.write(png), { filepath: name } as unknown as string);
      expect(res.status).toBe(400);
      expect(res.body.error).toMatchObject({ code: 'VALIDATION_FAILED', fieldErrors: { file: ['Name too long'] } });
      expect(Number((await ctx.db('item_files').where({ item_id: item.body.item.id }).count({ n: '*' }).first())?.n)).toBe(0);
    });
  });
});
