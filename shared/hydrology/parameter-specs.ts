import type { ParameterSpec } from '../melt/parameters';
import { requireInRange } from './errors';

/** Parameter values of a spec table, one number per key. */
export type ValuesOf<T extends Record<string, ParameterSpec>> = { [K in keyof T]: number };

/** The defaults of a spec table, frozen. */
export function defaultsOf<T extends Record<string, ParameterSpec>>(specs: T): Readonly<ValuesOf<T>> {
  return Object.freeze(Object.fromEntries(Object.entries(specs).map(([k, v]) => [k, v.default])) as ValuesOf<T>);
}

/**
 * Refuses the first value outside its documented range, naming it `${prefix}.${key}`.
 * @throws HydrologyInputError
 */
export function checkParameters<T extends Record<string, ParameterSpec>>(specs: T, values: ValuesOf<T>, prefix: string): void {
  for (const [name, spec] of Object.entries(specs)) {
    requireInRange(values[name as keyof T], spec.min, spec.max, `${prefix}.${name}`, 'The value', spec.unit === '-' ? '' : spec.unit);
  }
}
