import type { z } from 'zod';
import { issueField } from '../../shared/schemas/field-errors';
import { describeIssue, inZodWording, issueMessage } from '../../shared/text/issue-messages';
import { notFound, validationFailed, type AppError } from '../errors';

/** How a failed parse is answered; by default a 422 naming the first bad field in words. */
export type Refusal = (issues: readonly z.core.$ZodIssue[]) => AppError;

const namingFirstField: Refusal = (issues) => {
  const issue = issues[0]!;
  const field = issueField(issue) || undefined;
  const all = issues.map((i) => ({ field: issueField(i), message: issueMessage(i) }));
  return validationFailed(describeIssue(issue), field, { issues: all });
};

/** Parses a value with a shared schema; a failure is refused by `refuse` (a 422 naming the first bad field). */
export function parseWith<S extends z.ZodType>(schema: S, value: unknown, refuse: Refusal = namingFirstField): z.infer<S> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  throw refuse(result.error.issues);
}

/** A 422 with the first issue's message alone, for values that are not form fields (a link's token). */
export const messageOnly: Refusal = (issues) => {
  const message = issues[0]?.message;
  return validationFailed(message && !inZodWording(message) ? message : 'The request is not valid.');
};

/**
 * Path parameters that do not parse name a record that does not exist: 404, with the schema's
 * message as the record's name (see `idOf`).
 */
export const paramsNotFound: Refusal = (issues) => notFound(issues[0]?.message);
