import { readFile, stat } from 'node:fs/promises';
import { fromArrayBuffer, type GeoTIFFImage } from 'geotiff';
import { crsFromGeoKeys, EPSG_UNITS, METRES_PER_UNIT } from '../../../shared/geodata/crs';
import { GeodataError, type GeodataNotice } from '../../../shared/geodata/errors';
import type { Raster } from '../../../shared/geodata/raster';
import { GEODATA_LIMITS } from '../../../shared/geodata/limits';

export interface ReadGeoTiffOptions {
  /** Which upload this is, for messages ('dem', 'debrisThickness', 'snowCover', …). */
  field: string;
  /** Unit of the cell values when they are elevations; default: the file's vertical-unit key, else metres. */
  verticalUnit?: 'metre' | 'foot' | 'us-foot';
  /** Values are class codes or other numbers that must not be scaled. */
  categorical?: boolean;
  maxCells?: number;
}

export interface GeoTiffInfo {
  compression: number;
  tiled: boolean;
  sampleFormat: 'unsigned integer' | 'signed integer' | 'floating point';
  bitsPerSample: number;
  nodata: number | null;
  verticalUnit: 'metre' | 'foot' | 'us-foot';
  notices: GeodataNotice[];
}

const SAMPLE_FORMATS = { 1: 'unsigned integer', 2: 'signed integer', 3: 'floating point' } as const;

/** Reads a GeoTIFF from disk after checking its size against the limits. */
export async function readGeoTiffFile(path: string, options: ReadGeoTiffOptions): Promise<{ raster: Raster; info: GeoTiffInfo }> {
  const { size } = await stat(path);
  if (size > GEODATA_LIMITS.rasterFileBytes) {
    throw new GeodataError('too_large', `The file is ${mb(size)}; rasters up to ${mb(GEODATA_LIMITS.rasterFileBytes)} are accepted. Clip it to the catchment plus a few kilometres.`, options.field);
  }
  return readGeoTiff(await readFile(path), options);
}

/**
 * Reads the first image's first band of a GeoTIFF (stripped or tiled, any compression the
 * `geotiff` package decodes, 8–64-bit integers or floats) into a raster with NaN for nodata
 * (GDAL's nodata tag, and NaN in float files). The header is checked before any pixel is read:
 * image data that would run past the end of the file (a cut-short upload, or a header claiming
 * gigabytes in a small file) and rasters over the cell limit are refused with the numbers.
 */
export async function readGeoTiff(bytes: Uint8Array, options: ReadGeoTiffOptions): Promise<{ raster: Raster; info: GeoTiffInfo }> {
  const field = options.field;
  checkMagic(bytes, field);
  const buffer = bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
  let image: GeoTIFFImage;
  try {
    image = await (await fromArrayBuffer(buffer)).getImage(0);
  } catch (error) {
    throw damaged(field, error);
  }
  const width = image.getWidth();
  const height = image.getHeight();
  const directory = image.getFileDirectory();
  const tiled = directory.hasTag('TileOffsets');
  const offsets = (await directory.loadValue(tiled ? 'TileOffsets' : 'StripOffsets').catch(() => undefined)) as ArrayLike<number> | undefined;
  const counts = (await directory.loadValue(tiled ? 'TileByteCounts' : 'StripByteCounts').catch(() => undefined)) as ArrayLike<number> | undefined;
  checkDataInsideFile(offsets, counts, bytes.byteLength, width, height, image.getBytesPerPixel(), field);
  const maxCells = options.maxCells ?? GEODATA_LIMITS.rasterCells;
  if (width * height > maxCells) {
    throw new GeodataError('too_large',
      `The raster has ${width.toLocaleString('en')} × ${height.toLocaleString('en')} cells; up to ${(maxCells / 1e6).toFixed(0)} million cells are accepted. Clip it to the catchment plus a few kilometres, or resample it.`,
      field, { width, height });
  }
  const notices: GeodataNotice[] = [];
  if (image.getSamplesPerPixel() > 1) notices.push({ code: 'first_band_only', field, message: `The raster has ${image.getSamplesPerPixel()} bands; only the first is read.` });
  const formatCode = image.getSampleFormat(0) as keyof typeof SAMPLE_FORMATS;
  const bitsPerSample = image.getBitsPerSample(0);
  if (!SAMPLE_FORMATS[formatCode] || ![8, 16, 32, 64].includes(bitsPerSample) || (formatCode === 3 && bitsPerSample < 32)) {
    throw new GeodataError('unsupported_raster', `The raster stores ${bitsPerSample}-bit values of a kind Tarnish does not read; save it as 16-bit integers or 32-bit floats.`, field);
  }
  const crs = crsFromGeoKeys(image.getGeoKeys() as Record<string, unknown> | null, field);
  const geometry = gridOf(image, field);
  const verticalUnit = options.verticalUnit ?? verticalUnitOf(image);
  const nodata = image.getGDALNoData();
  let data: ArrayLike<number>;
  try {
    data = (await image.readRasters({ samples: [0], interleave: true })) as unknown as ArrayLike<number>;
  } catch (error) {
    throw damaged(field, error);
  }
  const scale = options.categorical ? 1 : METRES_PER_UNIT[verticalUnit];
  const values = new Float32Array(width * height);
  for (let i = 0; i < values.length; i++) {
    const v = data[i];
    values[i] = v !== v || (nodata !== null && (v === nodata || Math.abs(v - nodata) <= Math.abs(nodata) * 1e-7)) ? NaN : v * scale;
  }
  if (geometry.flipped) flipRows(values, width, height);
  if (verticalUnit !== 'metre' && !options.categorical) notices.push({ code: 'converted_from_feet', field, message: `Elevations were read as ${verticalUnit === 'foot' ? 'feet' : 'US survey feet'} and converted to metres.` });
  return {
    raster: { width, height, x0: geometry.x0, y0: geometry.y0, dx: geometry.dx, dy: geometry.dy, values, crs },
    info: { compression: Number(directory.getValue('Compression') ?? 1), tiled, sampleFormat: SAMPLE_FORMATS[formatCode], bitsPerSample, nodata, verticalUnit, notices },
  };
}

