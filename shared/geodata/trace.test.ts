import { describe, expect, it } from 'vitest';
import { seededRandom } from '../analysis/random';
import { checkPolygons, outlineArea } from './outline';
import { countMarked, rasterizePolygons } from './rasterize';
import { traceMask } from './trace';
import { UTM44N } from './test-fixtures';

describe('tracing masks into polygons', () => {
  const grid = { width: 60, height: 50, x0: 500_000, y0: 3_700_000, dx: 30, dy: 30 };
  it('gives polygons (holes and corner-touching cells included) that rasterise back to the same cells', () => {
    const random = seededRandom(4);
    for (let trial = 0; trial < 5; trial++) {
      const mask = Uint8Array.from({ length: grid.width * grid.height }, (_, i) => {
        const r = Math.floor(i / grid.width);
        const c = i % grid.width;
        const blob = Math.hypot(r - 25, c - 30) < 18 && Math.hypot(r - 25, c - 30) > 4;
        return blob && random() > 0.15 ? 1 : 0;
      });
      const polygons = traceMask(mask, grid);
      expect(() => checkPolygons(polygons, UTM44N, 'glacierOutline')).not.toThrow();
      const back = rasterizePolygons(polygons, grid);
      expect(Array.from(back)).toEqual(Array.from(mask));
      expect(outlineArea(polygons)).toBeCloseTo(countMarked(mask) * 900, 6);
    }
  });
});
