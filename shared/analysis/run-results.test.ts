import { describe, expect, it } from 'vitest';
import { inventedValley } from '../melt/fixtures/invented-valley';
import type { Run } from '../schemas/runs';
import { scenarioChangesSchema } from '../schemas/scenarios';
import { CAUTIONS, ICE_DARKENING_CAUTION } from '../text/cautions';
import { planRun } from './run-plan';
import { runResults, type ResultContext, type ResultMember } from './run-results';
import { calibrationStatus } from './run-set-up';
import { simulateSummary } from './simulate-summary';

const valley = inventedValley({ bandCount: 3, years: 1, timeStep: 'daily' });
const elevations = valley.catchment.bands.map((b) => (b.lowerM + b.upperM) / 2);
const period = { from: '2022-04-01', to: '2022-09-30' };

const UNCALIBRATED: ResultContext = { calibration: calibrationStatus({}, 1, null), skill: null, iceDarkened: false, waterSide: [] };

function resultsOf(changes: object, baseline: object | null, attribution: boolean, ensembleSize = 0, context = UNCALIBRATED) {
  const plan = planRun({
    changes: scenarioChangesSchema.parse({ period, ...changes }), baselineChanges: baseline ? scenarioChangesSchema.parse({ period, ...baseline }) : null,
    attribution, ensembleSize, ensembleSeed: 4,
  }, elevations);
  const members: ResultMember[] = plan.members.map((m) => ({ ...m, summary: simulateSummary({ ...valley, ...m.input }) }));
  const run = { attribution, ensembleSize } as Run;
  return runResults(run, 'Invented valley', members, plan.drivers, context);
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

  it('say how the run started, where its shortwave came from and whether it was calibrated', () => {
    const r = resultsOf({ blackCarbonSnowNgG: 100 }, {}, false);
    expect(r.setUp.start).toMatchObject({ label: 'Spun up through the record before the period', adequate: true });
    expect(r.setUp.shortwaveSource).toBe('Clear-sky model with the cloudiness series');
    expect(r.setUp.calibration.status).toBe('uncalibrated');
    expect(r.setUp.calibration.message).toMatch(/^Not calibrated/);
  });

  it('add the bare-ice sensitivity to the cautions when a run darkens ice', () => {
    const r = resultsOf({ blackCarbonIceNgG: 500 }, {}, false, 0, { ...UNCALIBRATED, iceDarkened: true });
    expect(r.cautions).toEqual([...CAUTIONS, ICE_DARKENING_CAUTION]);
  });

  it('give a water balance whose runoff is the sum of melt and rain that ran off', () => {
    const r = resultsOf({}, {}, false);
    const w = r.waterBalance.baseline;
    const areaM2 = r.bands.reduce((a, b) => a + b.areaM2, 0);
    const dailyRunoffMm = (r.dischargeM3s.baseline.reduce((a, q) => a + q, 0) * 86_400 / areaM2) * 1000;
    expect(w.runoffMm).toBeCloseTo(dailyRunoffMm, 6);
    // Over a season, rain and melt feed the runoff; refreezing and vapour losses keep some back.
    expect(w.runoffMm).toBeLessThanOrEqual(w.rainfallMm + w.surfaceMeltMm + 1e-6);
    expect(w.refrozenMm).toBeGreaterThanOrEqual(0);
  });

  it('give ensemble bands that bracket their median every day', () => {
    const r = resultsOf({ blackCarbonIceNgG: 1500 }, {}, false, 6);
    const { p5, p50, p95 } = r.ensemble!.addedDischargeM3s;
    p50.forEach((m, d) => {
      expect(p5[d]).toBeLessThanOrEqual(m);
      expect(m).toBeLessThanOrEqual(p95[d]);
    });
    const range = r.ensemble!.totals.addedShareOfBaselineRunoff;
    const inside = r.totals.addedShareOfBaselineRunoff >= range.p5 && r.totals.addedShareOfBaselineRunoff <= range.p95;
    expect(r.ensemble!.note === null).toBe(inside);
  });
});
