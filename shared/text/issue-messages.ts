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
  const range = field.min !== undefined && field.max !== undefined ? `must be between ${field.min} and ${field.max}${field.unit && !field.unit.includes('0–1') ? ` ${field.unit}` : ''}` : null;
  switch (issue.code) {
    case 'too_big':
      return range ?? `must be at most ${issue.maximum}`;
    case 'too_small':
      // An exclusive lower bound (an area must be positive) is said as such: "between 0 and …" would allow 0.
      if (issue.inclusive === false) return `must be more than ${issue.minimum}${field.unit && !field.unit.includes('0–1') ? ` ${field.unit}` : ''}`;
      return range ?? `must be at least ${issue.minimum}`;
    case 'invalid_type':
      return issue.expected === 'number' ? 'must be a number' : 'is missing or of the wrong kind';
    default:
      return issue.message;
  }
}

/** "Row 2, debris-covered fraction: must be between 0 and 1"; rows count from 1, row 0 is the table as a whole. */
export function describeRowProblem(problem: { row: number; column: string; message: string }, whole = 'Band table'): string {
  if (problem.row <= 0) return `${whole}: ${problem.message}`;
  const column = problem.column ? `, ${labelOf(problem.column).label.toLowerCase()}` : '';
  return `Row ${problem.row}${column}: ${problem.message}`;
}
