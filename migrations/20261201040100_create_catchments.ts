import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('catchments')) return;
  await knex.schema.createTable('catchments', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.string('name', 120).notNullable();
    t.text('description').notNullable();
    t.double('latitude_deg').notNullable();
    t.double('longitude_deg').notNullable();
    t.string('time_zone', 64).notNullable();
    t.string('station_name', 120).notNullable();
    t.double('station_elevation_m').notNullable();
    t.string('outlet_description', 500).notNullable().defaultTo('');
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    // Set instead of deleting when runs refer to the catchment.
    t.timestamp('archived_at').nullable();
    t.timestamps(true, true);
    t.unique(['organisation_id', 'name']);
    t.index(['organisation_id', 'archived_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('catchments');
}
