import { z } from 'zod';
import { invalidParam, missingParam, unknownParam } from './errors';

/** Form bodies carry every value as text; these accept both text and JSON-typed values. */
export const formBoolean = z.union([z.boolean(), z.enum(['true', 'false']).transform((v) => v === 'true')]);
export const formInteger = z.coerce.number().int();
/** `metadata[key]=value` pairs; a bare `metadata=` (null) means remove every key. */
export const metadataParam = z.record(z.string(), z.string()).or(z.literal('').transform(() => null));
export const expandParam = z.array(z.string()).optional();

/** `line_items[0][price]` — the bracketed name the SDK sent, used in error messages. */
function bracketed(path: readonly PropertyKey[]): string {
  const [head, ...rest] = path.map(String);
  return head + rest.map((part) => `[${part}]`).join('');
}

/**
 * Validates request parameters and turns the first problem into the service's error:
 * missing → parameter_missing, unknown → parameter_unknown, otherwise parameter_invalid.
 */
export function parseParams<Schema extends z.ZodType>(schema: Schema, input: unknown): z.infer<Schema> {
  const result = schema.safeParse(input ?? {});
  if (result.success) return result.data;
  const issue = result.error.issues[0];
  if (issue.code === 'unrecognized_keys') {
    throw unknownParam(bracketed([...issue.path, issue.keys[0]]));
  }
  const param = bracketed(issue.path);
  if (issue.code === 'invalid_type' && issue.input === undefined) throw missingParam(param);
  throw invalidParam(param, `Invalid ${param}: ${issue.message}`);
}
