import { describe, expect, it } from 'vitest';
import { formatMinutes, parseTimestamp } from './timestamps';

describe('station timestamps', () => {
  it('reads dates and date-times written with dashes or slashes, T or a space', () => {
    expect(formatMinutes(parseTimestamp('2024-03-01')!, 'daily')).toBe('2024-03-01');
    expect(formatMinutes(parseTimestamp('2024/3/1 13:00')!, 'hourly')).toBe('2024-03-01 13:00');
    expect(parseTimestamp('2024-03-01T13:00:00')).toBe(parseTimestamp('2024-03-01 13:00'));
  });

  it('refuses dates that do not exist and other text', () => {
    for (const text of ['2023-02-29', '2024-13-01', '2024-04-31', '01.03.2024', '2024-03-01 13:75', 'yesterday']) {
      expect(parseTimestamp(text)).toBeNull();
    }
  });

  it('counts a leap day', () => {
    expect(parseTimestamp('2024-03-01')! - parseTimestamp('2024-02-28')!).toBe(2 * 1440);
  });
});
