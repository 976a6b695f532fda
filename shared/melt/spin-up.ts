import { addDays, daysBetween } from './calendar';
import type { Start } from './schema';

/** One stretch of forcing days the loop runs through; only recorded stretches reach the result. */
export interface Segment {
  /** First and last forcing day index, inclusive. */
  firstDay: number;
  lastDay: number;
  record: boolean;
}

/** How the run started, in words the result and the product show. */
export interface StartReport {
  method: 'spin-up-record' | 'spin-up-repeated-year' | 'initial-swe' | 'state';
  /** Local dates of the forcing the spin-up used, inclusive (null without spin-up). */
  spinUpFrom: string | null;
  spinUpTo: string | null;
  spinUpDays: number;
  /** False when the record was too short for a spin-up through the accumulation season. */
  adequate: boolean;
  note: string;
}

export interface RunPlanOfDays {
  segments: Segment[];
  report: StartReport;
}

export const DAYS_PER_YEAR = 365;

/**
 * The start of the hydrological year before a date (1 October in the northern hemisphere,
 * 1 April in the southern; common practice): the accumulation season runs from there to the
 * melt season. Strictly before the date, so a period that starts on 1 October spins up through
 * the whole year before it.
 */
export function hydrologicalYearStartBefore(date: string, latitudeDeg: number): string {
  const monthDay = latitudeDeg >= 0 ? '-10-01' : '-04-01';
  const year = Number(date.slice(0, 4));
  const sameYear = `${year}${monthDay}`;
  return sameYear < date ? sameYear : `${year - 1}${monthDay}`;
}

/**
 * Plans the days a run simulates. With a spin-up of N years (the default, N = 1) the loop first
 * runs at least N·365 days before the period, from the start of a hydrological year, so the spin-up
 * begins with an accumulation season rather than on bare ground in spring; where the record starts
 * later, a shorter stretch is still accepted when it reaches back to the start of the hydrological
 * year before the period (it covers the accumulation season), and is reported as shortened. Where the record starts later than that, the period's
 * first year is simulated once before the period ("repeated first year") and the result says
 * the record was too short for a proper spin-up. A given initial SWE or state starts the period
 * at once.
 */
export function planDays(forcingStart: string, forcingDays: number, period: { from: string; to: string }, latitudeDeg: number, start: Start): RunPlanOfDays {
  const first = daysBetween(forcingStart, period.from);
  const last = daysBetween(forcingStart, period.to);
  const main: Segment = { firstDay: first, lastDay: last, record: true };
  if (start.method !== 'spin-up') {
    const note = start.method === 'initial-swe' ? 'Started from the snow water equivalent given per band.' : 'Started from the state of an earlier run.';
    return { segments: [main], report: { method: start.method, spinUpFrom: null, spinUpTo: null, spinUpDays: 0, adequate: true, note } };
  }
  const wantedFrom = hydrologicalYearStartBefore(addDays(period.from, -start.years * DAYS_PER_YEAR + 1), latitudeDeg);
  const wanted = daysBetween(wantedFrom, period.from);
  const earliest = firstYearStartFrom(forcingStart, latitudeDeg);
  if (earliest < period.from) {
    const from = Math.max(daysBetween(forcingStart, wantedFrom), daysBetween(forcingStart, earliest));
    const days = first - from;
    return {
      segments: [{ firstDay: from, lastDay: first - 1, record: false }, main],
      report: {
        method: 'spin-up-record', spinUpFrom: addDays(forcingStart, from), spinUpTo: addDays(forcingStart, first - 1), spinUpDays: days, adequate: true,
        note: days < wanted
          ? `Spun up through the ${days} days of record before the period, from the start of a hydrological year (${wanted} wanted; the record starts on ${forcingStart}).`
          : `Spun up through the ${days} days before the period, from the start of a hydrological year.`,
      },
    };
  }
  const repeatLast = Math.min(first + DAYS_PER_YEAR - 1, forcingDays - 1);
  const days = repeatLast - first + 1;
  return {
    segments: [{ firstDay: first, lastDay: repeatLast, record: false }, main],
    report: {
      method: 'spin-up-repeated-year', spinUpFrom: addDays(forcingStart, first), spinUpTo: addDays(forcingStart, repeatLast), spinUpDays: days, adequate: false,
      note: `The record starts on ${forcingStart}, too late for a spin-up through the accumulation season before the period; ` +
        `the period's first ${days === DAYS_PER_YEAR ? 'year' : `${days} days`} (${addDays(forcingStart, first)} to ${addDays(forcingStart, repeatLast)}) were simulated once before it instead.`,
    },
  };
}

/** The first start of a hydrological year on or after a date. */
export function firstYearStartFrom(date: string, latitudeDeg: number): string {
  const before = hydrologicalYearStartBefore(addDays(date, 1), latitudeDeg);
  return before === date ? date : `${Number(before.slice(0, 4)) + 1}${before.slice(4)}`;
}
