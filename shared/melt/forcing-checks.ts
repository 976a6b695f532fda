import type { z } from 'zod';
import { addDays, daysBetween } from './calendar';

type Series = (number | null)[];

interface CheckedInput {
  catchment: { bands: unknown[] };
  forcing: {
    timeStep: 'hourly' | 'daily';
    start: string;
    temperatureC?: Series;
    tMinC?: Series;
    tMaxC?: Series;
    tMeanC?: Series;
    precipitationStep?: 'hourly' | 'daily';
    precipitationMm: Series;
    cloudiness?: Series;
    windMs?: Series;
    relativeHumidity?: Series;
  };
  initialState?: { sweMm: number[] };
  period?: { from: string; to: string };
}

/** Number of whole days in the forcing (hourly series must cover whole days). */
export function forcingDayCount(forcing: CheckedInput['forcing']): number {
  return forcing.timeStep === 'hourly' ? Math.floor((forcing.temperatureC?.length ?? 0) / 24) : forcing.tMinC?.length ?? 0;
}

/**
 * Cross-field checks of a simulation input: series lengths agree, no value is missing (null),
 * daily minima do not exceed maxima, the period lies inside the forcing and the initial state
 * has one value per band. Each problem names its field and, for series, the index.
 */
export function checkForcing(input: CheckedInput, ctx: z.RefinementCtx): void {
  const f = input.forcing;
  const issue = (path: (string | number)[], message: string) => ctx.addIssue({ code: 'custom', path, message });
  const days = forcingDayCount(f);
  if (f.timeStep === 'hourly' && (f.temperatureC?.length ?? 0) % 24 !== 0) {
    issue(['forcing', 'temperatureC'], `has ${f.temperatureC?.length} hourly values; whole days (a multiple of 24) are needed`);
    return;
  }
  const stepLength = f.timeStep === 'hourly' ? days * 24 : days;
  const precipLength = (f.precipitationStep ?? f.timeStep) === 'hourly' ? days * 24 : days;
  const expected: [string, Series | undefined, number][] = [
    ['temperatureC', f.temperatureC, stepLength],
    ['tMinC', f.tMinC, stepLength],
    ['tMaxC', f.tMaxC, stepLength],
    ['tMeanC', f.tMeanC, stepLength],
    ['precipitationMm', f.precipitationMm, precipLength],
    ['cloudiness', f.cloudiness, stepLength],
    ['windMs', f.windMs, stepLength],
    ['relativeHumidity', f.relativeHumidity, stepLength],
  ];
  for (const [name, values, length] of expected) {
    if (!values) continue;
    if (values.length !== length) {
      issue(['forcing', name], `has ${values.length} values; ${length} expected for ${days} days`);
      continue;
    }
    const firstGap = values.indexOf(null);
    if (firstGap >= 0) {
      const gaps = values.reduce<number>((n, v) => (v === null ? n + 1 : n), 0);
      issue(['forcing', name, firstGap], `is missing (${gaps} missing value(s) in this series); fill gaps before simulating, e.g. with fillShortGaps`);
    }
  }
  if (f.tMinC && f.tMaxC) {
    const bad = f.tMinC.findIndex((v, i) => v !== null && f.tMaxC![i] !== null && v > f.tMaxC![i]!);
    if (bad >= 0) issue(['forcing', 'tMinC', bad], 'is above tMaxC of the same day');
  }
  if (input.initialState && input.initialState.sweMm.length !== input.catchment.bands.length) {
    issue(['initialState', 'sweMm'], `has ${input.initialState.sweMm.length} values; one per band (${input.catchment.bands.length}) expected`);
  }
  if (input.period) {
    const last = addDays(f.start, days - 1);
    if (daysBetween(input.period.from, input.period.to) < 0) issue(['period', 'to'], 'is before period.from');
    if (daysBetween(f.start, input.period.from) < 0) issue(['period', 'from'], `is before the forcing starts (${f.start})`);
    if (daysBetween(input.period.to, last) < 0) issue(['period', 'to'], `is after the forcing ends (${last})`);
  }
}
