import { describe, expect, it } from 'vitest';
import { scenarioChangesSchema, scenarioCreateSchema } from './scenarios';

function firstIssue(value: unknown) {
  const parsed = scenarioCreateSchema.safeParse(value);
  if (parsed.success) throw new Error('expected a refusal');
  const issue = parsed.error.issues[0];
  return { path: issue.path.join('.'), message: issue.message };
}

describe('scenario changes', () => {
  it('fill unset changes with no-change defaults and the schema version', () => {
    const changes = scenarioChangesSchema.parse({});
    expect(changes).toMatchObject({ schemaVersion: 2, temperatureDeltaC: 0, precipitationFactor: 1, blackCarbonSnowNgG: 0, period: null, parameters: {} });
  });

  it('accept constant or twelve monthly values', () => {
    expect(scenarioChangesSchema.parse({ temperatureDeltaC: Array(12).fill(1.2) }).temperatureDeltaC).toHaveLength(12);
  });

  it('name the field and the allowed range in plain words', () => {
    expect(firstIssue({ name: 'x', changes: { blackCarbonSnowNgG: -5 } })).toEqual({ path: 'changes.blackCarbonSnowNgG', message: 'must be at least 0 ng/g' });
    expect(firstIssue({ name: 'x', changes: { parameters: { lapseRateCPerKm: -20 } } })).toEqual({ path: 'changes.parameters.lapseRateCPerKm', message: 'must be at least -10 °C km⁻¹' });
    expect(firstIssue({ name: 'x', changes: { period: { from: '2022-09-01', to: '2022-04-01' } } })).toEqual({ path: 'changes.period.to', message: 'must not be before the start of the period' });
    expect(firstIssue({ name: ' ', changes: {} })).toEqual({ path: 'name', message: 'is required' });
  });

  it('refuse unknown changes and parameters', () => {
    expect(firstIssue({ name: 'x', changes: { soot: 1 } }).path).toBe('changes');
    expect(firstIssue({ name: 'x', changes: { parameters: { albedoMagic: 1 } } }).path).toBe('changes.parameters');
  });
});
