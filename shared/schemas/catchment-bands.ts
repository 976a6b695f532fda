import { z } from 'zod';
import { bandSchema } from '../melt/schema';
import { BAND_FIELD_LABELS } from '../text/labels';
import { describeRowProblem, issueMessage, type ZodLikeIssue } from '../text/issue-messages';

/** The band fields in table order, with the unit each is stored in (the engine's own names and units). */
export const BAND_COLUMNS = (Object.keys(BAND_FIELD_LABELS) as (keyof typeof BAND_FIELD_LABELS)[]).map((field) => ({
  field, label: BAND_FIELD_LABELS[field].label, unit: BAND_FIELD_LABELS[field].unit, help: BAND_FIELD_LABELS[field].help,
}));
export type BandField = (typeof BAND_COLUMNS)[number]['field'];
export const BAND_FIELDS: readonly BandField[] = BAND_COLUMNS.map((c) => c.field);

/** A band column's header in a CSV file: the label and its unit, "Lower elevation (m)". */
export const bandCsvHeader = (field: BandField) => `${BAND_FIELD_LABELS[field].label} (${BAND_FIELD_LABELS[field].unit})`;

const headerWords = (text: string) => text.trim().toLowerCase().replace(/\s+/g, ' ');
const FIELD_BY_HEADER = new Map<string, BandField>(BAND_COLUMNS.flatMap((c) => [
  [headerWords(bandCsvHeader(c.field)), c.field], [headerWords(c.label), c.field], [headerWords(c.field), c.field],
]));

/**
 * The band field a CSV header names: the header as the download writes it ("Lower elevation (m)"),
 * the label alone, or the field's own name as earlier files have it (lowerM); case and spacing aside.
 */
export const bandFieldOfHeader = (header: string): BandField | undefined => FIELD_BY_HEADER.get(headerWords(header));

/** Aspect classes of response units: north 315–45°, east 45–135°, south 135–225°, west 225–315°. */
export const ASPECT_CLASS_VALUES = ['N', 'E', 'S', 'W'] as const;
export type AspectClassValue = (typeof ASPECT_CLASS_VALUES)[number];
export const ASPECT_CLASS_LABELS: Record<AspectClassValue, string> = { N: 'north-facing', E: 'east-facing', S: 'south-facing', W: 'west-facing' };

/**
 * One band as stored: the engine's band (same names and units), optionally one aspect class of
 * its elevation range (a response unit: rows sharing a range split it by aspect).
 */
export const bandRowSchema = bandSchema.safeExtend({ aspectClass: z.enum(ASPECT_CLASS_VALUES).optional() });
export type BandRow = z.output<typeof bandRowSchema>;

/** "4000–4200 m", with the aspect class of a response unit: "4000–4200 m, north-facing". */
export function bandLabel(band: Pick<BandRow, 'lowerM' | 'upperM' | 'aspectClass'>): string {
  return `${band.lowerM}–${band.upperM} m${band.aspectClass ? `, ${ASPECT_CLASS_LABELS[band.aspectClass]}` : ''}`;
}

/**
 * The whole band table: each row is the engine's band, and across rows the bands must run
 * from low to high without gaps or overlaps (each band's lower edge is the previous upper edge).
 * Response units of one band follow each other with the same range and different aspect classes.
 * Issues carry the path [row index, field] so messages can say "row 3, upperM".
 */
type BandEdges = { lowerM?: unknown; upperM?: unknown; aspectClass?: unknown };
const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/**
 * The order of the table across rows: each band's lower edge is the previous upper edge; response
 * units of one band share its range with different aspect classes. Rows whose edges are not numbers
 * are skipped, so the check also runs on a table with other problems (all problems at once).
 */
export function bandOrderIssues(bands: readonly BandEdges[]): { code: 'custom'; path: [number, string]; message: string }[] {
  const issues: { code: 'custom'; path: [number, string]; message: string }[] = [];
  for (let i = 1; i < bands.length; i++) {
    const previous = bands[i - 1];
    const band = bands[i];
    if (!finite(band.lowerM) || !finite(band.upperM) || !finite(previous.lowerM) || !finite(previous.upperM)) continue;
    if (band.lowerM === previous.lowerM && band.upperM === previous.upperM && band.aspectClass && previous.aspectClass) {
      const unitsBefore = bands.slice(0, i).filter((b) => b.lowerM === band.lowerM && b.upperM === band.upperM);
      if (unitsBefore.some((b) => b.aspectClass === band.aspectClass)) {
        issues.push({ code: 'custom', path: [i, 'aspectClass'], message: `repeats the aspect class ${String(band.aspectClass)} of another unit of the same band` });
      }
    } else if (band.lowerM < previous.upperM) {
      issues.push({ code: 'custom', path: [i, 'lowerM'], message: `overlaps the band below (its upper edge is ${previous.upperM} m); sort bands from low to high without overlaps` });
    } else if (band.lowerM > previous.upperM) {
      issues.push({ code: 'custom', path: [i, 'lowerM'], message: `leaves a gap above the band below (its upper edge is ${previous.upperM} m); bands must be contiguous` });
    }
  }
  return issues;
}

