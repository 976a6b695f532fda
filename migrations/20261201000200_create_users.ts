import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('users')) return;
  await knex.schema.createTable('users', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.string('email', 254).notNullable().unique();
    t.string('name', 120).notNullable();
    t.string('password_hash', 100).nullable();
    t.enum('role', ['admin', 'consultant', 'scientist', 'client']).notNullable();
    t.enum('status', ['active', 'invited', 'disabled']).notNullable().defaultTo('active');
    // Bumped on sign-out and password change: tokens carrying an older version are refused.
    t.integer('token_version').unsigned().notNullable().defaultTo(0);
    t.timestamp('last_sign_in_at').nullable();
    t.timestamps(true, true);
    t.index(['organisation_id', 'role']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('users');
}
