import { cleanSnowAlbedo, impurityAlbedoChange } from './snow-albedo';

/**
 * Snow albedo tabulated over grain radius, so the hour-by-band loop reads a table instead of
 * calling pow. Nodes every TABLE_STEP_UM µm; linear interpolation between nodes differs from the
 * formula by < 2·10⁻⁵ in albedo (checked in tests).
 */
export const TABLE_MIN_UM = 10;
export const TABLE_STEP_UM = 2;

export interface SnowAlbedoTable {
  /** Clean-snow albedo αs at each node. */
  clean: Float64Array;
  /** Impurity change dαc at each node for one load. */
  impurity: Float64Array;
}

/** Builds the table for grains up to maxRadiusUm and one black-carbon-equivalent load (ng g⁻¹). */
export function buildSnowAlbedoTable(maxRadiusUm: number, blackCarbonEqNgG: number): SnowAlbedoTable {
  const nodes = Math.ceil((maxRadiusUm - TABLE_MIN_UM) / TABLE_STEP_UM) + 2;
  const clean = new Float64Array(nodes);
  const impurity = new Float64Array(nodes);
  for (let i = 0; i < nodes; i++) {
    const r = TABLE_MIN_UM + i * TABLE_STEP_UM;
    clean[i] = cleanSnowAlbedo(r);
    impurity[i] = impurityAlbedoChange(r, blackCarbonEqNgG);
  }
  return { clean, impurity };
}

/** Position of radius r in the table: integer node index plus fraction, packed as one number. */
export function tablePosition(grainRadiusUm: number): number {
  return (grainRadiusUm - TABLE_MIN_UM) / TABLE_STEP_UM;
}

/** Linear interpolation of a table at a position from tablePosition. */
export function readTable(values: Float64Array, position: number): number {
  const i = position | 0;
  const f = position - i;
  return values[i] + (values[i + 1] - values[i]) * f;
}
