import type { Knex } from 'knex';

/** The stored changes of a baseline without changes, schema version 1 (shared/schemas/scenarios.ts). */
const UNCHANGED_V1 = JSON.stringify({
  schemaVersion: 1, period: null, temperatureDeltaC: 0, warmingLevel: null, precipitationFactor: 1, blackCarbonSnowNgG: 0,
  blackCarbonIceNgG: 0, dustSnowUgG: 0, dustIceUgG: 0, impuritiesByElevation: [], debrisThicknessChangeM: 0, debrisExtentChange: 0, parameters: {},
});

const COLUMN = 'baseline_catchment_id';
const INDEX = 'scenarios_one_baseline_per_catchment';

/**
 * Every catchment has exactly one baseline, known by its flag rather than its name. Baselines used to
 * be made on first use under the name "Baseline", so a variant already called that blocked them.
 * Repairs existing data, then lets the database keep the rule:
 * 1. a catchment with several flagged rows keeps its oldest as the baseline;
 * 2. variants named "Baseline" (any case) are renamed "Baseline (variant <id>)";
 * 3. catchments without a baseline get one (no changes, no period yet);
 * 4. a generated column, the catchment id for the baseline and NULL for variants, is unique.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('scenarios', COLUMN)) return;
  await knex.raw(`UPDATE scenarios s JOIN (
      SELECT catchment_id, MIN(id) AS keep FROM scenarios WHERE is_baseline = 1 GROUP BY catchment_id HAVING COUNT(*) > 1
    ) d ON d.catchment_id = s.catchment_id
    SET s.is_baseline = 0 WHERE s.is_baseline = 1 AND s.id <> d.keep`);
  await knex.raw(`UPDATE scenarios SET name = CONCAT('Baseline (variant ', id, ')')
    WHERE is_baseline = 0 AND LOWER(TRIM(name)) = 'baseline'`);
  await knex.raw(`INSERT INTO scenarios (organisation_id, catchment_id, name, description, is_baseline, schema_version, changes)
    SELECT c.organisation_id, c.id, 'Baseline', 'The station record without changes.', 1, 1, ?
    FROM catchments c WHERE NOT EXISTS (SELECT 1 FROM scenarios s WHERE s.catchment_id = c.id AND s.is_baseline = 1)`, [UNCHANGED_V1]);
  await knex.raw(`ALTER TABLE scenarios
    ADD COLUMN ${COLUMN} INT UNSIGNED AS (IF(is_baseline, catchment_id, NULL)) VIRTUAL,
    ADD UNIQUE INDEX ${INDEX} (${COLUMN})`);
}

/** Drops the rule; the repaired rows stay as they are (they are valid data either way). */
export async function down(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasColumn('scenarios', COLUMN))) return;
  await knex.raw(`ALTER TABLE scenarios DROP INDEX ${INDEX}, DROP COLUMN ${COLUMN}`);
}
