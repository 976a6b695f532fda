import type { Knex } from 'knex';

/** Parameters engine 1.x had and 2.0 does not (shared/melt/parameters.ts, RETIRED_PARAMETER_NAMES). */
const RETIRED = ['transmissivity', 'diffuseFraction', 'iceSurfaceLayerMm', 'minDebrisThicknessM'];
const SNOW_LOADS = [['blackCarbonSnowNgG', 'background_black_carbon_ng_g'], ['dustSnowUgG', 'background_dust_ug_g']] as const;

type Changes = Record<string, unknown> & { parameters?: Record<string, number>; impuritiesByElevation?: Record<string, unknown>[] };

/** A snow load stated as a concentration in the snow becomes the load added to the background (never below 0). */
function added(value: unknown, background: number): unknown {
  if (typeof value === 'number') return Math.max(0, value - background);
  if (Array.isArray(value)) return value.map((v) => (typeof v === 'number' ? Math.max(0, v - background) : v));
  return value;
}

/**
 * Stored scenario changes, version 1 → 2 (shared/schemas/scenarios.ts): snow loads were the
 * concentration in the snow and are now what is added to the catchment's background, so the
 * background is taken off them (the fresh-snow concentration stays what the user entered); dry
 * deposition rates start at 0; retired parameters are dropped. Runs keep the changes they were made
 * with. Going down restores version 1 (loads plus background; retired parameters are not restored).
 */
export async function up(knex: Knex): Promise<void> {
  await convert(knex, 1, 2, (changes, background) => {
    for (const [key, column] of SNOW_LOADS) changes[key] = added(changes[key] ?? 0, background[column]);
    for (const range of changes.impuritiesByElevation ?? []) {
      for (const [key, column] of SNOW_LOADS) if (key in range) range[key] = added(range[key], background[column]);
    }
    changes.blackCarbonDepositionUgM2Day = 0;
    changes.dustDepositionMgM2Day = 0;
    for (const name of RETIRED) delete changes.parameters?.[name];
  });
}

export async function down(knex: Knex): Promise<void> {
  await convert(knex, 2, 1, (changes, background) => {
    const plus = (value: unknown, b: number) => (typeof value === 'number' ? value + b : Array.isArray(value) ? value.map((v) => v + b) : value);
    for (const [key, column] of SNOW_LOADS) changes[key] = plus(changes[key] ?? 0, background[column]);
    for (const range of changes.impuritiesByElevation ?? []) {
      for (const [key, column] of SNOW_LOADS) if (key in range) range[key] = plus(range[key], background[column]);
    }
    delete changes.blackCarbonDepositionUgM2Day;
    delete changes.dustDepositionMgM2Day;
  });
}

/** Row by row in one transaction: monthly loads are arrays, which SQL's JSON functions cannot subtract from. */
async function convert(knex: Knex, from: number, to: number, change: (changes: Changes, background: Record<string, number>) => void): Promise<void> {
  const rows: { id: number; changes: string | Changes; background_black_carbon_ng_g: number; background_dust_ug_g: number }[] = await knex('scenarios as s')
    .join('catchments as c', 'c.id', 's.catchment_id')
    .where('s.schema_version', from)
    .select('s.id', 's.changes', 'c.background_black_carbon_ng_g', 'c.background_dust_ug_g');
  await knex.transaction(async (trx) => {
    for (const row of rows) {
      const changes: Changes = typeof row.changes === 'string' ? JSON.parse(row.changes) : row.changes;
      change(changes, { background_black_carbon_ng_g: row.background_black_carbon_ng_g, background_dust_ug_g: row.background_dust_ug_g });
      changes.schemaVersion = to;
      await trx('scenarios').where('id', row.id).update({ schema_version: to, changes: JSON.stringify(changes) });
    }
  });
}
