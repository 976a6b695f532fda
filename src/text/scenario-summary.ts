import type { ScenarioChanges } from '@shared/schemas/scenarios';
import { formatPeriod, formatQuantity } from '@shared/text/format';

const shown = (x: number) => formatQuantity(x, 'setting');
const value = (v: number | number[], unit: string) =>
  Array.isArray(v) ? `${shown(Math.min(...v))}–${shown(Math.max(...v))} ${unit} by month` : `${shown(v)} ${unit}`;

/** One line naming a scenario's changes, e.g. "Black carbon in snow 400 ng/g · Warming +1 °C". */
export function scenarioSummary(c: ScenarioChanges): string {
  const parts: string[] = [];
  const nonZero = (v: number | number[]) => (Array.isArray(v) ? v.some((x) => x !== 0) : v !== 0);
  if (nonZero(c.blackCarbonSnowNgG)) parts.push(`Black carbon in snow ${value(c.blackCarbonSnowNgG, 'ng/g')}`);
  if (nonZero(c.blackCarbonIceNgG)) parts.push(`on ice ${value(c.blackCarbonIceNgG, 'ng/g')}`);
  if (nonZero(c.dustSnowUgG)) parts.push(`Dust in snow ${value(c.dustSnowUgG, 'µg/g')}`);
  if (nonZero(c.dustIceUgG)) parts.push(`on ice ${value(c.dustIceUgG, 'µg/g')}`);
  if (c.impuritiesByElevation.length > 0) parts.push(`impurities in ${c.impuritiesByElevation.length} elevation range(s)`);
  if (c.debrisThicknessChangeM !== 0) parts.push(`Debris ${c.debrisThicknessChangeM > 0 ? '+' : ''}${shown(c.debrisThicknessChangeM)} m`);
  if (c.debrisExtentChange !== 0) parts.push(`Debris extent +${Math.round(c.debrisExtentChange * 100)} %`);
  if (nonZero(c.temperatureDeltaC)) parts.push(`Warming ${value(c.temperatureDeltaC, '°C')}`);
  if (Array.isArray(c.precipitationFactor) || c.precipitationFactor !== 1) parts.push(`Precipitation × ${value(c.precipitationFactor, '')}`.trim());
  const parameterCount = Object.keys(c.parameters).length;
  if (parameterCount > 0) parts.push(`${parameterCount} parameter(s) changed`);
  const period = c.period ? formatPeriod(c.period.from, c.period.to) : 'no period set';
  return `${parts.length ? parts.join(' · ') : 'No changes'} (${period})`;
}
