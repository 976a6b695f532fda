import type { RegionalResults } from '../../../shared/schemas/studies';
import { CURRENT_TABLE_SQL } from '../catchments/band-tables';
import {
  briefingSnapshotSchema, runSelectionSchema, type AuditItem, type BriefingListItem, type BriefingSnapshot, type Draft, type DraftSection,
  type CreateBriefing, type Reading, type SaveDraft,
} from '../../../shared/schemas/briefings';
import { notFound, validationFailed } from '../../errors';
import type { UserRow } from '../auth/auth-service';
import type { TenantScope } from '../tenant-scope';
import { assembleSnapshot } from './assemble';
import { listEvents, recordEvent } from './briefing-audit';
import { readableBriefing, writes, type BriefingRow } from './briefing-access';
import type { BriefingResultsSource } from './comparison';
import { draftSectionsOf, sectionRows } from './draft-sections';
import { renderMarkdown } from './markdown';

const iso = (v: Date | string) => new Date(v).toISOString();
const parsed = <T>(v: string | object): T => (typeof v === 'string' ? JSON.parse(v) : v) as T;

interface CatchmentRow { id: number; name: string; latitude_deg: number; longitude_deg: number; station_name: string; station_elevation_m: number }

/** Drafts, publication and reading of briefings. Published versions are frozen snapshots, never updated. */
export class BriefingService {
  constructor(
    private readonly source: BriefingResultsSource,
    /** A regional study's result, for regional sections (404 for a study not of the organisation). */
    private readonly regional: (scope: TenantScope, studyId: number) => Promise<RegionalResults>,
  ) {}

  async list(scope: TenantScope, user: UserRow): Promise<BriefingListItem[]> {
    const query = scope.from('briefings')
      .join('catchments', 'catchments.id', 'briefings.catchment_id')
      .select('briefings.id', 'briefings.title', 'briefings.latest_version', 'briefings.updated_at', 'catchments.name as catchment_name')
      .select(scope.db.raw('(select max(v.published_at) from briefing_versions v where v.briefing_id = briefings.id) as published_at'))
      .orderBy('briefings.updated_at', 'desc');
    if (!writes(user)) {
      query.where('briefings.latest_version', '>', 0)
        .whereExists((q) => {
          q.from('briefing_shares as s').whereRaw('s.briefing_id = briefings.id').where('s.user_id', user.id);
        });
    }
    const rows = await query;
    return rows.map((r: Record<string, unknown>) => ({
      id: Number(r.id), title: String(r.title), catchmentName: String(r.catchment_name), latestVersion: Number(r.latest_version),
      updatedAt: iso(r.updated_at as Date), publishedAt: r.published_at ? iso(r.published_at as Date) : null,
    }));
  }

  async create(scope: TenantScope, user: UserRow, request: CreateBriefing): Promise<Draft> {
    await scope.findOr404('catchments', request.catchmentId, 'Catchment');
    await this.source.check(scope, request.catchmentId, request.selection);
    const id = await scope.transaction(async (s) => {
      const briefingId = await s.insert('briefings', {
        catchment_id: request.catchmentId, title: request.title, summary: request.summary,
        selection: JSON.stringify(request.selection), created_by: user.id,
      });
      await recordEvent(s, briefingId, user, 'created', null, request.title);
      return briefingId;
    });
    return this.draft(scope, id);
  }

  /** Who published, viewed, downloaded, shared and commented, newest first. */
  async audit(scope: TenantScope, id: number): Promise<AuditItem[]> {
    await scope.findOr404('briefings', id, 'Briefing');
    return listEvents(scope, id);
  }

  async draft(scope: TenantScope, id: number): Promise<Draft> {
    const b = await scope.findOr404<BriefingRow>('briefings', id, 'Briefing');
    const catchment = await scope.findOr404<CatchmentRow>('catchments', b.catchment_id, 'Catchment');
    const versions = await scope.from('briefing_versions').leftJoin('users', 'users.id', 'briefing_versions.published_by')
      .where('briefing_versions.briefing_id', id).orderBy('briefing_versions.version', 'desc')
      .select('briefing_versions.version', 'briefing_versions.published_at', 'users.name as published_by');
    const shares = await scope.from('briefing_shares').join('users', 'users.id', 'briefing_shares.user_id')
      .where('briefing_shares.briefing_id', id).orderBy('users.email').select('users.id', 'users.email', 'users.name', 'users.status');
    return {
      id: b.id, catchmentId: b.catchment_id, catchmentName: catchment.name, title: b.title, summary: b.summary,
      selection: runSelectionSchema.parse(parsed(b.selection)),
      sections: await draftSectionsOf(scope, id),
      latestVersion: b.latest_version,
      versions: versions.map((v: Record<string, unknown>) => ({ version: Number(v.version), publishedAt: iso(v.published_at as Date), publishedBy: String(v.published_by ?? 'former member') })),
      sharedWith: shares.map((u: Record<string, unknown>) => ({ userId: Number(u.id), email: String(u.email), name: String(u.name), status: String(u.status) })),
    };
  }

