import type { CatchmentZones } from './derive';
import { GeodataError, percent, type GeodataNotice } from './errors';
import type { Raster } from './raster';
import { sampleAtZones } from './zone-sampling';

/** Which cell values of a classified snow map mean what (chosen by the user at upload). */
export interface SnowClassCodes {
  snow: number[];
  noSnow: number[];
  cloud: number[];
  nodata: number[];
}

export interface SnowCoverRow {
  band: number;
  lowerM: number;
  upperM: number;
  /** Snow-covered share of the cloud-free, valid part of the band (0–1); null when none of it is visible. */
  snowCoveredFraction: number | null;
  /** Share of the band seen as snow or no snow (cloud-free and with data). */
  validFraction: number;
  cloudFraction: number;
}

/**
 * Snow-covered fraction per band from one classified snow map: every catchment cell takes the
 * class of the map cell under its centre (nearest neighbour, as class maps must be resampled);
 * cloud, nodata and codes not assigned to any class are masked, and the snow-covered fraction is
 * snow / (snow + no snow) over what remains, area-weighted. The valid fraction says how much of
 * each band that is, so a calibration can weight or drop half-clouded dates.
 */
export function snowCoverByBand(map: Raster, codes: SnowClassCodes, zones: CatchmentZones, field = 'snowCover'): { rows: SnowCoverRow[]; catchment: Omit<SnowCoverRow, 'band' | 'lowerM' | 'upperM'>; notices: GeodataNotice[] } {
  checkCodes(codes);
  const classOf = new Map<number, number>();
  codes.snow.forEach((c) => classOf.set(c, 0));
  codes.noSnow.forEach((c) => classOf.set(c, 1));
  codes.cloud.forEach((c) => classOf.set(c, 2));
  codes.nodata.forEach((c) => classOf.set(c, 3));
  const values = sampleAtZones(zones, map, 'nearest');
  const bandCount = zones.bandEdgesM.length - 1;
  // per band: snow, no snow, cloud, nodata, unassigned areas
  const sums = new Float64Array(bandCount * 5);
  const unknownCodes = new Set<number>();
  const { width } = zones.grid;
  for (let i = 0; i < values.length; i++) {
    const b = zones.band[i];
    if (b < 0) continue;
    const v = values[i];
    let k = v === v ? classOf.get(v) : 3;
    if (k === undefined) { k = 4; if (unknownCodes.size < 5) unknownCodes.add(v); }
    sums[b * 5 + k] += zones.cellAreaByColumn[i % width];
  }
  const row = (s: ArrayLike<number>) => {
    const total = s[0] + s[1] + s[2] + s[3] + s[4];
    const seen = s[0] + s[1];
    return { snowCoveredFraction: seen > 0 ? s[0] / seen : null, validFraction: total > 0 ? seen / total : 0, cloudFraction: total > 0 ? s[2] / total : 0 };
  };
  const rows = Array.from({ length: bandCount }, (_, b) => ({ band: b, lowerM: zones.bandEdgesM[b], upperM: zones.bandEdgesM[b + 1], ...row(sums.subarray(b * 5, b * 5 + 5)) }));
  const whole = [0, 1, 2, 3, 4].map((k) => rows.reduce((acc, _, b) => acc + sums[b * 5 + k], 0));
  const catchment = row(whole);
  const notices: GeodataNotice[] = [];
  const total = whole.reduce((a, b) => a + b, 0);
  if (whole[3] >= total * 0.999) {
    throw new GeodataError('no_overlap', 'The snow-cover map does not cover the catchment (every catchment cell falls outside it or on nodata). Check its coordinate system and extent.', field);
  }
  if (whole[4] > 0) {
    notices.push({ code: 'unassigned_class', field, message: `${percent(whole[4] / total)} of the catchment has class codes not assigned to snow, no snow, cloud or nodata (e.g. ${[...unknownCodes].join(', ')}); they are treated as nodata.` });
  }
  return { rows, catchment, notices };
}

function checkCodes(codes: SnowClassCodes): void {
  const all = [...codes.snow, ...codes.noSnow, ...codes.cloud, ...codes.nodata];
  if (codes.snow.length === 0 || codes.noSnow.length === 0) throw new GeodataError('bad_option', 'Give at least one class code for snow and one for no snow.', 'classCodes');
  if (all.some((c) => !Number.isFinite(c))) throw new GeodataError('bad_option', 'Class codes must be numbers.', 'classCodes');
  const repeated = all.find((c, i) => all.indexOf(c) !== i);
  if (repeated !== undefined) throw new GeodataError('bad_option', `Class code ${repeated} is given for more than one class.`, 'classCodes');
}
