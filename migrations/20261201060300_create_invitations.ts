import type { Knex } from 'knex';

/** Invitation tokens (sha256 of the secret only) for users in status `invited`. */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('invitations')) return;
  await knex.schema.createTable('invitations', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    t.integer('invited_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.string('token_hash', 64).notNullable().unique();
    t.datetime('expires_at').notNullable();
    t.datetime('used_at').nullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.index(['organisation_id', 'user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('invitations');
}
