import { describe, expect, it } from 'vitest';
import { canonicalJson, inputHash } from './input-hash';

describe('run input hash', () => {
  it('does not depend on key order', () => {
    expect(inputHash({ a: 1, b: { c: [1, 2], d: null } })).toBe(inputHash({ b: { d: null, c: [1, 2] }, a: 1 }));
    expect(canonicalJson({ b: 1, a: 2, c: [{ y: 1, x: [null, 2] }] })).toBe('{"a":2,"b":1,"c":[{"x":[null,2],"y":1}]}');
  });

  it('writes what JSON.stringify writes, apart from key order', () => {
    const value = { period: { to: '2022-09-30', from: '2022-04-01' }, skipped: undefined, series: [1.5, null, -2], nested: [[1], { k: 'v' }] };
    expect(JSON.parse(canonicalJson(value))).toEqual(JSON.parse(JSON.stringify(value)));
  });

  it('changes with any value', () => {
    expect(inputHash({ a: [1, 2] })).not.toBe(inputHash({ a: [2, 1] }));
    expect(inputHash({ a: 1 })).toMatch(/^[0-9a-f]{64}$/);
  });
});
