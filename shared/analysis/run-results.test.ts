import { describe, expect, it } from 'vitest';
import { inventedValley } from '../melt/fixtures/invented-valley';
import type { Run } from '../schemas/runs';
import { scenarioChangesSchema } from '../schemas/scenarios';
import { CAUTIONS } from '../text/cautions';
import { planRun } from './run-plan';
import { runResults, type ResultMember } from './run-results';
import { simulateSummary } from './simulate-summary';

const valley = inventedValley({ bandCount: 3, years: 1, timeStep: 'daily' });
const elevations = valley.catchment.bands.map((b) => (b.lowerM + b.upperM) / 2);
const period = { from: '2022-04-01', to: '2022-09-30' };

function resultsOf(changes: object, baseline: object | null, attribution: boolean, ensembleSize = 0) {
  const plan = planRun({
    changes: scenarioChangesSchema.parse({ period, ...changes }), baselineChanges: baseline ? scenarioChangesSchema.parse({ period, ...baseline }) : null,
    attribution, ensembleSize, ensembleSeed: 4,
  }, elevations);
  const members: ResultMember[] = plan.members.map((m) => ({ ...m, summary: simulateSummary({ ...valley, ...m.input }) }));
  const run = { attribution, ensembleSize } as Run;
  return runResults(run, 'Invented valley', members, plan.drivers);
}

describe('run results', () => {
  it('attribute the whole added volume to the drivers and their interactions', () => {
    const r = resultsOf({ blackCarbonSnowNgG: 500, dustIceUgG: 80, temperatureDeltaC: 1.5 }, {}, true);
    const sum = r.attribution!.terms.reduce((a, t) => a + t.addedVolumeM3, 0);
    expect(r.attribution!.terms).toHaveLength(7);
    expect(sum).toBeCloseTo(r.totals.addedVolumeM3, 4);
    expect(r.cumulativeAddedM3.at(-1)).toBeCloseTo(r.totals.addedVolumeM3, 4);
    expect(r.cautions).toEqual(CAUTIONS);
  });

  it('show nothing added for a baseline run', () => {
    const r = resultsOf({}, null, false);
    expect(r.totals.addedVolumeM3).toBe(0);
    expect(r.dischargeM3s.baseline).toEqual(r.dischargeM3s.variant);
    expect(r.attribution).toBeNull();
  });

  it('give ensemble bands that bracket their median every day', () => {
    const r = resultsOf({ blackCarbonIceNgG: 1500 }, {}, false, 6);
    const { p5, p50, p95 } = r.ensemble!.addedDischargeM3s;
    p50.forEach((m, d) => {
      expect(p5[d]).toBeLessThanOrEqual(m);
      expect(m).toBeLessThanOrEqual(p95[d]);
    });
  });
});
