import { describe, expect, it } from 'vitest';
import { simulate } from './simulate';
import { resultToJson } from './result-json';
import input from './fixtures/golden-season.input.json';
import expected from './fixtures/golden-season.output.json';

/**
 * Golden run: an invented four-band catchment through one melt season (May–September, daily
 * forcing, darkening and warming scenario). The expected output is checked in and regenerated
 * only on purpose, after a deliberate change to the model:
 *   npm run --silent engine -- shared/melt/fixtures/golden-season.input.json > shared/melt/fixtures/golden-season.output.json
 * Tolerance: 10⁻⁹ relative (plus 10⁻⁹ absolute), room for floating-point differences between platforms.
 */
function compare(actual: unknown, wanted: unknown, path: string, problems: string[]): void {
  if (typeof wanted === 'number') {
    const ok = typeof actual === 'number' && Math.abs(actual - wanted) <= 1e-9 + 1e-9 * Math.abs(wanted);
    if (!ok && problems.length < 10) problems.push(`${path}: expected ${wanted}, got ${String(actual)}`);
  } else if (Array.isArray(wanted)) {
    if (!Array.isArray(actual) || actual.length !== wanted.length) problems.push(`${path}: length differs`);
    else wanted.forEach((w, i) => compare(actual[i], w, `${path}[${i}]`, problems));
  } else if (wanted && typeof wanted === 'object') {
    const a = actual as Record<string, unknown>;
    for (const key of Object.keys(wanted)) compare(a?.[key], (wanted as Record<string, unknown>)[key], `${path}.${key}`, problems);
  } else if (actual !== wanted) problems.push(`${path}: expected ${String(wanted)}, got ${String(actual)}`);
}

describe('golden season', () => {
  it('reproduces the checked-in output', () => {
    const problems: string[] = [];
    compare(resultToJson(simulate(input)), expected, 'result', problems);
    expect(problems).toEqual([]);
  });
  it('the golden season melts snow and ice and darkening is in play', () => {
    expect(expected.bandTotals.snowMeltMm.reduce((a, b) => a + b, 0)).toBeGreaterThan(0);
    expect(expected.bandTotals.iceMeltMm.reduce((a, b) => a + b, 0)).toBeGreaterThan(0);
  });
});
