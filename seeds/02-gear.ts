// Demo gear of the invented Kestrel Hall HV Laboratory. Makes, models and serials are invented.
// Ratings are realistic for the kinds of gear such labs share (multiplier stacks of 4-10 stages
// to 60-100 kV, flyback drivers of 10-20 kV, probes to 40-100 kV, stands and sticks rated above
// the lab's highest voltage), so the demo's safety assessments read like real ones.
import type { Knex } from 'knex';
import { appendAudit, auditedTransaction } from '../server/services/audit';
import { addDaysIso, todayIso } from '../server/services/dates';
import { writeItemTerms } from '../server/services/item-terms';
import { DEFAULT_INSPECTION_DAYS, KIND_TAG_CODES, ratedKvOf, type ItemKind, type ItemRatings } from '../shared/schemas/items';

type Demo = {
  kind: ItemKind;
  name: string;
  make: string;
  model: string;
  location: string;
  ratings: Record<string, unknown>;
  inspectedDaysAgo: number | null;
  fail?: string;
  notes?: string;
};

const BAY1 = 'Bay 1 (interlocked cage)';
const BAY2 = 'Bay 2 (open bench, barrier posts)';
const STORE = 'HV store, cabinet A';
const TEACH = 'Teaching lab, bench 3';

const mult = (stages: number, nf: number, hz: number, vin: number, vout: number, ma: number, polarity: string) => ({
  stages,
  stageCapacitanceNf: nf,
  driveFrequencyHz: hz,
  maxInputKvPeak: vin,
  maxOutputKv: vout,
  maxMa: ma,
  polarity,
});
const supply = (kv: number, ma: number, polarity: string, nf: number, bleeder: number | null, interlock: boolean) => ({
  maxKv: kv,
  maxMa: ma,
  polarity,
  outputCapacitanceNf: nf,
  bleederMohm: bleeder,
  hasInterlockInput: interlock,
});

