import type { DeriveInput } from '../../../shared/geodata/derive';
import { readGeoTiffFile } from './geotiff-reader';
import { readOutlineFile } from './outline-file';

/** A stored file and what the worker needs to read it. */
export interface StoredFile {
  path: string;
  /** Name the file was uploaded with (outlines are told apart by content, but messages use it). */
  name: string;
  /** DEM elevations in feet when the file does not say so. */
  verticalUnit?: 'metre' | 'foot' | 'us-foot';
}

/** The files a catchment's bands are derived from: the newest of each layer. */
export interface GeodataFiles {
  dem: StoredFile;
  catchmentOutline: StoredFile;
  glacierOutline?: StoredFile;
  debrisOutline?: StoredFile;
  debrisThickness?: StoredFile;
}

/** Reads the DEM, outlines and thickness raster from disk into the derivation's input. */
export async function readDeriveInput(files: GeodataFiles): Promise<DeriveInput> {
  const outline = (file: StoredFile | undefined, field: string) => (file ? readOutlineFile(file.path, file.name, field) : Promise.resolve(undefined));
  const [dem, catchment, glaciers, debris, thickness] = await Promise.all([
    readGeoTiffFile(files.dem.path, { field: 'dem', verticalUnit: files.dem.verticalUnit }),
    readOutlineFile(files.catchmentOutline.path, files.catchmentOutline.name, 'catchmentOutline'),
    outline(files.glacierOutline, 'glacierOutline'),
    outline(files.debrisOutline, 'debrisOutline'),
    files.debrisThickness ? readGeoTiffFile(files.debrisThickness.path, { field: 'debrisThickness', categorical: true }) : Promise.resolve(undefined),
  ]);
  return { dem: dem.raster, catchment, glaciers, debris, debrisThickness: thickness?.raster };
}
