import { describe, expect, it } from 'vitest';
import { scenarioChangesSchema } from '../schemas/scenarios';
import { planRun, RunPlanError } from './run-plan';

const BANDS = [3100, 3500, 3900];
const baseline = scenarioChangesSchema.parse({ parameters: { lapseRateCPerKm: -6 } });
const variant = scenarioChangesSchema.parse({ blackCarbonSnowNgG: 400, dustIceUgG: 50, temperatureDeltaC: 1, parameters: { turbidity: 0.8 } });

describe('run plan', () => {
  it('pairs a variant with its baseline on the same parameters, the variant\'s over the baseline\'s', () => {
    const plan = planRun({ changes: variant, baselineChanges: baseline, attribution: false, ensembleSize: 0, ensembleSeed: 1 }, BANDS);
    expect(plan.members.map((m) => m.key)).toEqual(['scenario', 'baseline']);
    expect(plan.members[0].input.parameters).toEqual({ lapseRateCPerKm: -6, turbidity: 0.8 });
    expect(plan.members[1].input.parameters).toEqual({ lapseRateCPerKm: -6, turbidity: 0.8 });
    expect(plan.members[1].input.scenario.blackCarbonSnowNgG).toBe(0);
  });

  it('runs every member with the physics options the baseline chose unless the variant sets its own', () => {
    const corrected = scenarioChangesSchema.parse({ ...baseline, stabilityCorrection: true });
    const plan = planRun({ changes: variant, baselineChanges: corrected, attribution: true, ensembleSize: 2, ensembleSeed: 1 }, BANDS);
    expect(plan.members.every((m) => m.input.physics?.stabilityCorrection === true)).toBe(true);
  });

  it('adds the 2^N − 2 mixed combinations for attribution', () => {
    const plan = planRun({ changes: variant, baselineChanges: baseline, attribution: true, ensembleSize: 0, ensembleSeed: 1 }, BANDS);
    expect(plan.drivers).toEqual(['blackCarbon', 'dust', 'warming']);
    expect(plan.members.filter((m) => m.kind === 'combination')).toHaveLength(6);
  });

  it('adds a scenario and a baseline per ensemble member, with shared sampled parameters', () => {
    const plan = planRun({ changes: variant, baselineChanges: baseline, attribution: false, ensembleSize: 5, ensembleSeed: 3 }, BANDS);
    const members = plan.members.filter((m) => m.ensembleIndex === 2);
    expect(members.map((m) => m.kind)).toEqual(['ensemble-scenario', 'ensemble-baseline']);
    expect(members[0].input.parameters).toEqual(members[1].input.parameters);
  });

  it('refuses attribution of a baseline or of a variant without changes', () => {
    expect(() => planRun({ changes: baseline, baselineChanges: null, attribution: true, ensembleSize: 0, ensembleSeed: 1 }, BANDS)).toThrow(RunPlanError);
    expect(() => planRun({ changes: baseline, baselineChanges: baseline, attribution: true, ensembleSize: 0, ensembleSeed: 1 }, BANDS)).toThrow(/changes nothing/);
  });

  it('splits members into band groups when impurities differ by elevation, and attributes band-only changes', () => {
    const ranged = scenarioChangesSchema.parse({ impuritiesByElevation: [{ fromM: 3400, toM: 4000, blackCarbonIceNgG: 800 }] });
    const plan = planRun({ changes: ranged, baselineChanges: baseline, attribution: true, ensembleSize: 0, ensembleSeed: 1 }, BANDS);
    expect(plan.drivers).toEqual(['blackCarbon']);
    expect(plan.members[0].input.parts?.map((p) => [p.bandIndices, p.scenario.blackCarbonIceNgG])).toEqual([[[0], 0], [[1, 2], 800]]);
    expect(plan.members[1].input.parts).toBeNull();
  });
});
