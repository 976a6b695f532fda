import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { fieldErrors, issueField } from './field-errors';

describe('field errors from zod issues', () => {
  const schema = z.object({ name: z.string().min(2, 'too short'), bands: z.array(z.object({ lowerM: z.number() })) });

  it('keys each message by its dotted path, the first issue per field winning', () => {
    const parsed = schema.safeParse({ name: 'a', bands: [{ lowerM: 1 }, { lowerM: 'x' }] });
    if (parsed.success) throw new Error('expected a failure');
    expect(fieldErrors(parsed.error.issues)).toEqual({ name: 'too short', 'bands.1.lowerM': expect.any(String) });
    expect(fieldErrors([{ path: ['a'], message: 'first' }, { path: ['a'], message: 'second' }])).toEqual({ a: 'first' });
  });

  it('names the value as a whole with an empty path', () => {
    expect(issueField({ path: [], message: 'm' })).toBe('');
  });
});
