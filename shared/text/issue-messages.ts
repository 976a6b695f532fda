import { labelOf } from './labels';

/** A zod issue as far as plain messages need it (zod 4's shapes for numbers and types). */
export interface ZodLikeIssue {
  code?: string;
  path: readonly PropertyKey[];
  message: string;
  minimum?: number | bigint;
  maximum?: number | bigint;
  expected?: string;
  inclusive?: boolean;
}

/**
 * An issue in words a user reads ("must be between 0 and 1"), with the range from the labels table
 * where the field has one; messages written for people in the schemas (custom checks) pass through.
 */
export function plainIssueMessage(issue: ZodLikeIssue): string {
  const field = labelOf(issue.path.map(String).join('.'));
  // A unit after the number ("89°", "9000 m"); fractions say their range in the number itself.
  const unit = !field.unit || field.unit.includes('0–1') ? '' : field.unit === '°' ? '°' : ` ${field.unit}`;
  const range = field.min !== undefined && field.max !== undefined ? `must be between ${field.min} and ${field.max}${unit}` : null;
  switch (issue.code) {
    case 'too_big':
      return range ?? `must be at most ${issue.maximum}`;
    case 'too_small':
      // An exclusive lower bound (an area must be positive) is said as such: "between 0 and …" would allow 0.
      if (issue.inclusive === false) return `must be more than ${issue.minimum}${unit}`;
      return range ?? `must be at least ${issue.minimum}`;
    case 'invalid_type':
      if (/received undefined/.test(issue.message)) return 'is required';
      return issue.expected === 'number' ? 'must be a number' : 'is missing or of the wrong kind';
    default:
      return ZOD_WORDING.test(issue.message) ? 'is not valid here' : issue.message;
  }
}

/** Zod's own wording ("Too big: expected number to be <=1", "Invalid input: …"), as opposed to messages the schemas write for people. */
const ZOD_WORDING = /^(Invalid|Too (big|small)|Expected|Unrecognized)/;
export const inZodWording = (message: string) => ZOD_WORDING.test(message);

/** An issue's message for people: the schema's own words where it wrote some, otherwise plainIssueMessage. */
export function issueMessage(issue: ZodLikeIssue): string {
  return ZOD_WORDING.test(issue.message) ? plainIssueMessage(issue) : issue.message;
}

/** Where an issue is, in words: "Temperature change", "Row 2, black carbon in snow"; '' for the value as a whole. */
export function fieldInWords(path: readonly PropertyKey[]): string {
  const parts = path.map(String);
  if (parts.length === 0) return '';
  const { label } = labelOf(parts.join('.'));
  const index = [...parts].reverse().find((part) => /^\d+$/.test(part));
  return index === undefined ? label : `Row ${Number(index) + 1}, ${label.charAt(0).toLowerCase()}${label.slice(1)}`;
}

/** One issue as a sentence: "Temperature change: must be a number". */
export function describeIssue(issue: ZodLikeIssue): string {
  const where = fieldInWords(issue.path);
  return where ? `${where}: ${issueMessage(issue)}` : issueMessage(issue);
}

/** "Row 2, debris-covered fraction: must be between 0 and 1"; rows count from 1, row 0 is the table as a whole. */
export function describeRowProblem(problem: { row: number; column: string; message: string }, whole = 'Band table'): string {
  if (problem.row <= 0) return `${whole}: ${problem.message}`;
  const column = problem.column ? `, ${labelOf(problem.column).label.toLowerCase()}` : '';
  return `Row ${problem.row}${column}: ${problem.message}`;
}