function checkMagic(bytes: Uint8Array, field: string): void {
  const ascii = String.fromCharCode(...bytes.subarray(0, 4));
  if (ascii === 'II*\0' || ascii === 'MM\0*' || ascii === 'II+\0' || ascii === 'MM\0+') return;
  const kind = ascii.startsWith('PK') ? 'a zip archive' : ascii.startsWith('\x89PNG') ? 'a PNG image' : bytes.length === 0 ? 'empty' : 'not a TIFF';
  throw new GeodataError('not_a_geotiff', `The file is not a GeoTIFF (it is ${kind}). Export the raster as GeoTIFF (.tif).`, field);
}

function checkDataInsideFile(offsets: ArrayLike<number> | undefined, counts: ArrayLike<number> | undefined, fileBytes: number, width: number, height: number, bytesPerPixel: number, field: string): void {
  const claimed = width * height * bytesPerPixel;
  if (!offsets || !counts || offsets.length === 0) {
    throw new GeodataError('truncated_file', 'The GeoTIFF says where none of its image data is: the file is damaged. Export it again.', field);
  }
  let end = 0;
  for (let i = 0; i < offsets.length; i++) end = Math.max(end, Number(offsets[i]) + Number(counts[i] ?? 0));
  if (end > fileBytes) {
    throw new GeodataError('truncated_file',
      `The GeoTIFF is cut short: its header puts image data up to byte ${end.toLocaleString('en')} (${width.toLocaleString('en')} × ${height.toLocaleString('en')} cells, ${mb(claimed)} uncompressed), but the file has only ${fileBytes.toLocaleString('en')} bytes. Upload the complete file.`,
      field, { claimedBytes: end, fileBytes });
  }
}

function gridOf(image: GeoTIFFImage, field: string): { x0: number; y0: number; dx: number; dy: number; flipped: boolean } {
  let origin: number[];
  let resolution: number[];
  try {
    origin = image.getOrigin();
    resolution = image.getResolution();
  } catch {
    throw new GeodataError('no_crs', 'The GeoTIFF has no georeferencing (no tie point and cell size). Georeference it in your GIS and export it again.', field);
  }
  const transformation = image.getFileDirectory().getValue('ModelTransformation') as number[] | undefined;
  if (transformation && (transformation[1] !== 0 || transformation[4] !== 0)) {
    throw new GeodataError('unsupported_raster', 'The GeoTIFF grid is rotated; warp it to a north-up grid and upload it again.', field);
  }
  const dx = Math.abs(resolution[0]);
  const dy = Math.abs(resolution[1]);
  const flipped = resolution[1] > 0;
  const pointCentred = Number((image.getGeoKeys() as Record<string, unknown> | null)?.GTRasterTypeGeoKey) === 2;
  // "pixel is point": the tie point is the first cell's centre, so its outer corner lies half a cell out (as GDAL reads it)
  const x0 = origin[0] - (pointCentred ? dx / 2 : 0);
  const top = flipped ? origin[1] + dy * image.getHeight() : origin[1];
  const y0 = top + (pointCentred ? dy / 2 : 0);
  return { x0, y0, dx, dy, flipped };
}

function verticalUnitOf(image: GeoTIFFImage): 'metre' | 'foot' | 'us-foot' {
  const code = Number((image.getGeoKeys() as Record<string, unknown> | null)?.VerticalUnitsGeoKey);
  const unit = EPSG_UNITS[code];
  return unit === 'foot' || unit === 'us-foot' ? unit : 'metre';
}

function flipRows(values: Float32Array, width: number, height: number): void {
  const row = new Float32Array(width);
  for (let r = 0; r < height / 2; r++) {
    const a = r * width;
    const b = (height - 1 - r) * width;
    row.set(values.subarray(a, a + width));
    values.copyWithin(a, b, b + width);
    values.set(row, b);
  }
}

function damaged(field: string, error: unknown): GeodataError {
  const detail = error instanceof Error ? error.message : String(error);
  const cut = /offset|bounds|range|length|EOF|end of/i.test(detail);
  return new GeodataError(cut ? 'truncated_file' : 'not_a_geotiff',
    cut ? 'The GeoTIFF is cut short or damaged: its image data could not be read to the end. Upload the complete file.'
      : 'The GeoTIFF could not be read: the file is damaged or uses a TIFF feature Tarnish does not read. Export it again as a plain GeoTIFF.',
    field);
}

const mb = (bytes: number) => (bytes >= 1024 ** 3 ? `${(bytes / 1024 ** 3).toFixed(1)} GB` : `${(bytes / 1024 ** 2).toFixed(1)} MB`);
