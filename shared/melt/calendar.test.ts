import { describe, expect, it } from 'vitest';
import { addDays, dateToUtcMs, dayOfYear, daysBetween, isIsoDate, isTimeZone, standardOffsetHours } from './calendar';
import { buildTimeline } from './timeline';

describe('calendar', () => {
  it('knows IANA time zones, the second time as the first, and refuses names that are none', () => {
    for (const round of [1, 2]) {
      expect(isTimeZone('Asia/Kathmandu'), `round ${round}`).toBe(true);
      expect(isTimeZone('UTC'), `round ${round}`).toBe(true);
      expect(isTimeZone('Asia/Atlantis'), `round ${round}`).toBe(false);
      expect(isTimeZone(''), `round ${round}`).toBe(false);
    }
  });
  it('accepts real dates only', () => {
    expect(isIsoDate('2024-02-29')).toBe(true);
    expect(isIsoDate('2023-02-29')).toBe(false);
    expect(isIsoDate('2023-2-1')).toBe(false);
  });
  it('counts days across a leap year', () => {
    expect(daysBetween('2023-12-31', '2024-03-01')).toBe(61);
    expect(addDays('2024-02-28', 2)).toBe('2024-03-01');
    expect(dayOfYear(dateToUtcMs('2024-12-31'))).toBe(366);
  });
  it('reads the standard (winter) offset of a zone in either hemisphere and with half hours', () => {
    expect(standardOffsetHours('America/Denver', 2003)).toBe(-7);
    expect(standardOffsetHours('Australia/Sydney', 2022)).toBe(10);
    expect(standardOffsetHours('Asia/Kathmandu', 2022)).toBe(5.75);
    expect(standardOffsetHours('UTC', 2022)).toBe(0);
    // Asked again, from memory: the same.
    expect(standardOffsetHours('America/Denver', 2003)).toBe(-7);
  });
  it('starts each simulated day at local standard midnight', () => {
    const t = buildTimeline('2003-10-16', 3, 'America/Denver', { from: '2003-10-17', to: '2003-10-17' });
    expect(t.firstDay).toBe(1);
    expect(t.dayCount).toBe(1);
    expect(new Date(t.dayStartUtcMs[0]).toISOString()).toBe('2003-10-17T07:00:00.000Z');
    expect(t.months[0]).toBe(9);
    expect(t.daysOfYear[0]).toBe(290);
  });
});
