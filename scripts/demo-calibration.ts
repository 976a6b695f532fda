/**
 * Calibrates the demo catchment against its synthetic discharge exactly as the lab does (daily
 * KGE over the 2023 melt season, lapse rate and precipitation factor, from the engine defaults)
 * and prints the module seeds/data/demo-calibration.ts, which the demo seed saves as the
 * catchment's calibration. Run after a deliberate model change:
 *   npm run demo:calibration
 */
import { calibrateDemo } from '../seeds/data/demo-calibrate';

const { set, kge, scores, ranges } = calibrateDemo();
const round = (v: number) => Number(v.toPrecision(6));
process.stdout.write(`import type { CalibrationSet } from '../../shared/lab/calibration-set';
import type { SkillScores } from '../../shared/lab/skill-scores';

/**
 * The demo catchment's saved calibration, as the lab finds it from the demo's synthetic discharge
 * (regenerate with scripts/demo-calibration.ts; seeds/data/demo-calibrate.test.ts checks it).
 */
export const DEMO_CALIBRATION: {
  set: CalibrationSet; kge: number; scores: { daily: SkillScores; monthly: SkillScores | null }; ranges: { key: string; low: number; high: number }[];
} = ${tsLiteral({
  set: { parameters: Object.fromEntries(Object.entries(set.parameters).map(([k, v]) => [k, round(v as number)])), precipitationFactor: round(set.precipitationFactor) },
  kge: round(kge),
  scores: roundDeep(scores),
  ranges: ranges.map((r) => ({ key: r.key, low: round(r.low), high: round(r.high) })),
})};
`);

function roundDeep(value: unknown): unknown {
  if (typeof value === 'number') return Number.isInteger(value) ? value : round(value);
  if (value && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, roundDeep(v)]));
  return value;
}

/** JSON as a TypeScript literal in this repository's style: bare keys, single quotes. */
function tsLiteral(value: unknown): string {
  return JSON.stringify(value, null, 2).replace(/"(\w+)":/g, '$1:').replace(/"/g, "'");
}
