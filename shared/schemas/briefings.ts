import { z } from 'zod';
import { emailSchema } from './auth';

/** What a briefing section holds: a result chart, a result table, narrative text, or a regional study's result. */
export const SECTION_KINDS = ['chart', 'table', 'text', 'regional'] as const;
export const sectionKindSchema = z.enum(SECTION_KINDS);
export type SectionKind = z.infer<typeof sectionKindSchema>;

/** The result charts and tables a section can show, with their plain names. */
export const CHART_KEYS = ['monthly-added-melt', 'daily-discharge', 'band-added-melt', 'surface-split'] as const;
export const TABLE_KEYS = ['totals', 'monthly-added-melt', 'band-added-melt'] as const;
/** What a regional section shows of its study (published as a chart or a table). */
export const REGIONAL_KEYS = ['regional-by-catchment', 'regional-by-period', 'regional-table'] as const;
export type RegionalKey = (typeof REGIONAL_KEYS)[number];
export const CONTENT_LABELS: Record<string, string> = {
  'regional-by-catchment': 'Regional study: added runoff by catchment (chart)',
  'regional-by-period': 'Regional study: added runoff of the region by month, or by year for a multi-decade study (chart)',
  'regional-table': 'Regional study: added runoff by catchment and for the region (table)',
  'monthly-added-melt': 'Added runoff by month',
  'daily-discharge': 'Daily discharge, baseline and variants',
  'band-added-melt': 'Added melt by elevation band',
  'surface-split': 'Added melt by surface',
  totals: 'Totals per variant',
};
export type ChartKey = (typeof CHART_KEYS)[number];
export type TableKey = (typeof TABLE_KEYS)[number];

const heading = z.string().trim().min(1, { error: 'Give the section a heading.' }).max(160);
const caption = z.string().trim().max(500).default('');

export const draftSectionSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('chart'), heading, caption, contentKey: z.enum(CHART_KEYS, { error: 'Choose one of the result charts.' }) }),
  z.object({ kind: z.literal('table'), heading, caption, contentKey: z.enum(TABLE_KEYS, { error: 'Choose one of the result tables.' }) }),
  z.object({ kind: z.literal('text'), heading, bodyMarkdown: z.string().max(20_000, { error: 'Keep the text under 20,000 characters.' }) }),
  z.object({
    kind: z.literal('regional'), heading, caption,
    studyId: z.number({ error: 'Choose one of your regional studies.' }).int().positive({ error: 'Choose one of your regional studies.' }),
    contentKey: z.enum(REGIONAL_KEYS, { error: 'Choose what the section shows of the study.' }),
  }),
]);
export type DraftSection = z.infer<typeof draftSectionSchema>;

export const MAX_VARIANTS = 6;
/** The finished variant runs a briefing draws on; each carries its paired baseline. */
export const runSelectionSchema = z.object({
  runIds: z.array(z.number().int().positive())
    .min(1, { error: 'Choose at least one finished variant run.' })
    .max(MAX_VARIANTS, { error: `Choose at most ${MAX_VARIANTS} runs.` })
    .refine((ids) => new Set(ids).size === ids.length, { error: 'Choose each run once.' }),
});
export type RunSelection = z.infer<typeof runSelectionSchema>;

const title = z.string().trim().min(3, { error: 'Give the briefing a title (at least 3 characters).' }).max(160);
const summary = z.string().trim().max(4000, { error: 'Keep the summary under 4,000 characters.' });

export const createBriefingSchema = z.object({
  catchmentId: z.number({ error: 'Choose a catchment.' }).int().positive(),
  title,
  summary: summary.default(''),
  selection: runSelectionSchema,
});
export type CreateBriefingRequest = z.input<typeof createBriefingSchema>;
export type CreateBriefing = z.output<typeof createBriefingSchema>;

export const saveDraftSchema = z.object({
  title,
  summary,
  selection: runSelectionSchema,
  sections: z.array(draftSectionSchema).max(30, { error: 'A briefing holds at most 30 sections.' }),
});
export type SaveDraftRequest = z.input<typeof saveDraftSchema>;
export type SaveDraft = z.output<typeof saveDraftSchema>;

