import { describe, expect, it } from 'vitest';
import { decodeUnitRuns, encodeUnitRuns, OUTSIDE_CATCHMENT } from './unit-runs';

/** A 4 × 2 map: elevations and aspect classes written as the derivation writes its cell layer. */
function cells(elevations: number[], aspects: number[]): Uint8Array {
  const bytes = new Uint8Array(elevations.length * 3);
  const view = new DataView(bytes.buffer);
  elevations.forEach((z, k) => view.setInt16(k * 2, z, true));
  bytes.set(aspects, elevations.length * 2);
  return bytes;
}

describe('map cells to band rows', () => {
  const z = [OUTSIDE_CATCHMENT, 3950, 4100, 4300, 4450, 5000, 3000, OUTSIDE_CATCHMENT];
  it('puts each cell in the range holding its elevation, the end ranges taking what lies beyond, and round-trips', () => {
    const bands = [{ lowerM: 4000, upperM: 4200 }, { lowerM: 4200, upperM: 4400 }, { lowerM: 4400, upperM: 4600 }];
    const runs = encodeUnitRuns(cells(z, new Array(8).fill(0)), 4, 2, bands);
    expect(runs).toEqual([[-1, 1, 0, 2, 1, 1], [2, 2, 0, 1, -1, 1]]);
    expect([...decodeUnitRuns(runs, 4)]).toEqual([-1, 0, 0, 1, 2, 2, 0, -1]);
  });

  it('splits a band into the response unit of each cell\'s aspect, the first unit standing for aspects without one', () => {
    const bands = [
      { lowerM: 3000, upperM: 4200, aspectClass: 'N' as const }, { lowerM: 3000, upperM: 4200, aspectClass: 'S' as const },
      { lowerM: 4200, upperM: 6000, aspectClass: 'E' as const },
    ];
    const aspects = [0, 0, 2, 1, 3, 1, 1, 0];
    expect([...decodeUnitRuns(encodeUnitRuns(cells(z, aspects), 4, 2, bands), 4)]).toEqual([-1, 0, 1, 2, 2, 2, 0, -1]);
  });
});
