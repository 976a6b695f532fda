import type { DeriveInput } from '../../../shared/geodata/derive';
import { checkElevationValues } from '../../../shared/geodata/dem-checks';
import { outlineFromGeoJson, type Outline } from '../../../shared/geodata/outline';
import { outlineFeatureGeoJson } from '../../../shared/geodata/outline-features';
import type { UploadSummary } from '../../../shared/schemas/geodata';
import { readGeoTiffFile } from './geotiff-reader';
import { outlineSummary, rasterSummary } from './inspect-upload';
import { readOutlineFeatures, readOutlineFile } from './outline-file';
import type { StoredFile } from './read-inputs';
import { cachedRead } from './thread-file-cache';

/** The files of many catchments over one DEM: the DEM, a file of catchment outlines, and optional glacier and debris outlines of the region. */
export interface OutlineBatchFiles {
  dem: StoredFile;
  catchmentOutline: StoredFile;
  glacierOutline?: StoredFile;
  debrisOutline?: StoredFile;
}

/** One feature of the outline file, as read: the outline file its catchment will keep, or why it has none. */
export interface FeatureRead {
  number: number;
  name: string | null;
  problem: string | null;
  /** The feature alone as GeoJSON in the file's system (outline-features.ts); null when its geometry is unusable. */
  geoJson: string | null;
  /** What the single-catchment upload says of that outline file. */
  summary: UploadSummary | null;
}

export interface OutlineBatchRead {
  dem: UploadSummary;
  glacierOutline?: UploadSummary;
  debrisOutline?: UploadSummary;
  features: FeatureRead[];
}

const demOf = (file: StoredFile) => cachedRead(`${file.path}|${file.verticalUnit ?? ''}`, () => readGeoTiffFile(file.path, { field: 'dem', verticalUnit: file.verticalUnit }));
const regionOutline = (file: StoredFile | undefined, field: string): Promise<Outline | undefined> =>
  (file ? cachedRead(file.path, () => readOutlineFile(file.path, file.name, field)) : Promise.resolve(undefined));

/**
 * Reads and checks the files of many outlines over one DEM, as the single upload checks each
 * (the DEM's elevations, every ring of every outline), and splits the outline file into one
 * outline per feature. A file that cannot be used at all is refused (`GeodataError`); a feature
 * that cannot is kept with its problem. The DEM stays in this thread for the derivations.
 */
export async function readOutlineBatch(files: OutlineBatchFiles): Promise<OutlineBatchRead> {
  const [dem, outlines, glaciers, debris] = await Promise.all([
    demOf(files.dem),
    readOutlineFeatures(files.catchmentOutline.path, files.catchmentOutline.name, 'catchmentOutline'),
    regionOutline(files.glacierOutline, 'glacierOutline'),
    regionOutline(files.debrisOutline, 'debrisOutline'),
  ]);
  checkElevationValues(dem.raster);
  return {
    dem: rasterSummary(dem.raster, dem.info.notices),
    glacierOutline: glaciers && outlineSummary(glaciers),
    debrisOutline: debris && outlineSummary(debris),
    features: outlines.features.map((f) => ({
      number: f.number, name: f.name, problem: f.problem,
      geoJson: f.outline ? JSON.stringify(outlineFeatureGeoJson(f.outline, f.name)) : null,
      summary: f.outline ? outlineSummary(f.outline) : null,
    })),
  };
}

/** The derivation's input for one outline of a batch: the DEM and the region's glacier and debris outlines, as kept by this thread. */
export async function outlineDeriveInput(files: Omit<OutlineBatchFiles, 'catchmentOutline'>, outlineGeoJson: string): Promise<DeriveInput> {
  const [dem, glaciers, debris] = await Promise.all([demOf(files.dem), regionOutline(files.glacierOutline, 'glacierOutline'), regionOutline(files.debrisOutline, 'debrisOutline')]);
  return { dem: dem.raster, catchment: outlineFromGeoJson(JSON.parse(outlineGeoJson), 'catchmentOutline'), glaciers, debris };
}
