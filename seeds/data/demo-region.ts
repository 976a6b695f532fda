import { DEMO_BANDS, DEMO_CATCHMENT } from './demo-catchment';

/**
 * More invented sub-catchments of the invented Dhenar valley, beside the Upper Sarvel: each a
 * slice of the Sarvel's band table (a smaller glacier starting higher), with its area scaled.
 * They share the Sarvel's station record, as sub-catchments of one valley do. Nothing is measured.
 */
const SUB_CATCHMENTS = [
  { name: 'Kolvi side valley', from: 5, to: 16, areaFactor: 0.35, latitudeDeg: 33.91, longitudeDeg: 79.26 },
  { name: 'Tashgar glacier catchment', from: 7, to: 19, areaFactor: 0.55, latitudeDeg: 33.98, longitudeDeg: 79.35 },
  { name: 'Munel cirques', from: 10, to: 18, areaFactor: 0.2, latitudeDeg: 33.88, longitudeDeg: 79.38 },
  { name: 'Orvan headwater', from: 8, to: 21, areaFactor: 0.45, latitudeDeg: 34.02, longitudeDeg: 79.29 },
] as const;

/** The sub-catchments as rows of a catchment table (one row per band), as a consultant would upload them. */
export function demoRegionTable(): Record<string, unknown>[] {
  return SUB_CATCHMENTS.flatMap((c) => DEMO_BANDS.slice(c.from, c.to).map((b) => ({
    name: c.name, latitudeDeg: c.latitudeDeg, longitudeDeg: c.longitudeDeg, timeZone: DEMO_CATCHMENT.timeZone,
    stationName: DEMO_CATCHMENT.stationName, stationElevationM: DEMO_CATCHMENT.stationElevationM,
    ...b, areaKm2: Math.round(b.areaKm2 * c.areaFactor * 100) / 100,
  })));
}

export const DEMO_REGION_NAMES: readonly string[] = SUB_CATCHMENTS.map((c) => c.name);

export const DEMO_STUDY = {
  name: 'Dhenar valley darkening',
  description: 'Invented demo study: the five glacier catchments of the Dhenar valley under valley soot and under spring dust with 2 °C warming, one melt season.',
} as const;
