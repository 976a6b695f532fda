/** Size limits for geodata uploads, stated to the user beside each upload field. */
export const GEODATA_LIMITS = {
  /** Largest raster file accepted (bytes). */
  rasterFileBytes: 500 * 1024 * 1024,
  /** Largest raster in cells (e.g. 8000 × 8000). */
  rasterCells: 64_000_000,
  /** Largest outline file (GeoJSON or zipped shapefile), bytes. */
  outlineFileBytes: 50 * 1024 * 1024,
  /** Largest single file unpacked from a zip, bytes. */
  unzippedEntryBytes: 200 * 1024 * 1024,
} as const;