export const shareSchema = z.object({ emails: z.array(emailSchema).min(1, { error: 'Enter at least one e-mail address.' }).max(50) });

/** Addresses typed into one field (comma, semicolon or space separated), checked; a problem names the address. */
export function readShareList(text: string): { emails: string[]; error: null } | { emails: null; error: string } {
  const list = text.split(/[\s,;]+/).filter(Boolean);
  const parsed = shareSchema.safeParse({ emails: list });
  if (parsed.success) return { emails: parsed.data.emails, error: null };
  const issue = parsed.error.issues[0]!;
  const at = issue.path[1];
  return { emails: null, error: typeof at === 'number' ? `${list[at]}: ${issue.message}` : issue.message };
}

export const commentSchema = z.object({
  body: z.string().trim().min(1, { error: 'Write your comment or question.' }).max(4000, { error: 'Keep the comment under 4,000 characters.' }),
});

// ---- The frozen snapshot of a published version ----

/** A number (null when it cannot be found, e.g. no melt season) with the 5–95 % ensemble range around it when an ensemble exists. */
export const rangedSchema = z.object({ value: z.number().nullable(), low: z.number().nullable(), high: z.number().nullable() });
export type Ranged = z.infer<typeof rangedSchema>;

/**
 * The headline numbers of one variant against the baseline. Versions published before the figure
 * was renamed call the added runoff "shareOfSeasonalRunoffPct"; they read as the same number.
 */
export const headlineSchema = z.preprocess(
  (v) => (v && typeof v === 'object' && 'shareOfSeasonalRunoffPct' in v && !('addedRunoffPercentOfBaseline' in v)
    ? { ...v, addedRunoffPercentOfBaseline: (v as Record<string, unknown>).shareOfSeasonalRunoffPct } : v),
  z.object({
    variantName: z.string(),
    addedVolumeM3: rangedSchema,
    addedMeltSeasonDischargeM3s: rangedSchema,
    addedRunoffPercentOfBaseline: rangedSchema,
    timingShiftDays: rangedSchema,
    meltSeason: z.string(),
  }),
);
export type Headline = z.infer<typeof headlineSchema>;

const cell = z.union([z.string(), z.number(), z.null()]);
export const tableDataSchema = z.object({
  columns: z.array(z.object({ label: z.string(), unit: z.string() })),
  rows: z.array(z.array(cell)),
});
export type TableData = z.infer<typeof tableDataSchema>;

const seriesValues = z.array(z.number().nullable());
export const chartDataSchema = z.object({
  type: z.enum(['bar', 'line']),
  xName: z.string(),
  yName: z.string(),
  unit: z.string(),
  categories: z.array(z.string()),
  series: z.array(z.object({ name: z.string(), values: seriesValues, low: seriesValues.optional(), high: seriesValues.optional() })),
});
export type ChartData = z.infer<typeof chartDataSchema>;

export const snapshotSectionSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('chart'), heading: z.string(), caption: z.string(), chart: chartDataSchema }),
  z.object({ kind: z.literal('table'), heading: z.string(), caption: z.string(), table: tableDataSchema }),
  z.object({ kind: z.literal('text'), heading: z.string(), markdown: z.string() }),
]);
export type SnapshotSection = z.infer<typeof snapshotSectionSchema>;

export const assumptionsSchema = z.object({
  scenarios: z.array(z.object({
    name: z.string(),
    role: z.enum(['baseline', 'variant']),
    values: z.array(z.object({ label: z.string(), value: z.string() })),
  })),
  parameters: z.array(z.object({ label: z.string(), value: z.string() })),
  dataSources: z.array(z.object({ name: z.string(), variables: z.string(), source: z.string(), accuracy: z.string() })),
  runs: z.array(z.object({
    id: z.number().int(),
    scenarioName: z.string(),
    engineVersion: z.string(),
    inputHash: z.string(),
    finishedAt: z.string(),
    ensembleSize: z.number().int(),
  })),
  engineVersion: z.string(),
  /** How each run was started, radiated, calibrated and scored (versions published before engine 2.0 have none). */
  setUp: z.array(z.object({
    scenarioName: z.string(),
    lines: z.array(z.object({ label: z.string(), value: z.string() })),
  })).default([]),
});
export type Assumptions = z.infer<typeof assumptionsSchema>;

