/**
 * What geodata checks report. Errors stop the work (`GeodataError`, thrown); notices are kept
 * beside the result so the user can read them before accepting it. Both carry the input they are
 * about (`field`: 'dem', 'catchmentOutline', 'glacierOutline', 'debrisOutline', 'debrisThickness',
 * 'bandWidthM', 'snowCover', 'elevationChange', …) and a message in a GIS user's words.
 */
export type GeodataErrorCode =
  | 'no_crs'
  | 'unsupported_crs'
  | 'wrong_crs'
  | 'not_a_geotiff'
  | 'truncated_file'
  | 'too_large'
  | 'unsupported_raster'
  | 'bad_geometry'
  | 'self_intersection'
  | 'empty_outline'
  | 'outside_dem'
  | 'dem_in_feet'
  | 'too_much_nodata'
  | 'dem_too_coarse'
  | 'bad_option'
  | 'bad_archive'
  | 'no_overlap';

export class GeodataError extends Error {
  constructor(
    readonly code: GeodataErrorCode,
    message: string,
    readonly field: string,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'GeodataError';
  }
}

export interface GeodataNotice {
  code: string;
  field: string;
  message: string;
}

/** Formats a share as a percentage for messages: 0.1234 → "12.3 %", tiny non-zero shares stay visible. */
export function percent(share: number): string {
  if (share > 0 && share < 0.001) return '< 0.1 %';
  return `${(share * 100).toFixed(1)} %`;
}
