import { describe, expect, it } from 'vitest';
import { remembered } from './remembered';

describe('remembered answers', () => {
  it('compute each key once, forget all when full, and never keep a call that threw', () => {
    const calls: string[] = [];
    const twice = remembered((word: string) => {
      calls.push(word);
      if (word === 'bad') throw new RangeError('bad word');
      return word + word;
    }, (word) => word, 2);
    expect(twice('a')).toBe('aa');
    expect(twice('a')).toBe('aa');
    expect(calls).toEqual(['a']);
    expect(() => twice('bad')).toThrow(RangeError);
    expect(() => twice('bad')).toThrow(RangeError);
    twice('b');
    // Full at two: the third key starts a fresh memory, so 'a' is worked out again.
    twice('c');
    twice('a');
    expect(calls).toEqual(['a', 'bad', 'bad', 'b', 'c', 'a']);
  });
});
