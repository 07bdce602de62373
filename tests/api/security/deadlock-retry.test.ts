// A deadlock (MariaDB 1213) is retried, a bounded number of times with jitter, around every
// audited transaction (server/services/deadlock-retry.ts); it never becomes a 500.
import { auditedTransaction } from '../../../server/services/audit';
import { backoffDelayMs, DEFAULT_ATTEMPTS, withDeadlockRetry } from '../../../server/services/deadlock-retry';
import { AppError } from '../../../server/errors';
import { createPerson, createTestContext, signedInAs, uniqueEmail, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
beforeAll(() => {
  ctx = createTestContext();
});
afterAll(() => ctx.close());

const deadlock = () =>
  Object.assign(new Error('Deadlock found when trying to get lock; try restarting transaction'), { code: 'ER_LOCK_DEADLOCK', errno: 1213 });

describe('withDeadlockRetry', () => {
  it('runs again after a deadlock and returns the later result', async () => {
    let calls = 0;
    const result = await withDeadlockRetry(
      async () => {
        calls += 1;
        if (calls < 3) throw deadlock();
        return 'done';
      },
      { baseDelayMs: 1 },
    );
    expect({ result, calls }).toEqual({ result: 'done', calls: 3 });
  });

  it('gives up after a bounded number of attempts with a 503, never a 500', async () => {
    let calls = 0;
    const error = await withDeadlockRetry(
      async () => {
        calls += 1;
        throw deadlock();
      },
      { baseDelayMs: 1 },
    ).catch((e: unknown) => e);
    expect(calls).toBe(DEFAULT_ATTEMPTS);
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).status).toBe(503);
  });

  it('does not retry any other error', async () => {
    let calls = 0;
    const duplicate = Object.assign(new Error('Duplicate entry'), { code: 'ER_DUP_ENTRY', errno: 1062 });
    await expect(
      withDeadlockRetry(async () => {
        calls += 1;
        throw duplicate;
      }),
    ).rejects.toBe(duplicate);
    expect(calls).toBe(1);
  });

  it('waits a jittered, growing, capped time (full jitter: uniform in [0, min(320, 10·2^(n−1))] ms)', () => {
    expect(backoffDelayMs(1, 10, () => 0)).toBe(0);
    expect(backoffDelayMs(1, 10, () => 0.999)).toBe(9);
    expect(backoffDelayMs(3, 10, () => 0.5)).toBe(20);
    expect(backoffDelayMs(20, 10, () => 0.999)).toBe(319);
  });
});

describe('auditedTransaction', () => {
  it('survives a deadlock MariaDB really detects: two transactions locking two rows in opposite order', async () => {
    const [a, b] = [await createPerson(ctx.db), await createPerson(ctx.db)];
    let bodies = 0;
    // Both hold their first lock before either asks for its second: a certain deadlock.
    let arrived = 0;
    let release!: () => void;
    const bothHoldOne = new Promise<void>((resolve) => (release = resolve));
    const lockBoth = (first: number, second: number) =>
      auditedTransaction(ctx.db, async (trx) => {
        bodies += 1;
        await trx('people').where({ id: first }).forUpdate().first('id');
        arrived += 1;
        if (arrived === 2) release();
        await bothHoldOne;
        await trx('people').where({ id: second }).forUpdate().first('id');
        await trx('people').where({ id: first }).update({ updated_at: new Date() });
        return first;
      });
    const results = await Promise.all([lockBoth(a.id, b.id), lockBoth(b.id, a.id)]);
    expect(results).toEqual([a.id, b.id]);
    // Two bodies, plus at least one run again for the deadlock victim.
    expect(bodies).toBeGreaterThanOrEqual(3);
    console.log(`[deadlock] opposite-order locks: ${bodies} bodies run for 2 transactions (${bodies - 2} retried), both committed`);
  });
});

describe('POST /api/invitations sent at the same moment', () => {
  it('answers 201 for each new e-mail and 201 once then 409 for one e-mail, never 500', async () => {
    const manager = await signedInAs(ctx, 'manager');
    const invite = (email: string, i: number) =>
      manager.agent
        .post('/api/invitations')
        .set('x-csrf-token', manager.csrf())
        .send({ email, name: `Invitee ${i}`, role: 'member' });
    const distinct = await Promise.all(Array.from({ length: 12 }, (_, i) => invite(uniqueEmail('invitee'), i)));
    const same = uniqueEmail('twice');
    const duplicate = await Promise.all(Array.from({ length: 8 }, (_, i) => invite(same, i)));
    const count = (answers: { status: number }[]) => answers.reduce<Record<number, number>>((acc, a) => ({ ...acc, [a.status]: (acc[a.status] ?? 0) + 1 }), {});
    expect(count(distinct)).toEqual({ 201: 12 });
    expect(count(duplicate)).toEqual({ 201: 1, 409: 7 });
    expect(duplicate.filter((d) => d.status === 409).every((d) => d.body.error.code === 'EMAIL_TAKEN')).toBe(true);
    console.log(`[deadlock] concurrent invitations: distinct ${JSON.stringify(count(distinct))}, same e-mail ${JSON.stringify(count(duplicate))}`);
  });
});
