import { promisify } from 'node:util';
import { gunzip } from 'node:zlib';
import type { AppError } from '../../errors';
import { insertBandTable } from '../catchments/band-tables';
import type { GeodataStore } from '../geodata/geodata-store';
import type { MapGeometry } from '../geodata/map-layers';
import type { TenantScope } from '../tenant-scope';
import type { Derived } from '../../workers/geodata-worker';
import { outlineSummaryOf, type BatchFiles, type BatchOptions, type OutlineRow } from './outline-batch-rows';
import { addToStudy, insertRegionCatchment, type ClimateSource } from './region-catchments';

const unpack = promisify(gunzip);

interface DerivedOutline {
  derived: Derived;
  map: MapGeometry;
  seconds: number;
}

export interface OutlineCatchmentsInput {
  batchId: number;
  studyId: number;
  files: BatchFiles;
  options: BatchOptions;
  /** Every outline of the batch, each derived without a problem. */
  outlines: OutlineRow[];
  source: ClimateSource;
  userId: number;
}

/**
 * Makes one catchment per outline and adds them to the study, in one transaction that first
 * claims the pending batch (a second confirm waits on its row, then finds it claimed and gets
 * `alreadyMade`). Each catchment is as the single path would leave it after uploading its DEM,
 * its outline (and the region's glacier and debris outlines), deriving and applying the bands:
 * its geodata uploads and files, a derivation with its map, and the derived band table in use.
 * Files made for a transaction that fails are removed again.
 */
export async function createOutlineCatchments(scope: TenantScope, store: GeodataStore, input: OutlineCatchmentsInput, alreadyMade: () => AppError): Promise<{ id: number; name: string }[]> {
  const made: string[] = [];
  try {
    return await scope.transaction(async (s) => {
      const claimed = await s.from('pending_outline_batches').where('id', input.batchId).whereNull('claimed_at').update({ claimed_at: new Date() });
      if (claimed !== 1) throw alreadyMade();
      const created: { id: number; name: string }[] = [];
      for (const outline of input.outlines) {
        // One outline's derivation read at a time: a large batch's JSON never holds the event loop for long.
        const derived = JSON.parse((await unpack(outline.derived_gz!)).toString('utf8')) as DerivedOutline;
        created.push({ id: await createOne(s, store, input, outline, derived, made), name: outline.name! });
      }
      await addToStudy(s, input.studyId, created.map((c) => c.id));
      return created;
    });
  } catch (error) {
    await store.remove(scope.organisationId, made);
    throw error;
  }
}

async function createOne(s: TenantScope, store: GeodataStore, input: OutlineCatchmentsInput, outline: OutlineRow, { derived, map, seconds }: DerivedOutline, made: string[]): Promise<number> {
  const { files, source, userId } = input;
  const [longitudeDeg, latitudeDeg] = derived.summary.centreLonLat;
  const id = await insertRegionCatchment(s, {
    name: outline.name!, latitudeDeg, longitudeDeg, timeZone: source.time_zone, stationName: source.station_name, stationElevationM: source.station_elevation_m,
    description: `Made from outline ${outline.feature_number} of ${files.catchmentOutline.fileName} over the elevation model ${files.dem.fileName}.`.slice(0, 2000),
  }, source, userId);
  const uploadIds: Record<string, number> = {};
  const record = async (layer: keyof BatchFiles, fileName: string, byteSize: number, storedName: string, summary: object | null) => {
    made.push(storedName);
    uploadIds[layer] = await s.insert('geodata_uploads', {
      catchment_id: id, kind: layer, file_name: fileName.slice(0, 255), byte_size: byteSize, stored_name: storedName, summary: JSON.stringify(summary), uploaded_by: userId,
    });
  };
  for (const layer of ['dem', 'glacierOutline', 'debrisOutline'] as const) {
    const file = files[layer];
    if (!file?.storedName) continue;
    const storedName = store.nameFor(file.fileName);
    await store.share(s.organisationId, file.storedName, storedName);
    await record(layer, file.fileName, file.byteSize, storedName, file.summary);
  }
  const outlineBytes = Buffer.from(outline.outline_geojson!, 'utf8');
  const outlineName = store.newName('.geojson');
  await store.write(s.organisationId, outlineName, outlineBytes);
  const stem = files.catchmentOutline.fileName.replace(/\.[^.]*$/, '');
  await record('catchmentOutline', `${stem}-outline-${outline.feature_number}.geojson`, outlineBytes.length, outlineName, outlineSummaryOf(outline).upload);
  const { climateFromCatchmentId: _source, ...options } = input.options;
  const derivationId = await s.insert('band_derivations', {
    catchment_id: id, options: JSON.stringify(options), upload_ids: JSON.stringify(uploadIds), result: JSON.stringify(derived),
    map: JSON.stringify(map), stored_prefix: outline.stored_prefix, seconds, created_by: userId,
  });
  await insertBandTable(s, id, derived.bands.map(({ skyViewFactor: _s, horizonDeg: _h, ...band }) => band), { origin: { source: 'derived', derivationId, bands: derived.bands }, userId });
  return id;
}
