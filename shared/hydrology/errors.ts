/** One problem with an input: where it is (e.g. `stations[2].elevationM`) and what is wrong, in plain words. */
export interface HydrologyIssue {
  path: string;
  message: string;
}

/**
 * Refusal of a hydrology input. Same shape as the engine's SimulationInputError (`issues` with
 * `path` and `message`), so the server turns either into a field error the same way.
 */
export class HydrologyInputError extends Error {
  constructor(readonly issues: HydrologyIssue[]) {
    super(issues.map((i) => `${i.path}: ${i.message}`).join('; '));
    this.name = 'HydrologyInputError';
  }
}

/** Throws one issue at once. */
export function refuse(path: string, message: string): never {
  throw new HydrologyInputError([{ path, message }]);
}

/** Refuses a value that is not a finite number inside min … max (inclusive). */
export function requireInRange(value: number, min: number, max: number, path: string, what: string, unit = ''): void {
  const u = unit ? ` ${unit}` : '';
  if (!Number.isFinite(value)) refuse(path, `${what} must be a number (got ${String(value)}).`);
  if (value < min || value > max) refuse(path, `${what} is ${value}${u}; it must lie between ${min} and ${max}${u}.`);
}

/** Refuses an array-like whose length is not `length`. */
export function requireLength(values: ArrayLike<unknown>, length: number, path: string, hint = ''): void {
  if (values.length !== length) refuse(path, `${length} values are needed${hint ? ` (${hint})` : ''}; ${values.length} ${values.length === 1 ? 'was' : 'were'} given.`);
}
