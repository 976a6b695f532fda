import { aspectClassIndex } from '../../../shared/geodata/band-zones';
import { OUTSIDE_CATCHMENT } from '../../../shared/geodata/unit-runs';
import type { CatchmentZones, DeriveInput } from '../../../shared/geodata/derive';
import { transformOutline, type Outline } from '../../../shared/geodata/outline';
import { gridBounds } from '../../../shared/geodata/raster';
import { pointTransform } from '../../../shared/geodata/reproject';
import { aspectDeg, hillshade, hornGradient } from '../../../shared/geodata/terrain';
import type { CatchmentMap } from '../../../shared/schemas/geodata';
import { encodeGreyAlphaPng } from './png';

/** Longest side of the map's images in cells: enough for a screen, small enough to send. */
export const MAP_MAX_SIDE = 900;

export type MapGeometry = Pick<CatchmentMap, 'crs' | 'extent' | 'width' | 'height' | 'outlines'>;

export interface MapLayers {
  geometry: MapGeometry;
  /** Shaded relief of the whole working grid (sun from the north-west, 45° up), transparent where the DEM has no data. */
  hillshadePng: Buffer;
  /**
   * The cells the bands are drawn from, at map resolution, as `encodeUnitRuns` reads them, so any
   * band table's elevation ranges (and response units) can be drawn without the DEM.
   */
  cells: Buffer;
}

/**
 * The map of a derivation: the working grid sampled every `step` cells (nearest cell centre) for
 * the hillshade and the cell layers, and the outlines carried into the grid's system.
 */
export function mapLayers(zones: CatchmentZones, input: DeriveInput): MapLayers {
  const { grid } = zones;
  const step = Math.max(1, Math.ceil(Math.max(grid.width, grid.height) / MAP_MAX_SIDE));
  const width = Math.floor(grid.width / step);
  const height = Math.floor(grid.height / step);
  const gradient = hornGradient(zones.elevation, grid);
  const shade = hillshade(gradient);
  const grey = new Uint8Array(width * height);
  const alpha = new Uint8Array(width * height);
  const cells = Buffer.alloc(width * height * 3);
  const half = Math.floor(step / 2);
  for (let r = 0; r < height; r++) {
    for (let c = 0; c < width; c++) {
      const k = r * width + c;
      const i = (r * step + half) * grid.width + c * step + half;
      const z = zones.elevation[i];
      grey[k] = shade[i];
      alpha[k] = z === z ? 255 : 0;
      cells.writeInt16LE(zones.band[i] >= 0 ? Math.round(z) : OUTSIDE_CATCHMENT, k * 2);
      cells[width * height * 2 + k] = aspectClassIndex(aspectDeg(gradient.east[i], gradient.north[i]));
    }
  }
  const [minX, , , maxY] = gridBounds(grid);
  const inGrid = (o: Outline | undefined) => (o ? roundPolygons(transformOutline(o, pointTransform(o.crs, zones.crs), zones.crs).polygons) : []);
  return {
    geometry: {
      crs: { name: zones.crs.name, proj4: zones.crs.proj4 },
      extent: [minX, maxY - height * step * grid.dy, minX + width * step * grid.dx, maxY],
      width,
      height,
      outlines: { catchment: inGrid(input.catchment), glacier: inGrid(input.glaciers), debris: inGrid(input.debris) },
    },
    hillshadePng: encodeGreyAlphaPng(width, height, grey, alpha),
    cells,
  };
}

const roundPolygons = (polygons: [number, number][][][]) => polygons.map((p) => p.map((ring) => ring.map(([x, y]) => [Math.round(x * 10) / 10, Math.round(y * 10) / 10] as [number, number])));
