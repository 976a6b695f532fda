import type { BatchOutline, OutlineBatch, OutlineBatchLayer } from '../../../shared/schemas/outline-batches';
import type { UploadSummary } from '../../../shared/schemas/geodata';
import type { DeriveOptions } from '../../../shared/geodata/derive';
import { json } from '../geodata/upload-service';

/** A file of a pending batch: kept in the geodata store under `storedName` until the catchments are made (the outline file itself is not kept: each outline is). */
export interface BatchFile {
  storedName: string | null;
  fileName: string;
  byteSize: number;
  summary: UploadSummary & { verticalUnit?: 'metre' | 'foot' | 'us-foot' };
}
export type BatchFiles = { dem: BatchFile; catchmentOutline: BatchFile } & Partial<Record<Exclude<OutlineBatchLayer, 'dem' | 'catchmentOutline'>, BatchFile>>;
export type BatchOptions = Omit<DeriveOptions, 'onProgress' | 'maxNodataShare' | 'curvature'> & { climateFromCatchmentId: number; splitByAspect: boolean; horizonSectors: number };

export interface BatchRow {
  id: number;
  study_id: number;
  user_id: number;
  token: string;
  status: OutlineBatch['status'];
  options: string | BatchOptions;
  files: string | BatchFiles;
  outline_count: number;
  done_count: number;
  error_message: string | null;
  claimed_at: Date | null;
  expires_at: Date;
}

/** What the preview shows of an outline once derived. */
export interface DerivedFacts {
  areaKm2: number;
  minElevationM: number;
  maxElevationM: number;
  bandCount: number;
  glacierAreaKm2: number;
  cells: number;
}

export interface OutlineSummary {
  /** What stops the outline becoming a catchment, in words. */
  problems: string[];
  notices: string[];
  /** What the single-catchment upload would say of its outline file. */
  upload: UploadSummary | null;
  derived: DerivedFacts | null;
  /** The outline cannot be derived (its geometry, or the derivation refused it). */
  refused: boolean;
}

export interface OutlineRow {
  id: number;
  batch_id: number;
  feature_number: number;
  name: string | null;
  outline_geojson: string | null;
  summary: string | OutlineSummary;
  derived_gz: Buffer | null;
  stored_prefix: string | null;
}

/** Columns of the outlines the preview reads (not the outlines and derivations themselves). */
export const PREVIEW_COLUMNS = ['id', 'batch_id', 'feature_number', 'name', 'summary'] as const;

export const batchFiles = (row: Pick<BatchRow, 'files'>) => json<BatchFiles>(row.files);
export const batchOptions = (row: Pick<BatchRow, 'options'>) => json<BatchOptions>(row.options);
export const outlineSummaryOf = (row: Pick<OutlineRow, 'summary'>) => json<OutlineSummary>(row.summary);

/** "Outline 3 "Kolvi side valley"" (or "Outline 3 (no name)"): how messages name an outline. */
export const outlineLabel = (feature: number, name: string | null) => `Outline ${feature} ${name === null ? '(no name)' : `"${name}"`}`;

function toOutline(row: Pick<OutlineRow, 'feature_number' | 'name' | 'summary'>): BatchOutline {
  const s = outlineSummaryOf(row);
  return {
    feature: row.feature_number, name: row.name, state: s.derived ? 'derived' : s.refused ? 'refused' : 'waiting',
    areaKm2: s.derived?.areaKm2 ?? null, minElevationM: s.derived?.minElevationM ?? null, maxElevationM: s.derived?.maxElevationM ?? null,
    bandCount: s.derived?.bandCount ?? null, glacierAreaKm2: s.derived?.glacierAreaKm2 ?? null, problems: s.problems, notices: s.notices,
  };
}

/** The batch as the API answers it. */
export function toBatch(row: BatchRow, outlines: Pick<OutlineRow, 'feature_number' | 'name' | 'summary'>[]): OutlineBatch {
  const files = batchFiles(row);
  const file = (f: BatchFile | undefined) => f && { fileName: f.fileName, byteSize: f.byteSize, summary: { system: f.summary.system, facts: f.summary.facts, notices: f.summary.notices } };
  const { climateFromCatchmentId, bandWidthM, splitByAspect, horizonSectors, debrisThicknessM } = batchOptions(row);
  const shown = outlines.map(toOutline);
  return {
    token: row.token, status: row.status, error: row.error_message,
    files: { dem: file(files.dem)!, catchmentOutline: file(files.catchmentOutline)!, glacierOutline: file(files.glacierOutline), debrisOutline: file(files.debrisOutline) },
    options: { climateFromCatchmentId, bandWidthM, splitByAspect, horizonSectors, ...(debrisThicknessM === undefined ? {} : { debrisThicknessM }) },
    outlineCount: row.outline_count, derivedCount: row.done_count, outlines: shown,
    canConfirm: row.status === 'ready' && row.claimed_at === null && shown.every((o) => o.state === 'derived' && o.problems.length === 0),
    expiresAt: new Date(row.expires_at).toISOString(),
  };
}
