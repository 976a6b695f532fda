/**
 * Colour ramps of the catchment map: elevation from green lowlands to pale summits (the
 * hypsometric tints of relief maps, common practice) and added melt from pale yellow to dark red
 * (a sequential ramp in the manner of ColorBrewer's YlOrRd, common practice), both readable
 * over the hillshade.
 */
const ELEVATION_STOPS = ['#4f7942', '#a3b86c', '#e6d88f', '#c79a5b', '#9c6b4e', '#e8e4de'];
const MELT_STOPS = ['#ffffcc', '#fed976', '#fd8d3c', '#e31a1c', '#800026'];

function hex(colour: string): [number, number, number] {
  return [1, 3, 5].map((i) => parseInt(colour.slice(i, i + 2), 16)) as [number, number, number];
}

/** The colour at t (0…1) along evenly spaced stops, as [r, g, b] 0–255. */
function along(stops: readonly string[], t: number): [number, number, number] {
  const x = Math.max(0, Math.min(1, t)) * (stops.length - 1);
  const i = Math.min(stops.length - 2, Math.floor(x));
  const a = hex(stops[i]);
  const b = hex(stops[i + 1]);
  return a.map((v, k) => Math.round(v + (b[k] - v) * (x - i))) as [number, number, number];
}

export const elevationColour = (t: number): [number, number, number] => along(ELEVATION_STOPS, t);
export const meltColour = (t: number): [number, number, number] => along(MELT_STOPS, t);
export const cssColour = ([r, g, b]: [number, number, number]): string => `rgb(${r}, ${g}, ${b})`;