  /** Replaces title, summary, chosen runs and the ordered sections in one go. */
  async saveDraft(scope: TenantScope, user: UserRow, id: number, request: SaveDraft): Promise<Draft> {
    const briefing = await scope.findOr404<BriefingRow>('briefings', id, 'Briefing');
    await this.source.check(scope, briefing.catchment_id, request.selection);
    for (const [i, section] of request.sections.entries()) {
      if (section.kind === 'regional' && !(await scope.from('studies').where('id', section.studyId).first('id'))) {
        throw validationFailed('Choose one of your regional studies.', `sections.${i}.studyId`);
      }
    }
    await scope.transaction(async (s) => {
      await s.findOr404('briefings', id, 'Briefing');
      await s.from('briefings').where({ id }).update({
        title: request.title, summary: request.summary, selection: JSON.stringify(request.selection), updated_at: new Date(),
      });
      await s.from('briefing_sections').where({ briefing_id: id }).delete();
      const rows = sectionRows(id, request.sections);
      if (rows.length) await s.db('briefing_sections').insert(rows.map((r) => ({ ...r, organisation_id: s.organisationId })));
      await recordEvent(s, id, user, 'edited', null, `${request.sections.length} sections`);
    });
    return this.draft(scope, id);
  }

  /** The snapshot the next version would freeze, built from the saved draft and the chosen runs as they are now. */
  async assemble(scope: TenantScope, user: UserRow, id: number, version: number): Promise<BriefingSnapshot> {
    const b = await scope.findOr404<BriefingRow>('briefings', id, 'Briefing');
    const catchment = await scope.findOr404<CatchmentRow>('catchments', b.catchment_id, 'Catchment');
    const bands: { area_km2: number }[] = await scope.from('elevation_bands').whereRaw(CURRENT_TABLE_SQL, [b.catchment_id]).select('area_km2');
    const organisation = await scope.db('organisations').where({ id: scope.organisationId }).first('name');
    const sections: DraftSection[] = await draftSectionsOf(scope, id);
    const regional = new Map<number, RegionalResults>();
    for (const s of sections) if (s.kind === 'regional' && !regional.has(s.studyId)) regional.set(s.studyId, await this.regional(scope, s.studyId));
    return assembleSnapshot({
      regional,
      title: b.title, summary: b.summary, sections, version, publishedAt: new Date(), publishedBy: user.name, organisation: organisation.name,
      catchment: {
        name: catchment.name, latitudeDeg: catchment.latitude_deg, longitudeDeg: catchment.longitude_deg, stationName: catchment.station_name,
        stationElevationM: catchment.station_elevation_m, bandCount: bands.length, areaKm2: bands.reduce((s, x) => s + Number(x.area_km2), 0),
      },
      comparison: await this.source.load(scope, b.catchment_id, runSelectionSchema.parse(parsed(b.selection))),
    });
  }

  async preview(scope: TenantScope, user: UserRow, id: number): Promise<Reading> {
    const b = await scope.findOr404<BriefingRow>('briefings', id, 'Briefing');
    return readingOf(b, await this.assemble(scope, user, id, b.latest_version + 1));
  }

  /** Freezes the draft as the next version; the numbers are copied, so later runs never change it. */
  async publish(scope: TenantScope, user: UserRow, id: number): Promise<{ version: number }> {
    const before = await scope.findOr404<BriefingRow>('briefings', id, 'Briefing');
    const snapshot = await this.assemble(scope, user, id, before.latest_version + 1);
    return scope.transaction(async (s) => {
      // Lock the briefing so two publishers cannot take the same version number.
      const row = await s.from<BriefingRow>('briefings').where({ id }).forUpdate().first();
      if (!row) throw notFound('Briefing');
      const version = row.latest_version + 1;
      const frozen: BriefingSnapshot = { ...snapshot, version };
      await s.insert('briefing_versions', { briefing_id: id, version, snapshot: JSON.stringify(frozen), published_by: user.id, published_at: new Date(frozen.publishedAt) });
      await s.from('briefings').where({ id }).update({ latest_version: version, updated_at: new Date() });
      await recordEvent(s, id, user, 'published', version, frozen.title);
      return { version };
    });
  }

  /** A published version as its reader sees it; `version` 0 means the latest. Logs the view. */
  async read(scope: TenantScope, user: UserRow, id: number, version: number): Promise<Reading> {
    const b = await readableBriefing(scope, user, id);
    const snapshot = await this.snapshot(scope, b, version);
    await recordEvent(scope, id, user, 'viewed', snapshot.version);
    return readingOf(b, snapshot);
  }

  async snapshot(scope: TenantScope, b: BriefingRow, version: number): Promise<BriefingSnapshot> {
    const wanted = version === 0 ? b.latest_version : version;
    const row = await scope.from('briefing_versions').where({ briefing_id: b.id, version: wanted }).first('snapshot');
    if (!row) throw notFound('Briefing version');
    return briefingSnapshotSchema.parse(JSON.parse(String(row.snapshot)));
  }
}

/** Text sections and the summary are rendered to safe HTML here, at reading time, by the one sanitiser. */
function readingOf(b: BriefingRow, snapshot: BriefingSnapshot): Reading {
  return {
    briefingId: b.id,
    latestVersion: b.latest_version,
    snapshot,
    summaryHtml: renderMarkdown(snapshot.summary),
    sectionHtml: snapshot.sections.map((s) => (s.kind === 'text' ? renderMarkdown(s.markdown) : null)),
  };
}
