/**
 * Series styles that stay apart without relying on hue: every series differs in lightness, and
 * lines also in dash pattern and symbol, so charts read in grey print and for colour-blind readers.
 * Colours from the Okabe–Ito palette (common practice for colour-blind-safe charts).
 */
export const SERIES_COLOURS = ['#000000', '#0072B2', '#E69F00', '#009E73', '#CC79A7', '#56B4E9', '#D55E00'];
const DASHES = ['solid', 'dashed', 'dotted', [8, 4, 2, 4], [2, 6], [12, 4]] as const;
const SYMBOLS = ['circle', 'rect', 'triangle', 'diamond', 'pin', 'arrow'];

export function lineStyle(index: number, reference = false) {
  const colour = reference ? '#555555' : SERIES_COLOURS[(index % (SERIES_COLOURS.length - 1)) + 1];
  return {
    color: colour,
    symbol: SYMBOLS[index % SYMBOLS.length],
    lineStyle: { color: colour, width: reference ? 2.5 : 2, type: reference ? ('solid' as const) : DASHES[(index + 1) % DASHES.length] },
  };
}

/** Surfaces from light to dark, so stacked bars read by lightness as well as colour. */
export const SOURCE_STYLES = {
  snow: { label: 'Snow', colour: '#a6cee3' },
  ice: { label: 'Clean ice', colour: '#1f78b4' },
  debrisIce: { label: 'Debris-covered ice', colour: '#5c3a1e' },
  rain: { label: 'Rain', colour: '#b2b2b2' },
} as const;
