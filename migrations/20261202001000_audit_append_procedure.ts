import type { Knex } from 'knex';

// Appending to the audit chain serialises every audited write on the audit_head row. Done from the
// app, the row stayed locked across four round trips (read head, insert, move head, commit), each
// waiting for the app's event loop under load: 20+ transactions queued on it in the bench. This
// procedure takes the lock, chains, inserts and, for a transaction's last entry, commits, all
// inside the server in one call, so the lock is never held while the app is busy elsewhere.
//
// The entry's hash is SHA-256 over the canonical JSON of the entry with prevHash as its last key
// (server/services/audit.ts builds everything before the previous hash as `p_prefix`), so
// verifyAuditChain recomputes exactly the same value in Node.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('audit_head', (t) => {
    t.string('prev_hash', 64).notNullable().defaultTo('0'.repeat(64));
  });
  await knex.raw(`
    CREATE PROCEDURE audit_append(
      IN p_at TIMESTAMP(3), IN p_actor_id INT UNSIGNED, IN p_entity VARCHAR(40), IN p_entity_id VARCHAR(64),
      IN p_action VARCHAR(60), IN p_before LONGTEXT, IN p_after LONGTEXT, IN p_prefix LONGTEXT, IN p_commit BOOLEAN)
    MODIFIES SQL DATA
    BEGIN
      -- Assignments run left to right: prev_hash takes the old hash before hash moves on; the new
      -- hash reads hash, which is still the old one under either assignment mode.
      UPDATE audit_head SET prev_hash = hash, hash = SHA2(CONCAT(p_prefix, hash, '"}'), 256) WHERE id = 1;
      INSERT INTO audit_events (at, actor_id, entity, entity_id, action, \`before\`, \`after\`, prev_hash, hash)
        SELECT p_at, p_actor_id, p_entity, p_entity_id, p_action, p_before, p_after, prev_hash, hash FROM audit_head WHERE id = 1;
      -- An error above leaves the procedure before this line; the app then rolls back.
      IF p_commit THEN
        COMMIT;
      END IF;
    END`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('DROP PROCEDURE IF EXISTS audit_append');
  await knex.schema.alterTable('audit_head', (t) => {
    t.dropColumn('prev_hash');
  });
}
