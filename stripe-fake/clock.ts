/**
 * The fake's notion of "now" in Unix seconds. Tests freeze it at a known instant;
 * the control API moves it forward to reach the end of a billing period.
 */
export interface FakeClock {
  now(): number;
  advance(seconds: number): number;
  /** Moves the clock to `target` if that is later than now. */
  advanceTo(target: number): number;
  reset(): void;
}

export function createClock(frozenAt?: number): FakeClock {
  let offset = 0;
  const base = () => frozenAt ?? Math.floor(Date.now() / 1000);
  const now = () => base() + offset;
  return {
    now,
    advance(seconds) {
      offset += Math.max(0, Math.floor(seconds));
      return now();
    },
    advanceTo(target) {
      if (target > now()) offset += target - now();
      return now();
    },
    reset() {
      offset = 0;
    },
  };
}

/** Adds calendar months in UTC, clamping to the last day (31 Jan + 1 month = 28/29 Feb). */
export function addMonths(unixSeconds: number, months: number): number {
  const start = new Date(unixSeconds * 1000);
  const target = new Date(start);
  target.setUTCDate(1);
  target.setUTCMonth(start.getUTCMonth() + months);
  const lastDay = new Date(Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0)).getUTCDate();
  target.setUTCDate(Math.min(start.getUTCDate(), lastDay));
  return Math.floor(target.getTime() / 1000);
}

export function addInterval(unixSeconds: number, interval: 'month' | 'year', count = 1): number {
  return addMonths(unixSeconds, interval === 'year' ? 12 * count : count);
}
