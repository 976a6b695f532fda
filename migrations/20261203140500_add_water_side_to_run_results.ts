import type { Knex } from 'knex';

const DAILY_COLUMNS = ['routed_snow_m3', 'routed_ice_m3', 'routed_debris_ice_m3', 'routed_rain_m3'] as const;
const MONTH_COLUMNS = ['wind_drift_mm', 'avalanche_mm'] as const;

/**
 * What engine 2.1 adds to a stored run member: the outlet discharge routed through the
 * catchment's stores (by source; NULL without routing, when the outlet is the unrouted runoff)
 * and the snow each band gained or lost by wind drift and avalanching. Runs of earlier engines keep NULL.
 */
export async function up(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasColumn('run_daily', 'routed_snow_m3'))) {
    await knex.schema.alterTable('run_daily', (t) => {
      for (const column of DAILY_COLUMNS) t.double(column).nullable();
    });
  }
  if (!(await knex.schema.hasColumn('run_band_months', 'wind_drift_mm'))) {
    await knex.schema.alterTable('run_band_months', (t) => {
      for (const column of MONTH_COLUMNS) t.double(column).nullable();
    });
  }
}

export async function down(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('run_band_months', 'wind_drift_mm')) {
    await knex.schema.alterTable('run_band_months', (t) => {
      for (const column of MONTH_COLUMNS) t.dropColumn(column);
    });
  }
  if (await knex.schema.hasColumn('run_daily', 'routed_snow_m3')) {
    await knex.schema.alterTable('run_daily', (t) => {
      for (const column of DAILY_COLUMNS) t.dropColumn(column);
    });
  }
}
