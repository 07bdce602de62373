import type { Knex } from 'knex';

// Starter checklists every lab gets; officers edit them (common practice, no single source; the
// steps follow the test-area practice of IEEE Std 510 general guides and the lab's own rules).
const PRE = [
  { kind: 'confirm', text: 'Interlock tested: opening the enclosure door or barrier gate cuts the supply.', applies_with_kind: 'interlock' },
  { kind: 'confirm', text: 'Grounding stick attached to the lab ground point and within reach of the operator.' },
  { kind: 'confirm', text: 'Isolation stand in place, clean and dry.' },
  { kind: 'confirm', text: 'Barrier at or beyond the limited approach boundary shown in the assessment.' },
  { kind: 'confirm', text: 'Second person present, briefed, and knows where the emergency stop is.', applies_from_kv: 15 },
  { kind: 'confirm', text: 'Probe or divider rated for the planned voltage and connected ground lead first.', applies_with_kind: 'probe' },
  {
    kind: 'reading',
    text: 'Bleeder resistance measured at the output (supply off).',
    unit: 'MΩ',
    min_value: 10,
    max_value: 2000,
    applies_with_kind: 'hv-supply',
  },
  { kind: 'photo', text: 'Photo of the barrier and ground connection (optional).', required: false },
];
const RETURN = [
  { kind: 'confirm', text: 'Output switched off and the supply unplugged.' },
  { kind: 'confirm', text: 'Grounding stick applied to the output for at least the computed bleed-down time, then left attached.' },
  { kind: 'reading', text: 'Residual voltage at the output.', unit: 'V', min_value: 0, max_from_rule: 'safeResidualV' },
  { kind: 'confirm', text: 'Each item checked for damage; damaged items are marked in the return form.' },
];

export async function up(knex: Knex): Promise<void> {
  const rows = [
    ...PRE.map((row, index) => ({ phase: 'pre', position: index * 10, ...row })),
    ...RETURN.map((row, index) => ({ phase: 'return', position: index * 10, ...row })),
  ];
  await knex('checklist_templates').insert(rows);
}

export async function down(knex: Knex): Promise<void> {
  await knex('checklist_templates').delete();
}
