import { writeArrayBuffer } from 'geotiff';
import type { Raster } from '../../../shared/geodata/raster';

export interface EncodeOptions {
  /** Cell type written: 32-bit floats (default), 16-bit signed or 8-bit unsigned integers. */
  type?: 'float32' | 'int16' | 'uint8';
  /** Value written for NaN cells and recorded as GDAL's nodata (default −9999; 255 for uint8). */
  nodata?: number;
}

/**
 * An uncompressed, stripped GeoTIFF of a raster in an EPSG system (for the demo data and test
 * fixtures; GDAL reads it back identically). The tie point is the outer top-left corner ("pixel is area").
 */
export function encodeGeoTiff(raster: Raster, options: EncodeOptions = {}): Uint8Array {
  const type = options.type ?? 'float32';
  const nodata = options.nodata ?? (type === 'uint8' ? 255 : -9999);
  const n = raster.width * raster.height;
  const values = type === 'float32' ? new Float32Array(n) : type === 'int16' ? new Int16Array(n) : new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const v = raster.values[i];
    values[i] = v === v ? (type === 'float32' ? v : Math.round(v)) : nodata;
  }
  if (raster.crs.epsg === undefined) throw new Error('encodeGeoTiff writes EPSG systems only');
  const geographic = raster.crs.kind === 'geographic';
  const bits = type === 'float32' ? 32 : type === 'int16' ? 16 : 8;
  const metadata = {
    width: raster.width,
    height: raster.height,
    BitsPerSample: [bits],
    SampleFormat: [type === 'float32' ? 3 : type === 'int16' ? 2 : 1],
    ModelPixelScale: [raster.dx, raster.dy, 0],
    ModelTiepoint: [0, 0, 0, raster.x0, raster.y0, 0],
    GTModelTypeGeoKey: geographic ? 2 : 1,
    GTRasterTypeGeoKey: 1,
    ...(geographic ? { GeographicTypeGeoKey: raster.crs.epsg } : { ProjectedCSTypeGeoKey: raster.crs.epsg }),
    GDAL_NODATA: String(nodata),
  };
  // geotiff's writer has no branch for Int16Array: signed 16-bit cells go as their unsigned bit patterns (SampleFormat says signed).
  const written = values instanceof Int16Array ? new Uint16Array(values.buffer) : values;
  return new Uint8Array(writeArrayBuffer(written, metadata));
}
