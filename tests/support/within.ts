import { expect } from 'vitest';

/** Expects a figure strictly inside a published range, naming it in the failure. */
export function expectWithin(value: number | null | undefined, [low, high]: readonly [number, number], what: string): void {
  expect(value, what).toBeTypeOf('number');
  expect(value!, `${what} above ${low}`).toBeGreaterThan(low);
  expect(value!, `${what} below ${high}`).toBeLessThan(high);
}
