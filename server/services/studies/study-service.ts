import { startRunSchema } from '../../../shared/schemas/runs';
import { scenarioChangesSchema, type ScenarioChanges } from '../../../shared/schemas/scenarios';
import { STUDY_VALUE_FIELDS, type studyCreateSchema, type Study, type StudyListItem, type StudyOptions, type StudyValue } from '../../../shared/schemas/studies';
import type { z } from 'zod';
import { AppError, conflict, validationFailed } from '../../errors';
import type { RunService } from '../runs/run-service';
import type { ScenarioService } from '../runs/scenario-service';
import type { TenantScope } from '../tenant-scope';
import { createTableCatchments, readCatchmentTable } from './catchment-table';
import { addToStudy } from './region-catchments';
import { draftStudy, listItem, loadCells, loadTemplates, readStudy, type StudyRow } from './study-store';

type StudyCreateBody = z.output<typeof studyCreateSchema>;

/** A template's changes for one catchment: its own values over the template's. */
export function changesFor(template: { changes: ScenarioChanges; values: StudyValue[] }, catchmentId: number): ScenarioChanges {
  const own = template.values.find((v) => v.catchmentId === catchmentId);
  const overrides = own ? Object.fromEntries(STUDY_VALUE_FIELDS.map((f) => [f.field, own[f.field]]).filter(([, v]) => v !== undefined)) : {};
  return scenarioChangesSchema.parse({ ...template.changes, ...overrides });
}

/** The scenario a study makes in each catchment for a template (unique per catchment, at most 120 characters). */
export const studyScenarioName = (studyName: string, templateName: string) => `${templateName} (${studyName})`.slice(0, 120);

/**
 * Regional studies: catchments of the organisation, scenario templates applied to each, run
 * options; starting one starts a run per catchment × template on the queue at study priority
 * (behind single runs), each simulated by the worker processes like any run.
 */
export class StudyService {
  constructor(private readonly scenarios: ScenarioService, private readonly runs: RunService) {}

  async list(scope: TenantScope): Promise<StudyListItem[]> {
    const rows: StudyRow[] = await scope.from<StudyRow>('studies').orderBy('id', 'desc').limit(100);
    return Promise.all(rows.map(async (r) => listItem(await readStudy(scope, r))));
  }

  async get(scope: TenantScope, id: number): Promise<Study> {
    return readStudy(scope, await scope.findOr404<StudyRow>('studies', id, 'Study'));
  }

  async create(scope: TenantScope, body: StudyCreateBody, userId: number): Promise<Study> {
    await this.assertCatchments(scope, body.catchmentIds);
    for (const t of body.templates) {
      const stray = t.values.find((v) => !body.catchmentIds.includes(v.catchmentId));
      if (stray) throw validationFailed(`The values of "${t.name}" name a catchment that is not in the study.`, 'templates');
    }
    if (await scope.from('studies').where('name', body.name).first('id')) throw conflict('A study with this name already exists.', 'name');
    const id = await scope.transaction(async (s) => {
      const studyId = await s.insert('studies', { name: body.name, description: body.description, options: JSON.stringify(body.options), created_by: userId });
      await s.db('study_catchments').insert(body.catchmentIds.map((catchment_id) => ({ organisation_id: s.organisationId, study_id: studyId, catchment_id })));
      for (const t of body.templates) {
        const templateId = await s.insert('study_scenarios', { study_id: studyId, name: t.name, changes: JSON.stringify(t.changes) });
        if (t.values.length) {
          await s.db('study_scenario_values').insert(t.values.map(({ catchmentId, ...changes }) => ({
            organisation_id: s.organisationId, study_scenario_id: templateId, catchment_id: catchmentId, changes: JSON.stringify(changes),
          })));
        }
      }
      return studyId;
    });
    return this.get(scope, id);
  }

  /** Makes the catchments of an uploaded catchment table and adds them to a study not yet started. */
  async addCatchmentTable(scope: TenantScope, id: number, table: { rows: Record<string, unknown>[]; climateFromCatchmentId: number }, userId: number)
    : Promise<{ study: Study; created: { id: number; name: string }[] }> {
    await draftStudy(scope, id);
    const catchments = readCatchmentTable(table.rows);
    const created = await scope.transaction(async (s) => {
      const made = await createTableCatchments(s, catchments, table.climateFromCatchmentId, userId);
      await addToStudy(s, id, made.map((c) => c.id));
      return made;
    });
    return { study: await this.get(scope, id), created };
  }

