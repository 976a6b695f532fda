import { describe, expect, it } from 'vitest';
import { bandTableProblems } from '../schemas/catchment-bands';
import { z } from 'zod';
import { describeIssue, describeRowProblem, plainIssueMessage } from './issue-messages';
import { fieldErrors } from '../schemas/field-errors';
import { headerOf, labelOf } from './labels';

const band = (lowerM: number, upperM: number, extra: Record<string, number> = {}) => ({
  lowerM, upperM, areaKm2: 2, slopeDeg: 20, aspectDeg: 180, glacierFraction: 0.5, debrisFraction: 0.2, debrisThicknessM: 0.1, ...extra,
});

describe('words for people', () => {
  it('labels every key with words and a unit, never the key', () => {
    expect(headerOf('lowerM')).toBe('Lower elevation, m');
    expect(headerOf('areaKm2')).toBe('Area, km²');
    expect(labelOf('changes.parameters.etiThresholdC').label).toBe('Melt threshold (reference model)');
    expect(labelOf('lapseRateCPerKm').citation).toBe('Gardner et al. 2009');
    expect(labelOf('bands.3.debrisFraction').label).toBe('Debris-covered fraction');
    // A key nobody labelled still reads as words.
    expect(labelOf('someNewThingM').label).toBe('Some new thing m');
  });

  it('says a range in words, with the row and the field', () => {
    expect(plainIssueMessage({ code: 'too_big', path: [1, 'debrisFraction'], message: 'Too big: expected number to be <=1', maximum: 1 })).toBe('must be between 0 and 1');
    expect(plainIssueMessage({ code: 'too_small', path: [0, 'areaKm2'], message: 'Too small', minimum: 0, inclusive: false })).toBe('must be more than 0 km²');
    expect(plainIssueMessage({ code: 'custom', path: [0, 'lowerM'], message: 'overlaps the band below' })).toBe('overlaps the band below');
    expect(describeRowProblem({ row: 2, column: 'debrisFraction', message: 'must be between 0 and 1' })).toBe('Row 2, debris-covered fraction: must be between 0 and 1');
  });

  it('reports every problem of a band table at once, sorted by row', () => {
    const problems = bandTableProblems([band(3000, 3200), band(3100, 3400, { glacierFraction: 2 }), band(3400, 3600, { slopeDeg: 95 })]);
    expect(problems.map((p) => describeRowProblem(p))).toEqual([
      'Row 2, glacier fraction: must be between 0 and 1',
      'Row 2, lower elevation: overlaps the band below (its upper edge is 3200 m); sort bands from low to high without overlaps',
      'Row 3, mean slope: must be between 0 and 89°',
    ]);
  });

  it('never passes zod\'s own wording on, and names the field in words', () => {
    const schema = z.object({ stationName: z.string(), changes: z.object({ temperatureDeltaC: z.number(), parameters: z.object({ iceAlbedo: z.number().max(0.51) }) }) });
    const parsed = schema.safeParse({ changes: { temperatureDeltaC: 'hot', parameters: { iceAlbedo: 5 } } });
    expect(parsed.success).toBe(false);
    const sentences = parsed.error!.issues.map(describeIssue);
    expect(sentences).toEqual([
      'Reference station: is required',
      'Temperature change: must be a number',
      'Bare-ice albedo today: must be between 0.25 and 0.51',
    ]);
    expect(Object.values(fieldErrors(parsed.error!.issues)).join(' ')).not.toMatch(/Invalid|expected|Too big/);
    // Messages the schemas write for people pass as written; rows count from 1.
    expect(describeIssue({ code: 'custom', path: ['changes', 'impuritiesByElevation', 1, 'blackCarbonSnowNgG'], message: 'overlaps the range above' }))
      .toBe('Row 2, black carbon in snow: overlaps the range above');
  });
});

