import { describe, expect, it } from 'vitest';
import { scenarioChangesSchema } from '../schemas/scenarios';
import { planRun, RunPlanError } from './run-plan';

const baseline = scenarioChangesSchema.parse({ parameters: { lapseRateCPerKm: -6 } });
const variant = scenarioChangesSchema.parse({ blackCarbonSnowNgG: 400, dustIceUgG: 50, temperatureDeltaC: 1, parameters: { transmissivity: 0.8 } });

describe('run plan', () => {
  it('pairs a variant with its baseline on the same parameters, the variant\'s over the baseline\'s', () => {
    const plan = planRun({ changes: variant, baselineChanges: baseline, attribution: false, ensembleSize: 0, ensembleSeed: 1 });
    expect(plan.members.map((m) => m.key)).toEqual(['scenario', 'baseline']);
    expect(plan.members[0].input.parameters).toEqual({ lapseRateCPerKm: -6, transmissivity: 0.8 });
    expect(plan.members[1].input.parameters).toEqual({ lapseRateCPerKm: -6, transmissivity: 0.8 });
    expect(plan.members[1].input.scenario.blackCarbonSnowNgG).toBe(0);
  });

  it('adds the 2^N − 2 mixed combinations for attribution', () => {
    const plan = planRun({ changes: variant, baselineChanges: baseline, attribution: true, ensembleSize: 0, ensembleSeed: 1 });
    expect(plan.drivers).toEqual(['blackCarbon', 'dust', 'warming']);
    expect(plan.members.filter((m) => m.kind === 'combination')).toHaveLength(6);
  });

  it('adds a scenario and a baseline per ensemble member, with shared sampled parameters', () => {
    const plan = planRun({ changes: variant, baselineChanges: baseline, attribution: false, ensembleSize: 5, ensembleSeed: 3 });
    const members = plan.members.filter((m) => m.ensembleIndex === 2);
    expect(members.map((m) => m.kind)).toEqual(['ensemble-scenario', 'ensemble-baseline']);
    expect(members[0].input.parameters).toEqual(members[1].input.parameters);
  });

  it('refuses attribution of a baseline or of a variant without changes', () => {
    expect(() => planRun({ changes: baseline, baselineChanges: null, attribution: true, ensembleSize: 0, ensembleSeed: 1 })).toThrow(RunPlanError);
    expect(() => planRun({ changes: baseline, baselineChanges: baseline, attribution: true, ensembleSize: 0, ensembleSeed: 1 })).toThrow(/changes nothing/);
  });
});