/**
 * The whole band table: each row is the engine's band, and across rows the bands run from low to
 * high without gaps or overlaps (bandOrderIssues). Issues carry the path [row index, field].
 */
export const bandTableSchema = z
  .array(bandRowSchema)
  .min(1, 'needs at least one band')
  .max(500, 'may have at most 500 bands')
  .superRefine((bands, ctx) => {
    for (const issue of bandOrderIssues(bands)) ctx.addIssue(issue);
  });

/**
 * Every problem of a band table at once, sorted by row: the cells that could not be read
 * (`read`), each row's own checks and the order of the rows, one problem per cell.
 */
export function bandTableProblems(bands: readonly BandEdges[], read: readonly BandProblem[] = []): BandProblem[] {
  const parsed = bandTableSchema.safeParse(bands);
  if (parsed.success) return [...read];
  // zod may skip the order check when a row fails its own checks; run it here on what is readable, once per cell.
  const issues = [...parsed.error.issues];
  const named = new Set(issues.map((i) => `${i.path.join('.')}|${i.message}`));
  issues.push(...bandOrderIssues(bands).filter((i) => !named.has(`${i.path.join('.')}|${i.message}`)));
  return mergeBandProblems(read, bandIssuesToProblems(issues));
}

export const bandTableRequestSchema = z.object({ bands: bandTableSchema });
export type BandTableRequest = z.input<typeof bandTableRequestSchema>;

export const bandProblemSchema = z.object({ row: z.number().int(), column: z.string(), message: z.string() });
export type BandProblem = z.infer<typeof bandProblemSchema>;

export const bandTableReplySchema = z.object({ bands: z.array(bandRowSchema) });

/** Bands read from an uploaded file: the rows that could be read and what is wrong, row by row. */
export const bandFileReplySchema = z.object({
  bands: z.array(z.record(z.string(), z.number().nullable())),
  problems: z.array(bandProblemSchema),
});
export type BandFileReply = z.infer<typeof bandFileReplySchema>;

/** Turns zod issues on a band table into row/column problems with 1-based row numbers, in words, sorted by row. */
export function bandIssuesToProblems(issues: readonly ZodLikeIssue[]): BandProblem[] {
  return issues.map((issue) => {
    const [index, field] = issue.path;
    const message = issueMessage(issue);
    return typeof index === 'number'
      ? { row: index + 1, column: String(field ?? ''), message }
      : { row: 0, column: '', message };
  }).sort((a, b) => a.row - b.row);
}

/**
 * Problems found while reading cells (not a number, empty) and the schema's problems on the same
 * rows, one per cell (the reading problem wins), sorted by row.
 */
export function mergeBandProblems(read: readonly BandProblem[], checked: readonly BandProblem[]): BandProblem[] {
  const seen = new Set(read.map((p) => `${p.row}:${p.column}`));
  return [...read, ...checked.filter((p) => !seen.has(`${p.row}:${p.column}`))].sort((a, b) => a.row - b.row);
}

/**
 * Why a band table request was refused, for the first problem named by row and column
 * ("Row 2, lowerM: overlaps …"), its field path in the request (`bands.1.lowerM`) and every problem.
 */
export function bandTableRefusal(issues: readonly ZodLikeIssue[]): { message: string; field: string; problems: BandProblem[] } {
  // Issues on the request point below its `bands` key.
  const problems = bandIssuesToProblems(issues.map((i) => ({ ...i, path: i.path[0] === 'bands' ? i.path.slice(1) : i.path })));
  const first = problems[0];
  const more = problems.length > 1 ? ` (and ${problems.length - 1} more problem${problems.length > 2 ? 's' : ''})` : '';
  return { message: `${describeRowProblem(first)}${more}`, field: first.row > 0 ? `bands.${first.row - 1}.${first.column}` : 'bands', problems };
}

/** A saved version of a catchment's band table; the newest is in use, older ones stay for the runs made with them. */
export const bandTableVersionSchema = z.object({
  id: z.number().int(),
  version: z.number().int(),
  source: z.enum(['entered', 'derived']),
  derivationId: z.number().int().nullable(),
  bandCount: z.number().int(),
  runCount: z.number().int(),
  createdAt: z.string(),
});
export type BandTableVersion = z.infer<typeof bandTableVersionSchema>;
export const bandTableVersionsReplySchema = z.object({ versions: z.array(bandTableVersionSchema) });
