import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { storeZip } from './store-zip';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { crsFromEpsg } from '../../../../shared/geodata/crs';
import { valueNoise } from '../../../../shared/geodata/demo/value-noise';
import type { Raster } from '../../../../shared/geodata/raster';
import { encodeGeoTiff, type EncodeOptions } from '../geotiff-writer';

/**
 * Runs one of GDAL's command-line tools (Debian's gdal-bin, which `npm test` installs) and
 * returns what it printed. A missing tool is an error, never a skipped check.
 */
export function gdal(tool: string, args: string[], input?: string): string {
  try {
    return execFileSync(tool, args, { encoding: 'utf8', input, stdio: [input === undefined ? 'ignore' : 'pipe', 'pipe', 'pipe'] });
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') {
      throw new Error(`${tool} is missing: the geodata reference checks need Debian's gdal-bin (npm test installs it; or apt-get install gdal-bin)`, { cause: error });
    }
    throw error;
  }
}

/** A temporary folder for one test file's rasters, removed by `dispose`. */
export function scratchFolder(): { path: (name: string) => string; write: (name: string, raster: Raster, options?: EncodeOptions) => string; dispose: () => void } {
  const dir = mkdtempSync(join(tmpdir(), 'tarnish-geodata-'));
  return {
    path: (name) => join(dir, name),
    write: (name, raster, options) => {
      const file = join(dir, name);
      writeFileSync(file, encodeGeoTiff(raster, options));
      return file;
    },
    dispose: () => rmSync(dir, { recursive: true, force: true }),
  };
}

/** UTM zone 44N, where the demo valley lies. */
export const UTM44N = crsFromEpsg(32644, 'dem');
const ORIGIN = { x0: 560_010, y0: 3_760_020 };

/**
 * The test surfaces on a 30 m UTM grid (width × height cells): a tilted plane, a cone, a
 * paraboloid and a small invented mountain (two summits and seeded roughness).
 */
export function testSurface(kind: 'plane' | 'cone' | 'paraboloid' | 'mountain', width = 120, height = 100, cell = 30): Raster {
  const rough = valueNoise(5, 900, 4);
  const cx = (width * cell) / 2;
  const cy = (height * cell) / 2;
  const values = new Float32Array(width * height);
  for (let r = 0; r < height; r++) {
    for (let c = 0; c < width; c++) {
      const x = (c + 0.5) * cell;
      const y = -(r + 0.5) * cell;
      const dx = x - cx;
      const dy = y + cy;
      const d = Math.hypot(dx, dy);
      values[r * width + c] =
        kind === 'plane' ? 3000 + 0.3 * x + 0.2 * y
          : kind === 'cone' ? 5000 - 0.6 * d
            : kind === 'paraboloid' ? 3000 + (d * d) / 2000
              : 3200 + 1400 * Math.exp(-((dx - 600) ** 2 + (dy - 300) ** 2) / 1.2e6) + 900 * Math.exp(-((dx + 900) ** 2 + (dy + 400) ** 2) / 6e5) + 60 * rough(x, y);
    }
  }
  return { width, height, ...ORIGIN, dx: cell, dy: cell, values, crs: UTM44N };
}


/** Writes `json` as a shapefile with ogr2ogr (GDAL) in the scratch folder and zips the parts that `keep` selects; returns the zip's path. */
export function zippedShapefile(scratch: ReturnType<typeof scratchFolder>, name: string, json: object, keep: (file: string) => boolean = () => true): string {
  const folder = scratch.path(`${name}-parts`);
  const source = scratch.path(`${name}.geojson`);
  writeFileSync(source, JSON.stringify(json));
  gdal('ogr2ogr', ['-q', '-f', 'ESRI Shapefile', folder, source, '-nln', name]);
  const files = readdirSync(folder).filter(keep).map((f) => ({ name: `${name}/${f}`, data: readFileSync(`${folder}/${f}`) }));
  const zip = scratch.path(`${name}.zip`);
  writeFileSync(zip, storeZip(files));
  return zip;
}
