import type { CatchmentInput } from './site';

/**
 * The rows of a band table that make up an elevation range (one band, or its response units by
 * aspect), with the weight each carries: its share of the range's area, or of its glacier area.
 */
export function unitsOfRange(bands: CatchmentInput['bands'], lowerM: number, upperM: number, by: 'area' | 'glacier'): { index: number; weight: number }[] {
  const rows = bands.map((b, index) => ({ b, index })).filter(({ b }) => b.lowerM === lowerM && b.upperM === upperM);
  const size = (b: CatchmentInput['bands'][number]) => b.areaKm2 * (by === 'glacier' ? b.glacierFraction : 1);
  const total = rows.reduce((s, { b }) => s + size(b), 0);
  return total > 0 ? rows.map(({ b, index }) => ({ index, weight: size(b) / total })) : [];
}
