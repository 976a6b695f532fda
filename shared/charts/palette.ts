/**
 * The colours and line styles of every chart, on screen, in downloads and in briefing PDFs.
 * Series colours from the Okabe–Ito palette (common practice for colour-blind-safe charts); lines
 * also differ in dash pattern and symbol, so charts read in grey print too.
 */
export const SERIES_COLOURS = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9'] as const;
/** Totals, observations and other lines everything else is read against. */
export const INK = '#000000';
/** Reference lines (the baseline) and guides (1:1, clean-ice level). */
export const REFERENCE_GREY = '#555555';
export const GUIDE_GREY = '#9e9e9e';

/** Surfaces from light to dark, so stacked bars read by lightness as well as colour. */
export const SURFACE_STYLES = {
  iceFree: { label: 'Ice-free ground', colour: '#b8a98c' },
  snow: { label: 'Snow', colour: '#a6cee3' },
  ice: { label: 'Clean ice', colour: '#1f78b4' },
  debrisIce: { label: 'Debris-covered ice', colour: '#5c3a1e' },
  rain: { label: 'Rain', colour: '#b2b2b2' },
} as const;

/** The series colour for the i-th series, cycling through the palette. */
export const seriesColour = (index: number): string => SERIES_COLOURS[index % SERIES_COLOURS.length];

const DASHES = ['solid', 'dashed', 'dotted', [8, 4, 2, 4], [2, 6], [12, 4]] as const;
const SYMBOLS = ['circle', 'rect', 'triangle', 'diamond', 'pin', 'arrow'];

/** Style of the i-th line series; `reference` draws the baseline: solid, grey and a little heavier. */
export function lineStyle(index: number, reference = false) {
  const colour = reference ? REFERENCE_GREY : seriesColour(index);
  return {
    color: colour,
    symbol: SYMBOLS[index % SYMBOLS.length],
    lineStyle: { color: colour, width: reference ? 2.5 : 2, type: reference ? ('solid' as const) : DASHES[(index + 1) % DASHES.length] },
  };
}
