import type { Knex } from 'knex';

/**
 * Idempotency keys sent with writes (`Idempotency-Key`): the first request with a key is carried
 * out, a retry with the same key gets the stored answer instead of doing it again. `committed`
 * is set in the same transaction as the request's first write, so a write whose answer was lost
 * is known to have happened. Kept for a day.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('idempotency_keys')) return;
  await knex.schema.createTable('idempotency_keys', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    t.string('idem_key', 255).notNullable();
    // SHA-256 of the method, path and body: the same key with another request is refused.
    t.specificType('fingerprint', 'CHAR(64)').notNullable();
    t.enum('state', ['started', 'committed', 'done']).notNullable().defaultTo('started');
    t.smallint('response_status').unsigned().nullable();
    t.specificType('response_body', 'MEDIUMTEXT').nullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.unique(['user_id', 'idem_key']);
    t.index(['created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('idempotency_keys');
}