export const SNAPSHOT_FORMAT = 1;
/** Everything a published version shows, copied at publication so later runs never change it. */
export const briefingSnapshotSchema = z.object({
  format: z.literal(SNAPSHOT_FORMAT),
  title: z.string(),
  summary: z.string(),
  version: z.number().int().positive(),
  publishedAt: z.string(),
  publishedBy: z.string(),
  organisation: z.string(),
  catchment: z.object({
    name: z.string(),
    latitudeDeg: z.number(),
    longitudeDeg: z.number(),
    stationName: z.string(),
    stationElevationM: z.number(),
    bandCount: z.number().int(),
    areaKm2: z.number(),
  }),
  period: z.object({ from: z.string(), to: z.string() }),
  baselineName: z.string(),
  headlines: z.array(headlineSchema),
  sections: z.array(snapshotSectionSchema),
  assumptions: assumptionsSchema,
  /** Shown above the numbers: runs whose parameters are not the catchment's calibration. */
  warnings: z.array(z.string()).default([]),
  cautions: z.array(z.string()),
});
export type BriefingSnapshot = z.infer<typeof briefingSnapshotSchema>;

// ---- API replies ----

export const briefingListItemSchema = z.object({
  id: z.number().int(),
  title: z.string(),
  catchmentName: z.string(),
  latestVersion: z.number().int(),
  updatedAt: z.string(),
  publishedAt: z.string().nullable(),
});
export type BriefingListItem = z.infer<typeof briefingListItemSchema>;
export const briefingListSchema = z.object({ briefings: z.array(briefingListItemSchema) });

export const draftSchema = z.object({
  id: z.number().int(),
  catchmentId: z.number().int(),
  catchmentName: z.string(),
  title: z.string(),
  summary: z.string(),
  selection: runSelectionSchema,
  sections: z.array(draftSectionSchema),
  latestVersion: z.number().int(),
  versions: z.array(z.object({ version: z.number().int(), publishedAt: z.string(), publishedBy: z.string() })),
  sharedWith: z.array(z.object({ userId: z.number().int(), email: z.string(), name: z.string(), status: z.string() })),
});
export type Draft = z.infer<typeof draftSchema>;
export const draftReplySchema = z.object({ briefing: draftSchema });

/** A version as a reader gets it: the snapshot plus text sections rendered to safe HTML on the server. */
export const readingSchema = z.object({
  briefingId: z.number().int(),
  latestVersion: z.number().int(),
  snapshot: briefingSnapshotSchema,
  sectionHtml: z.array(z.string().nullable()),
  summaryHtml: z.string(),
});
export type Reading = z.infer<typeof readingSchema>;

export const commentItemSchema = z.object({
  id: z.number().int(),
  author: z.string(),
  role: z.string(),
  version: z.number().int().nullable(),
  body: z.string(),
  createdAt: z.string(),
});
export const commentListSchema = z.object({ comments: z.array(commentItemSchema) });
export type CommentItem = z.infer<typeof commentItemSchema>;

export const AUDIT_ACTIONS = ['created', 'edited', 'published', 'shared', 'unshared', 'invited', 'viewed', 'downloaded-pdf', 'downloaded-csv', 'commented'] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];
export const auditItemSchema = z.object({
  id: z.number().int(),
  action: z.enum(AUDIT_ACTIONS),
  userEmail: z.string(),
  version: z.number().int().nullable(),
  detail: z.string(),
  createdAt: z.string(),
});
export const auditListSchema = z.object({ events: z.array(auditItemSchema) });
export type AuditItem = z.infer<typeof auditItemSchema>;