export const DEMO_GEAR: Demo[] = [
  {
    kind: 'multiplier',
    name: 'Six-stage CW stack, 90 kV',
    make: 'Kestrel Shop (built in-house)',
    model: 'KS-CW6',
    location: BAY1,
    ratings: mult(6, 1, 25000, 8, 90, 1, 'positive'),
    inspectedDaysAgo: 30,
  },
  {
    kind: 'multiplier',
    name: 'Ten-stage CW stack, 100 kV',
    make: 'Halvard Instruments',
    model: 'HM-10X',
    location: BAY1,
    ratings: mult(10, 0.5, 30000, 5.5, 100, 0.5, 'negative'),
    inspectedDaysAgo: 170,
  },
  {
    kind: 'multiplier',
    name: 'Four-stage ionic-wind stack, 60 kV',
    make: 'Kestrel Shop (built in-house)',
    model: 'KS-CW4',
    location: BAY2,
    ratings: mult(4, 2.2, 20000, 8, 60, 2, 'positive'),
    inspectedDaysAgo: 60,
  },
  {
    kind: 'multiplier',
    name: 'Eight-stage corona stack, 80 kV',
    make: 'Brightwater HV',
    model: 'BW-8S',
    location: BAY2,
    ratings: mult(8, 1, 40000, 5.5, 80, 1, 'negative'),
    inspectedDaysAgo: 200,
  },
  {
    kind: 'multiplier',
    name: 'Five-stage teaching stack, 60 kV',
    make: 'Tamsin Electric',
    model: 'TE-5',
    location: TEACH,
    ratings: mult(5, 1, 20000, 6.5, 60, 0.5, 'positive'),
    inspectedDaysAgo: 10,
  },
  {
    kind: 'multiplier',
    name: 'Seven-stage spinning stack, 70 kV',
    make: 'Brightwater HV',
    model: 'BW-7S',
    location: STORE,
    ratings: mult(7, 1.5, 25000, 5.5, 70, 1, 'positive'),
    inspectedDaysAgo: 90,
    fail: 'Arc tracking on stage 3 capacitor housing',
  },
  {
    kind: 'hv-supply',
    name: 'Flyback driver, 15 kV',
    make: 'Kestrel Shop (built in-house)',
    model: 'KS-FB15',
    location: BAY2,
    ratings: supply(15, 3, 'positive', 0.5, 200, false),
    inspectedDaysAgo: 100,
  },
  {
    kind: 'hv-supply',
    name: 'Flyback driver, 20 kV',
    make: 'Tamsin Electric',
    model: 'TE-FB20',
    location: TEACH,
    ratings: supply(20, 2, 'positive', 0.3, 400, false),
    inspectedDaysAgo: 20,
  },
  {
    kind: 'hv-supply',
    name: 'Flyback driver, 10 kV (teaching)',
    make: 'Tamsin Electric',
    model: 'TE-FB10',
    location: TEACH,
    ratings: supply(10, 1.5, 'positive', 0.2, 100, false),
    inspectedDaysAgo: 356,
  },
  {
    kind: 'hv-supply',
    name: 'Bench DC supply, 30 kV reversible',
    make: 'Halvard Instruments',
    model: 'HI-30R',
    location: BAY1,
    ratings: supply(30, 4, 'reversible', 10, 100, true),
    inspectedDaysAgo: 40,
  },
  {
    kind: 'hv-supply',
    name: 'Bench DC supply, 60 kV negative',
    make: 'Halvard Instruments',
    model: 'HI-60N',
    location: BAY1,
    ratings: supply(60, 2, 'negative', 5, 600, true),
    inspectedDaysAgo: 120,
  },
  {
    kind: 'hv-supply',
    name: 'Bench DC supply, 100 kV positive',
    make: 'Orrin Works',
    model: 'OW-100P',
    location: BAY1,
    ratings: supply(100, 1, 'positive', 2, 1000, true),
    inspectedDaysAgo: 300,
  },
  {
    kind: 'hv-supply',
    name: 'Electrospinning supply, 40 kV',
    make: 'Orrin Works',
    model: 'OW-ES40',
    location: BAY2,
    ratings: supply(40, 0.5, 'positive', 1, 400, true),
    inspectedDaysAgo: 380,
  },
  {
    kind: 'hv-supply',
    name: 'Bias supply, 5 kV',
    make: 'Brightwater HV',
    model: 'BW-B5',
    location: STORE,
    ratings: supply(5, 10, 'reversible', 20, 50, true),
    inspectedDaysAgo: 50,
  },
  {
    kind: 'probe',
    name: 'HV probe 1000:1, 40 kV',
    make: 'Halvard Instruments',
    model: 'HP-40',
    location: STORE,
    ratings: { maxKv: 40, ratio: 1000, inputResistanceMohm: 1000 },
    inspectedDaysAgo: 200,
  },
  {
    kind: 'probe',
    name: 'HV probe 1000:1, 40 kV (second)',
    make: 'Halvard Instruments',
    model: 'HP-40',
    location: TEACH,
    ratings: { maxKv: 40, ratio: 1000, inputResistanceMohm: 1000 },
    inspectedDaysAgo: 355,
  },
  {
    kind: 'probe',
    name: 'Resistive divider 10000:1, 100 kV',
    make: 'Orrin Works',
    model: 'OW-RD100',
    location: BAY1,
    ratings: { maxKv: 100, ratio: 10000, inputResistanceMohm: 2000 },
    inspectedDaysAgo: 60,
  },
  {
    kind: 'probe',
    name: 'Resistive divider 10000:1, 60 kV',
    make: 'Orrin Works',
    model: 'OW-RD60',
    location: BAY2,
    ratings: { maxKv: 60, ratio: 10000, inputResistanceMohm: 1200 },
    inspectedDaysAgo: 400,
  },
  {
    kind: 'probe',
    name: 'HV probe 1000:1, 75 kV',
    make: 'Brightwater HV',
    model: 'BW-P75',
    location: STORE,
    ratings: { maxKv: 75, ratio: 1000, inputResistanceMohm: 1500 },
    inspectedDaysAgo: 100,
  },
  {
    kind: 'isolation-stand',
    name: 'PTFE isolation stand, 150 mm',
    make: 'Kestrel Shop (built in-house)',
    model: 'KS-PT150',
    location: BAY1,
    ratings: { withstandKv: 100 },
    inspectedDaysAgo: 30,
  },
  {
    kind: 'isolation-stand',
    name: 'PTFE isolation stand, 100 mm',
    make: 'Kestrel Shop (built in-house)',
    model: 'KS-PT100',
    location: BAY2,
    ratings: { withstandKv: 70 },
    inspectedDaysAgo: 90,
  },
  {
    kind: 'isolation-stand',
    name: 'Acetal stand, 60 mm',
    make: 'Tamsin Electric',
    model: 'TE-AS60',
    location: TEACH,
    ratings: { withstandKv: 40 },
    inspectedDaysAgo: 240,
  },
  {
    kind: 'isolation-stand',
    name: 'Glass-epoxy standoff pair, 300 mm',
    make: 'Orrin Works',
    model: 'OW-GS300',
    location: BAY1,
    ratings: { withstandKv: 150 },
    inspectedDaysAgo: 360,
  },
  {
    kind: 'isolation-stand',
    name: 'PTFE stand, 120 mm',
    make: 'Brightwater HV',
    model: 'BW-PT120',
    location: STORE,
    ratings: { withstandKv: 90 },
    inspectedDaysAgo: 10,
  },
  {
    kind: 'grounding-stick',
    name: 'Resistive grounding stick, 100 kV',
    make: 'Orrin Works',
    model: 'OW-GS100R',
    location: BAY1,
    ratings: { ratedKv: 100, hookResistanceMohm: 10, cableLengthM: 3 },
    inspectedDaysAgo: 45,
  },
  {
    kind: 'grounding-stick',
    name: 'Solid grounding stick, 100 kV',
    make: 'Orrin Works',
    model: 'OW-GS100S',
    location: BAY1,
    ratings: { ratedKv: 100, hookResistanceMohm: null, cableLengthM: 3 },
    inspectedDaysAgo: 45,
  },
  {
    kind: 'grounding-stick',
    name: 'Resistive grounding stick, 60 kV',
    make: 'Halvard Instruments',
    model: 'HI-GS60',
    location: BAY2,
    ratings: { ratedKv: 60, hookResistanceMohm: 5, cableLengthM: 2.5 },
    inspectedDaysAgo: 200,
  },
  {
    kind: 'grounding-stick',
    name: 'Solid grounding stick, 60 kV',
    make: 'Halvard Instruments',
    model: 'HI-GS60S',
    location: BAY2,
    ratings: { ratedKv: 60, hookResistanceMohm: null, cableLengthM: 2.5 },
    inspectedDaysAgo: 359,
  },
  {
    kind: 'grounding-stick',
    name: 'Teaching grounding stick, 30 kV',
    make: 'Tamsin Electric',
    model: 'TE-GS30',
    location: TEACH,
    ratings: { ratedKv: 30, hookResistanceMohm: 1, cableLengthM: 2 },
    inspectedDaysAgo: 390,
  },
  {
    kind: 'grounding-stick',
    name: 'Resistive grounding stick, 150 kV',
    make: 'Brightwater HV',
    model: 'BW-GS150',
    location: STORE,
    ratings: { ratedKv: 150, hookResistanceMohm: 20, cableLengthM: 4 },
    inspectedDaysAgo: 15,
  },
  {
    kind: 'interlock',
    name: 'Bay 1 cage door interlock',
    make: 'Kestrel Shop (built in-house)',
    model: 'KS-IL1',
    location: BAY1,
    ratings: { ratedKv: 100 },
    inspectedDaysAgo: 20,
  },
  {
    kind: 'interlock',
    name: 'Bay 2 barrier-gate interlock',
    make: 'Kestrel Shop (built in-house)',
    model: 'KS-IL2',
    location: BAY2,
    ratings: { ratedKv: 60 },
    inspectedDaysAgo: 175,
  },
  {
    kind: 'interlock',
    name: 'Teaching enclosure lid switch',
    make: 'Tamsin Electric',
    model: 'TE-EN1',
    location: TEACH,
    ratings: { ratedKv: 30 },
    inspectedDaysAgo: 60,
  },
  {
    kind: 'interlock',
    name: 'Portable acrylic enclosure, 40 kV',
    make: 'Orrin Works',
    model: 'OW-PE40',
    location: STORE,
    ratings: { ratedKv: 40 },
    inspectedDaysAgo: 190,
  },
  {
    kind: 'interlock',
    name: 'Electrospinning cabinet interlock',
    make: 'Brightwater HV',
    model: 'BW-EC1',
    location: BAY2,
    ratings: { ratedKv: 50 },
    inspectedDaysAgo: 100,
  },
  {
    kind: 'meter',
    name: 'Electrostatic voltmeter, 30 kV',
    make: 'Halvard Instruments',
    model: 'HI-EV30',
    location: STORE,
    ratings: { maxKv: 30 },
    inspectedDaysAgo: 100,
  },
  { kind: 'meter', name: 'Insulation tester, 10 kV', make: 'Orrin Works', model: 'OW-IT10', location: STORE, ratings: { maxKv: 10 }, inspectedDaysAgo: 352 },
  { kind: 'meter', name: 'Picoammeter (floating)', make: 'Brightwater HV', model: 'BW-PA1', location: BAY2, ratings: { maxKv: null }, inspectedDaysAgo: 70 },
  { kind: 'meter', name: 'Ozone monitor', make: 'Tamsin Electric', model: 'TE-OZ', location: BAY2, ratings: { maxKv: null }, inspectedDaysAgo: null },
  {
    kind: 'other',
    name: 'Emitter-collector thruster rig',
    make: 'Kestrel Shop (built in-house)',
    model: 'KS-EHD3',
    location: BAY2,
    ratings: { maxKv: 50 },
    inspectedDaysAgo: 80,
  },
  {
    kind: 'other',
    name: 'Needle-plane corona cell',
    make: 'Kestrel Shop (built in-house)',
    model: 'KS-NP1',
    location: BAY1,
    ratings: { maxKv: 60 },
    inspectedDaysAgo: 30,
  },
  {
    kind: 'other',
    name: 'Electrospinning collector drum',
    make: 'Orrin Works',
    model: 'OW-CD2',
    location: BAY2,
    ratings: { maxKv: 40 },
    inspectedDaysAgo: 140,
  },
  {
    kind: 'other',
    name: 'HV cable set, 100 kV silicone',
    make: 'Brightwater HV',
    model: 'BW-C100',
    location: STORE,
    ratings: { maxKv: 100 },
    inspectedDaysAgo: 200,
  },
  {
    kind: 'other',
    name: 'Warning beacon and sign kit',
    make: 'Tamsin Electric',
    model: 'TE-WB',
    location: STORE,
    ratings: { maxKv: null },
    inspectedDaysAgo: 10,
  },
];

