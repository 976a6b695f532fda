import './no-nested-web-workers';
import type { PooledTask } from '../services/thread-pool';
import { deriveCatchment, type DeriveInput, type DeriveOptions, type DerivedCatchment } from '../../shared/geodata/derive';
import { elevationChangeByBand, type ElevationChangeRow } from '../../shared/geodata/elevation-change';
import { GeodataError, type GeodataNotice } from '../../shared/geodata/errors';
import { snowCoverByBand, type SnowClassCodes, type SnowCoverRow } from '../../shared/geodata/snow-cover';
import { zonesForRanges, type ElevationRange } from '../../shared/geodata/table-zones';
import type { GeodataLayer, UploadSummary } from '../../shared/schemas/geodata';
import { readGeoTiffFile } from '../services/geodata/geotiff-reader';
import { inspectUpload } from '../services/geodata/inspect-upload';
import { mapLayers, type MapLayers } from '../services/geodata/map-layers';
import { outlineDeriveInput, readOutlineBatch, type OutlineBatchFiles, type OutlineBatchRead } from '../services/geodata/outline-batch-reading';
import { readDeriveInput, type GeodataFiles, type StoredFile } from '../services/geodata/read-inputs';

export type ElevationChangeFiles =
  | { kind: 'rate'; dhdt: StoredFile }
  | { kind: 'two-dems'; before: StoredFile; after: StoredFile; beforeDate: string; afterDate: string };

/** Geodata work, each in a worker thread: reading a large DEM or searching horizons takes seconds. */
export type GeodataTask =
  | { kind: 'inspect'; layer: GeodataLayer; file: StoredFile; after?: StoredFile }
  | { kind: 'derive'; files: GeodataFiles; options: Omit<DeriveOptions, 'onProgress'>; withMap: boolean }
  /** Many catchments over one DEM: the files read and checked, the outline file split into its features. */
  | { kind: 'readOutlines'; files: OutlineBatchFiles }
  /** One of those outlines derived as `derive` derives a catchment (its bands, terrain shading and map). */
  | { kind: 'deriveOutline'; files: Omit<OutlineBatchFiles, 'catchmentOutline'>; outline: string; options: Omit<DeriveOptions, 'onProgress'> }
  | { kind: 'snowCover'; files: GeodataFiles; ranges: ElevationRange[]; map: StoredFile; codes: SnowClassCodes }
  | { kind: 'elevationChange'; files: GeodataFiles; ranges: ElevationRange[]; source: ElevationChangeFiles; densityKgM3?: number; densitySigmaKgM3?: number };

export type Derived = Omit<DerivedCatchment, 'zones'>;
export interface DeriveOutcome { derived: Derived; map: MapLayers | null }
export interface SnowCoverOutcome { rows: SnowCoverRow[]; catchment: Omit<SnowCoverRow, 'band' | 'lowerM' | 'upperM'>; notices: GeodataNotice[] }
export interface ElevationChangeOutcome { rows: ElevationChangeRow[]; notices: GeodataNotice[] }
export type GeodataOutcome = UploadSummary | DeriveOutcome | SnowCoverOutcome | ElevationChangeOutcome | OutlineBatchRead;

/** The catchment's cells on the working grid, re-banded by the table's ranges (no horizons: only the cells are needed). */
async function tableZones(files: GeodataFiles, ranges: ElevationRange[]) {
  const input = await readDeriveInput(files);
  // The widest band width passes the resolution check; the bands are replaced by the table's ranges.
  const { zones } = deriveCatchment(input, { bandWidthM: 2000, horizonSectors: 0, debrisThicknessM: 0, maxNodataShare: 0.5 });
  return zonesForRanges(zones, ranges);
}

/** Bands, terrain shading and (when asked) the map of one catchment. */
function derive(input: DeriveInput, options: Omit<DeriveOptions, 'onProgress'>, withMap: boolean, report: (fraction: number) => void): DeriveOutcome {
  const { zones, ...derived } = deriveCatchment(input, { ...options, onProgress: report });
  return { derived, map: withMap ? mapLayers(zones, input) : null };
}

async function run(task: GeodataTask, report: (fraction: number) => void): Promise<GeodataOutcome> {
  switch (task.kind) {
    case 'inspect':
      return inspectUpload(task.layer, task.file, task.after);
    case 'derive':
      return derive(await readDeriveInput(task.files), task.options, task.withMap, report);
    case 'readOutlines':
      return readOutlineBatch(task.files);
    case 'deriveOutline':
      return derive(await outlineDeriveInput(task.files, task.outline), task.options, true, report);
    case 'snowCover': {
      const zones = await tableZones(task.files, task.ranges);
      const { raster } = await readGeoTiffFile(task.map.path, { field: 'snowCover', categorical: true });
      return snowCoverByBand(raster, task.codes, zones);
    }
    case 'elevationChange': {
      const zones = await tableZones(task.files, task.ranges);
      const s = task.source;
      const source = s.kind === 'rate'
        ? { kind: 'rate' as const, dhdt: (await readGeoTiffFile(s.dhdt.path, { field: 'elevationChange', categorical: true })).raster }
        : {
          kind: 'two-dems' as const, beforeDate: s.beforeDate, afterDate: s.afterDate,
          before: (await readGeoTiffFile(s.before.path, { field: 'elevationChange' })).raster,
          after: (await readGeoTiffFile(s.after.path, { field: 'elevationChange' })).raster,
        };
      const { rows, notices } = elevationChangeByBand(source, zones, { densityKgM3: task.densityKgM3, densitySigmaKgM3: task.densitySigmaKgM3 });
      return { rows, notices };
    }
  }
}

/** A refusal of the input, sent back as a value: error classes do not survive the trip between threads. */
export interface GeodataRefused { refused: { code: string; message: string; field: string; details?: Record<string, unknown> } }

/** Worker-thread entry for the shared thread pool; progress fractions go out on the task's port. */
export default async function geodataTask({ task, progress }: PooledTask<GeodataTask>): Promise<GeodataOutcome | GeodataRefused> {
  let last = 0;
  try {
    return await run(task, (fraction) => {
      if (fraction - last >= 0.02 || fraction === 1) {
        last = fraction;
        progress.postMessage(fraction);
      }
    });
  } catch (error) {
    if (error instanceof GeodataError) return { refused: { code: error.code, message: error.message, field: error.field, details: error.details } };
    throw error;
  } finally {
    progress.close();
  }
}
