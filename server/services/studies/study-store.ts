import { catchmentStatus, cellStatusOf, studyStatus, type StudyCell } from '../../../shared/analysis/study-progress';
import { scenarioChangesSchema } from '../../../shared/schemas/scenarios';
import { studyOptionsSchema, studyValueSchema, type Study, type StudyListItem, type StudyValue } from '../../../shared/schemas/studies';
import { conflict } from '../../errors';
import type { TenantScope } from '../tenant-scope';

export interface StudyRow {
  id: number;
  name: string;
  description: string;
  options: string | object;
  created_at: Date;
  started_at: Date | null;
}

/** A study of the organisation not started yet (catchments are added only then): else 404, or 409 once started. */
export async function draftStudy(scope: TenantScope, id: number): Promise<StudyRow> {
  const row = await scope.findOr404<StudyRow>('studies', id, 'Study');
  if (row.started_at) throw conflict('This study has been started; make a new study for more catchments.');
  return row;
}

export interface TemplateRow { id: number; study_id: number; name: string; changes: string | object }
interface ValueRow { study_scenario_id: number; catchment_id: number; changes: string | object }
export interface CellRow {
  study_scenario_id: number;
  catchment_id: number;
  run_id: number | null;
  error_message: string | null;
  run_status: string | null;
  run_progress: number | null;
  run_error: string | null;
}

const json = <T>(v: string | object): T => (typeof v === 'string' ? JSON.parse(v) : v) as T;
const iso = (v: Date | null) => (v ? new Date(v).toISOString() : null);

/** A study's templates with their per-catchment values, in the order they were given. */
export async function loadTemplates(scope: TenantScope, studyId: number): Promise<Study['templates']> {
  const rows: TemplateRow[] = await scope.from<TemplateRow>('study_scenarios').where('study_id', studyId).orderBy('id');
  const values: ValueRow[] = rows.length
    ? await scope.from<ValueRow>('study_scenario_values').whereIn('study_scenario_id', rows.map((r) => r.id)).orderBy('id')
    : [];
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    changes: scenarioChangesSchema.parse(json(r.changes)),
    values: values.filter((v) => v.study_scenario_id === r.id)
      .map((v): StudyValue => studyValueSchema.parse({ catchmentId: v.catchment_id, ...json<object>(v.changes) })),
  }));
}

/** Every cell of a study (catchment × template) with its run's state. */
export async function loadCells(scope: TenantScope, studyId: number): Promise<CellRow[]> {
  return scope.from('study_runs').where('study_runs.study_id', studyId)
    .leftJoin('runs', 'runs.id', 'study_runs.run_id')
    .select('study_runs.study_scenario_id', 'study_runs.catchment_id', 'study_runs.run_id', 'study_runs.error_message',
      'runs.status as run_status', 'runs.progress as run_progress', 'runs.error_message as run_error');
}

const cellOf = (row: CellRow | undefined): StudyCell & { runId: number | null } => {
  if (!row) return { status: 'waiting', progress: 0, message: null, runId: null };
  const message = row.run_error ?? row.error_message;
  return { status: cellStatusOf(row.run_status, message), progress: row.run_progress ?? 0, message, runId: row.run_id };
};

/** The study as the API answers it: options, templates, and where each catchment stands. */
export async function readStudy(scope: TenantScope, row: StudyRow): Promise<Study> {
  const templates = await loadTemplates(scope, row.id);
  const catchments: { id: number; name: string }[] = await scope.from('study_catchments').where('study_catchments.study_id', row.id)
    .join('catchments', 'catchments.id', 'study_catchments.catchment_id').orderBy('study_catchments.id').select('catchments.id', 'catchments.name');
  const cells = await loadCells(scope, row.id);
  const byKey = new Map(cells.map((c) => [`${c.catchment_id}|${c.study_scenario_id}`, c]));
  const perCatchment = catchments.map((c) => {
    const own = templates.map((t) => ({ templateId: t.id, ...cellOf(byKey.get(`${c.id}|${t.id}`)) }));
    return { catchmentId: c.id, name: c.name, ...catchmentStatus(own), cells: own };
  });
  const counts = { done: 0, running: 0, waiting: 0, failed: 0, cancelled: 0 };
  for (const c of perCatchment) counts[c.status] += 1;
  const started = row.started_at !== null;
  return {
    id: row.id,
    name: row.name,
    description: row.description,
    status: studyStatus(started, perCatchment.map((c) => c.status)),
    options: studyOptionsSchema.parse(json(row.options)),
    templates,
    catchments: perCatchment,
    counts,
    progress: perCatchment.length ? perCatchment.reduce((a, c) => a + c.progress, 0) / perCatchment.length : 0,
    createdAt: iso(row.created_at)!,
    startedAt: iso(row.started_at),
  };
}

export function listItem(study: Study): StudyListItem {
  const { id, name, description, status, progress, counts, createdAt, startedAt } = study;
  return { id, name, description, status, progress, counts, createdAt, startedAt, catchmentCount: study.catchments.length, templateCount: study.templates.length };
}
