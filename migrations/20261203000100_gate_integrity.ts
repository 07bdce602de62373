import type { Knex } from 'knex';

// What the gate needs to bind decisions to what was decided:
// - approvals.basis: the plan, window, location, purpose, item set and assessment figures the
//   officer reviewed (shared/rules/approval-basis.ts); release compares it with the figures now.
// - lab_rules.confirmed_rules / pending_editors: a change of the lab's rules applies to the
//   officers who made it only once another officer confirms it (server/services/lab-rules.ts), so
//   nobody loosens the rules for their own tests.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('approvals', (t) => {
    t.json('basis').nullable();
  });
  await knex.schema.alterTable('lab_rules', (t) => {
    t.json('confirmed_rules').nullable();
    t.json('pending_editors').nullable();
  });
  const row = await knex('lab_rules').where({ id: 1 }).first();
  if (row) {
    const confirmed = {
      approvalKv: Number(row.approval_kv),
      energyThresholdJ: Number(row.energy_threshold_j),
      ratingMarginPct: Number(row.rating_margin_pct),
      interlockKv: Number(row.interlock_kv),
      safeResidualV: Number(row.safe_residual_v),
      earlyPickupMin: Number(row.early_pickup_min),
      overdueGraceMin: Number(row.overdue_grace_min),
    };
    await knex('lab_rules')
      .where({ id: 1 })
      .update({ confirmed_rules: JSON.stringify(confirmed), pending_editors: '[]' });
  }
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_rules', (t) => {
    t.dropColumn('pending_editors');
    t.dropColumn('confirmed_rules');
  });
  await knex.schema.alterTable('approvals', (t) => {
    t.dropColumn('basis');
  });
}