export async function seed(knex: Knex): Promise<void> {
  const manager = await knex('people').where({ email: 'manager@voltcrib.example' }).first('id');
  const officer = await knex('people').where({ email: 'officer@voltcrib.example' }).first('id');
  const counters = new Map<string, number>();
  const today = todayIso();
  for (const demo of DEMO_GEAR) {
    const code = KIND_TAG_CODES[demo.kind];
    const n = (counters.get(code) ?? 0) + 1;
    counters.set(code, n);
    const tag = `${code}-${String(n).padStart(4, '0')}`;
    const interval = DEFAULT_INSPECTION_DAYS[demo.kind];
    const lastInspected = demo.inspectedDaysAgo === null ? null : addDaysIso(today, -demo.inspectedDaysAgo);
    await auditedTransaction(knex, async (trx) => {
      const record = {
        tag,
        kind: demo.kind,
        name: demo.name,
        make: demo.make,
        model: demo.model,
        serial: `KH-${code}-${(4100 + n * 37).toString()}`,
        location: demo.location,
        notes: demo.notes ?? '',
        ratings: JSON.stringify(demo.ratings),
        rated_kv: ratedKvOf({ kind: demo.kind, ratings: demo.ratings } as ItemRatings),
        inspection_interval_days: interval,
        last_inspected_on: lastInspected,
        next_inspection_due: lastInspected ? addDaysIso(lastInspected, interval) : null,
        status: demo.fail ? 'out-of-service' : 'in-service',
        last_inspection_result: lastInspected ? (demo.fail ? 'fail' : 'pass') : null,
        status_changed_at: demo.fail ? new Date() : null,
        status_reason: demo.fail ? `Failed inspection on ${lastInspected}: ${demo.fail}` : null,
      };
      const [id] = (await trx('items').insert(record)) as [number];
      await writeItemTerms(trx, { id, ...record });
      await appendAudit(trx, { actorId: manager.id, entity: 'item', entityId: id, action: 'item.created', after: { tag, kind: demo.kind, name: demo.name } });
      if (lastInspected) {
        await trx('inspections').insert({
          item_id: id,
          inspected_on: lastInspected,
          inspector_id: officer.id,
          result: demo.fail ? 'fail' : 'pass',
          readings: JSON.stringify([]),
          notes: demo.fail ?? 'Visual and continuity checks fine.',
          next_due: addDaysIso(lastInspected, interval),
        });
      }
    });
  }
  for (const [code, last] of counters) await knex('tag_sequences').insert({ code, last_value: last });
}
