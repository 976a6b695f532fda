import type { CatchmentZones } from './derive';

/** An elevation range of a band table (response units of one band share it). */
export interface ElevationRange {
  lowerM: number;
  upperM: number;
}

/**
 * The zones of a catchment re-banded by the elevation ranges of a band table (which may have been
 * typed by hand), so remote-sensing observations are reduced per band of the table in use: each
 * catchment cell goes to the range holding its elevation; cells below the lowest or above the
 * highest range go to the end ranges. Ranges must be sorted and contiguous (a band table's are).
 */
export function zonesForRanges(zones: CatchmentZones, ranges: readonly ElevationRange[]): CatchmentZones {
  const distinct = ranges.filter((r, i) => i === 0 || r.lowerM !== ranges[i - 1].lowerM || r.upperM !== ranges[i - 1].upperM);
  const edges = [distinct[0].lowerM, ...distinct.map((r) => r.upperM)];
  const band = new Int16Array(zones.band.length).fill(-1);
  for (let i = 0; i < band.length; i++) {
    if (zones.band[i] < 0) continue;
    const z = zones.elevation[i];
    let b = 0;
    while (b < distinct.length - 1 && z >= edges[b + 1]) b++;
    band[i] = b;
  }
  return { ...zones, band, bandEdgesM: edges };
}
