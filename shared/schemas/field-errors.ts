import { issueMessage, type ZodLikeIssue } from '../text/issue-messages';

/** A zod issue, as far as field errors need it. */
export type FieldIssue = ZodLikeIssue;

/** The dotted field path of an issue ('bands.1.lowerM'); '' for the value as a whole. */
export function issueField(issue: FieldIssue): string {
  return issue.path.map(String).join('.');
}

/** One message per field in words, the first issue winning: what forms put beside their fields. */
export function fieldErrors(issues: readonly FieldIssue[]): Record<string, string> {
  const errors: Record<string, string> = {};
  for (const issue of issues) errors[issueField(issue)] ??= issueMessage(issue);
  return errors;
}
