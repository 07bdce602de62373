// A booking driven to "released" through the real API, for the bench-log suites: a 30 kV kit
// (supply rated 30 kV / 2 mA), planned at 10 kV (0.25 J in the kit supply: no approval needed), 0.5 mA, positive unless told otherwise.
import { completePre, post, scanAll } from '../../helpers/booking-flow';
import { insertKit, plan, qualify, windowFromNow } from '../../helpers/gear';
import type { signedInAs, TestContext } from '../../helpers/test-app';

type Who = Awaited<ReturnType<typeof signedInAs>>;

export async function releasedBooking(ctx: TestContext, who: Who, extra: Partial<{ polarity: string; plannedKv: number; maxCurrentMa: number }> = {}) {
  await qualify(ctx.db, who.person.id, 40);
  // A reversible supply: the suites sweep positive, negative and reversible plans on one kit.
  const kit = await insertKit(ctx.db, { supplyPolarity: 'reversible' });
  const res = await post(who, '/api/bookings', {
    itemIds: kit.all.map((i) => i.id),
    ...windowFromNow(),
    location: 'Kestrel Hall, bay 2',
    purpose: 'Bench log test sweep',
    plan: plan(extra.plannedKv ?? 10, { maxCurrentMa: extra.maxCurrentMa ?? 0.5, polarity: extra.polarity ?? 'positive' }),
  });
  if (res.status !== 201) throw new Error(`booking failed: ${res.status} ${JSON.stringify(res.body)}`);
  const booking = res.body.booking;
  await scanAll(who, booking);
  await completePre(who, booking);
  const released = await post(who, `/api/bookings/${booking.id}/release`);
  if (released.status !== 200) throw new Error(`release failed: ${released.status} ${JSON.stringify(released.body)}`);
  return {
    booking: released.body.booking as {
      id: number;
      checklist: { return: { id: number; kind: string; unit?: string; min?: number; max?: number; required: boolean }[] };
    },
    kit,
  };
}

/** A plausible run at 30 mm: 10 kV, 0.25 mA, 15 mN (well under the 37.5 mN 1-D bound). */
export const RUN = {
  appliedKv: 10,
  currentMa: 0.25,
  gapMm: 30,
  thrustMn: 15,
  massG: 40,
  outletAreaCm2: 100,
  velocityMps: 1.2,
  temperatureC: 20,
  pressureKpa: 101.325,
  humidityPct: 0,
};
