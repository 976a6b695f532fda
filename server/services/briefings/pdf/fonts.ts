import { fileURLToPath } from 'node:url';

/** Fonts shipped with the app (DejaVu Sans, Bitstream Vera licence: server/assets/fonts/LICENSE-DejaVu.txt). */
const fontPath = (file: string) => fileURLToPath(new URL(`../../../assets/fonts/${file}`, import.meta.url));

export const FONTS = {
  regular: { name: 'Body', file: fontPath('DejaVuSans.ttf') },
  bold: { name: 'Body-Bold', file: fontPath('DejaVuSans-Bold.ttf') },
} as const;

/** The family name charts are drawn with, mapped back onto the embedded fonts. */
export const CHART_FONT_FAMILY = 'DejaVu Sans';
