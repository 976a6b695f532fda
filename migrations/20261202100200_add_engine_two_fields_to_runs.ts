import type { Knex } from 'knex';

const MONTH_COLUMNS = ['rainfall_mm', 'surface_melt_mm', 'refrozen_mm', 'sublimation_mm', 'evaporation_mm', 'snow_cover_fraction', 'latent_heat_wm2'] as const;

/**
 * What engine 2.0 adds to a stored run: how each simulation started (spin-up or given state) and
 * where its shortwave came from, the run's requested start, and the new band × month figures
 * (rainfall, surface melt, refreezing, sublimation, evaporation, snow cover, latent heat). Rows of
 * runs made with engine 1.x keep NULL there.
 */
export async function up(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasColumn('run_members', 'start_report'))) {
    await knex.schema.alterTable('run_members', (t) => {
      t.json('start_report').nullable();
      t.string('shortwave_source', 40).nullable();
    });
  }
  if (!(await knex.schema.hasColumn('runs', 'start_options'))) {
    await knex.schema.alterTable('runs', (t) => {
      t.json('start_options').nullable();
    });
  }
  if (!(await knex.schema.hasColumn('run_band_months', 'rainfall_mm'))) {
    await knex.schema.alterTable('run_band_months', (t) => {
      for (const column of MONTH_COLUMNS) t.double(column).nullable();
    });
  }
}

export async function down(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('run_band_months', 'rainfall_mm')) {
    await knex.schema.alterTable('run_band_months', (t) => {
      for (const column of MONTH_COLUMNS) t.dropColumn(column);
    });
  }
  if (await knex.schema.hasColumn('runs', 'start_options')) await knex.schema.alterTable('runs', (t) => t.dropColumn('start_options'));
  if (await knex.schema.hasColumn('run_members', 'start_report')) {
    await knex.schema.alterTable('run_members', (t) => {
      t.dropColumn('start_report');
      t.dropColumn('shortwave_source');
    });
  }
}
