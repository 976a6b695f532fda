import { describe, expect, it } from 'vitest';
import { canonicalJson, inputHash } from './input-hash';

describe('run input hash', () => {
  it('does not depend on key order', () => {
    expect(inputHash({ a: 1, b: { c: [1, 2], d: null } })).toBe(inputHash({ b: { d: null, c: [1, 2] }, a: 1 }));
    expect(canonicalJson({ b: 1, a: 2 })).toBe('{"a":2,"b":1}');
  });

  it('changes with any value', () => {
    expect(inputHash({ a: [1, 2] })).not.toBe(inputHash({ a: [2, 1] }));
    expect(inputHash({ a: 1 })).toMatch(/^[0-9a-f]{64}$/);
  });
});