  /** Starts a run for every catchment × template (a study starts once; failed ones are retried with `retry`). */
  async start(scope: TenantScope, id: number, userId: number): Promise<Study> {
    const row = await scope.findOr404<StudyRow>('studies', id, 'Study');
    if (row.started_at) throw conflict('This study has already been started; retry its failed catchments instead.');
    await scope.from('studies').where('id', id).update({ started_at: scope.db.fn.now(3) });
    await this.startCells(scope, row, userId, () => true);
    return this.get(scope, id);
  }

  /** Starts again only the cells whose run failed or was cancelled (or could not start). */
  async retry(scope: TenantScope, id: number, userId: number): Promise<Study> {
    const row = await scope.findOr404<StudyRow>('studies', id, 'Study');
    if (!row.started_at) throw conflict('This study has not been started yet.');
    const cells = await loadCells(scope, id);
    const again = new Set(cells.filter((c) => c.run_status === 'failed' || c.run_status === 'cancelled' || (c.run_id === null && c.error_message))
      .map((c) => `${c.catchment_id}|${c.study_scenario_id}`));
    if (again.size === 0) throw conflict('No catchment of this study has failed; there is nothing to retry.');
    await this.startCells(scope, row, userId, (catchmentId, templateId) => again.has(`${catchmentId}|${templateId}`));
    return this.get(scope, id);
  }

  /** Cancels every run of the study still waiting or running: waiting jobs leave the queue, running ones stop. */
  async cancel(scope: TenantScope, id: number): Promise<Study> {
    await scope.findOr404<StudyRow>('studies', id, 'Study');
    const cells = await loadCells(scope, id);
    await this.runs.cancelOpen(scope, cells.flatMap((c) => (c.run_id && (c.run_status === 'queued' || c.run_status === 'running') ? [c.run_id] : [])));
    return this.get(scope, id);
  }

  private async startCells(scope: TenantScope, study: StudyRow, userId: number, include: (catchmentId: number, templateId: number) => boolean): Promise<void> {
    const options = (await this.get(scope, study.id)).options;
    const templates = await loadTemplates(scope, study.id);
    const catchmentIds: number[] = (await scope.from('study_catchments').where('study_id', study.id).orderBy('id').select('catchment_id')).map((r: { catchment_id: number }) => r.catchment_id);
    for (const catchmentId of catchmentIds) {
      for (const template of templates) {
        if (!include(catchmentId, template.id)) continue;
        const outcome = await this.startCell(scope, study.name, catchmentId, template, options, userId);
        await scope.db('study_runs').insert({
          organisation_id: scope.organisationId, study_id: study.id, study_scenario_id: template.id, catchment_id: catchmentId, ...outcome,
        }).onConflict(['study_id', 'study_scenario_id', 'catchment_id']).merge(['run_id', 'error_message']);
      }
    }
  }

  /** One catchment × template: its scenario made or brought up to date, then its run started (or why it cannot be). */
  private async startCell(scope: TenantScope, studyName: string, catchmentId: number, template: Study['templates'][number], options: StudyOptions, userId: number)
    : Promise<{ run_id: number | null; error_message: string | null }> {
    try {
      const name = studyScenarioName(studyName, template.name);
      const changes = changesFor(template, catchmentId);
      const existing = await scope.from('scenarios').where({ catchment_id: catchmentId, name }).first('id');
      const scenarioId = existing
        ? (await this.scenarios.update(scope, catchmentId, existing.id as number, { changes })).id
        : (await this.scenarios.create(scope, catchmentId, { name, description: `Made by the regional study "${studyName}".`, changes }, userId)).id;
      const request = startRunSchema.parse({ scenarioId, ...options });
      const { run } = await this.runs.start(scope, catchmentId, request, userId, 'study');
      return { run_id: run.id, error_message: null };
    } catch (error) {
      // What stops one catchment (data missing, inputs refused) is shown on that catchment; the rest go on.
      if (error instanceof AppError && error.status < 500) return { run_id: null, error_message: error.message };
      throw error;
    }
  }

  private async assertCatchments(scope: TenantScope, ids: number[]): Promise<void> {
    const found = await scope.from('catchments').whereIn('id', ids).whereNull('archived_at').select('id');
    if (found.length !== ids.length) throw validationFailed('A chosen catchment does not exist or is archived.', 'catchmentIds');
  }
}
