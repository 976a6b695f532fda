import type { Knex } from 'knex';

const COLUMN = 'reference_catchment_id';
const INDEX = 'stations_one_reference_per_catchment';

/**
 * Weather stations of a catchment, run by different networks with different instruments. One per
 * catchment is its reference station, whose series drive the engine (its name and elevation are
 * the catchment's station_name and station_elevation_m); the others feed the fitted vertical
 * gradients and comparisons. Existing catchments get their reference station from those columns;
 * a generated column keeps one reference per catchment.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('stations')) return;
  await knex.schema.createTable('stations', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
    t.string('name', 120).notNullable();
    t.string('network', 120).notNullable().defaultTo('');
    t.string('instrument', 200).notNullable().defaultTo('');
    t.double('elevation_m').notNullable();
    t.double('latitude_deg').nullable();
    t.double('longitude_deg').nullable();
    // Stated accuracy per variable: [{ variable, statement }].
    t.json('accuracy').notNullable();
    t.string('licence', 500).notNullable().defaultTo('');
    t.boolean('is_reference').notNullable().defaultTo(false);
    t.timestamps(true, true);
    t.unique(['catchment_id', 'name']);
    t.index(['organisation_id', 'catchment_id']);
  });
  await knex.raw(`INSERT INTO stations (organisation_id, catchment_id, name, elevation_m, accuracy, is_reference)
    SELECT organisation_id, id, station_name, station_elevation_m, '[]', 1 FROM catchments`);
  await knex.raw(`ALTER TABLE stations
    ADD COLUMN ${COLUMN} INT UNSIGNED AS (IF(is_reference, catchment_id, NULL)) VIRTUAL,
    ADD UNIQUE INDEX ${INDEX} (${COLUMN})`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('stations');
}
