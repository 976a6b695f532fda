import type { DeriveRequest } from '@shared/schemas/geodata';

/** What the file pickers of geodata accept: GeoTIFF rasters, and outlines as GeoJSON or a zipped shapefile. */
export const RASTER_ACCEPT = '.tif,.tiff,image/tiff';
export const OUTLINE_ACCEPT = '.geojson,.json,.zip,application/geo+json,application/json,application/zip';

/** The DEM's vertical unit when its file does not say it. */
export const VERTICAL_UNIT_OPTIONS = [
  { value: '', label: 'as the file says (else metres)' }, { value: 'metre', label: 'metres' }, { value: 'foot', label: 'feet' }, { value: 'us-foot', label: 'US survey feet' },
];

export const SECTOR_OPTIONS = [
  { value: 36, label: 'Horizons in 36 directions' }, { value: 72, label: 'Horizons in 72 directions' },
  { value: 16, label: 'Horizons in 16 directions' }, { value: 0, label: 'No terrain shading' },
];

/** How bands are derived, as the form holds it (the debris thickness as typed: empty for none). */
export interface DeriveForm {
  bandWidthM: number;
  horizonSectors: number;
  splitByAspect: boolean;
  debrisText: string;
}

export const newDeriveForm = (): DeriveForm => ({ bandWidthM: 200, horizonSectors: 36, splitByAspect: false, debrisText: '' });

/** The form as the derive request (a decimal comma read as a point). */
export function deriveRequestOf(form: DeriveForm): DeriveRequest {
  const debris = form.debrisText.trim() === '' ? undefined : Number(form.debrisText.replace(',', '.'));
  return { bandWidthM: form.bandWidthM, horizonSectors: form.horizonSectors, splitByAspect: form.splitByAspect, ...(debris !== undefined ? { debrisThicknessM: debris } : {}) };
}
