import { rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import multer from 'multer';
import { AppError, badRequest } from '../errors';
import { GEODATA_LIMITS } from '../../shared/geodata/limits';
import { RASTER_LAYERS, type GeodataLayer } from '../../shared/schemas/geodata';
import { OUTLINE_BATCH_LAYERS } from '../../shared/schemas/outline-batches';

const RASTER_NAMES = /\.(tif|tiff)$/i;
const OUTLINE_NAMES = /\.(geojson|json|zip)$/i;
const mb = (bytes: number) => `${bytes / 1024 ** 2} MB`;

/** A multipart file field of a geodata upload: a raster (GeoTIFF) or an outline file (GeoJSON or a zipped shapefile). */
interface FileField {
  name: string;
  raster: boolean;
}

/**
 * Geodata files streamed to the temporary folder rather than held in memory, up to the stated
 * limit of their kind: rasters (GeoTIFF, .tif) up to GEODATA_LIMITS.rasterFileBytes, outlines
 * (GeoJSON or a zipped shapefile) up to outlineFileBytes (checked again by the outline reader
 * where one request carries both kinds). The files are removed when the response ends, stored or
 * not. Refusals: too large → 413, wrong kind of file → 415, a required field without a file → 400.
 */
function diskUpload(fieldsOf: (req: Request) => { fields: FileField[]; required: string; limitLabel: string }): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => {
    const { fields, required, limitLabel } = fieldsOf(req);
    const limit = fields.some((f) => f.raster) ? GEODATA_LIMITS.rasterFileBytes : GEODATA_LIMITS.outlineFileBytes;
    const upload = multer({
      storage: multer.diskStorage({ destination: tmpdir() }),
      limits: { fileSize: limit, files: fields.length, fields: 20, fieldSize: 10_000 },
      fileFilter: (_req, file, accept) => {
        const raster = fields.find((f) => f.name === file.fieldname)?.raster ?? false;
        if (!(raster ? RASTER_NAMES : OUTLINE_NAMES).test(file.originalname)) {
          accept(new AppError(415, 'unsupported_file', raster
            ? `"${file.originalname}" is not a GeoTIFF: upload rasters as .tif files.`
            : `"${file.originalname}" is neither GeoJSON (.geojson, .json) nor a zipped shapefile (.zip).`, file.fieldname));
          return;
        }
        accept(null, true);
      },
    }).fields(fields.map((f) => ({ name: f.name, maxCount: 1 })));
    const uploaded = () => Object.values((req.files ?? {}) as Record<string, Express.Multer.File[]>).flat();
    res.on('close', () => {
      void Promise.all(uploaded().map((f) => rm(f.path, { force: true })));
    });
    upload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, 'too_large', `The file is larger than the ${mb(limit)} accepted ${limitLabel}; nothing was stored.`, err.field ?? 'file'));
        return next(badRequest(`The upload could not be read (${err.message}).`, 'file'));
      }
      if (err) return next(err);
      if (!uploaded().some((f) => f.fieldname === required)) return next(badRequest('Choose a file to upload.', required));
      next();
    });
  };
}

/** A geodata file of a catchment in the multipart field `file` (and `after`, the second DEM of an elevation change), of the kind its layer takes. */
export function geodataUpload(): RequestHandler {
  return diskUpload((req) => {
    const raster = RASTER_LAYERS.includes(req.params.layer as GeodataLayer);
    return { fields: [{ name: 'file', raster }, { name: 'after', raster }], required: 'file', limitLabel: 'for this layer' };
  });
}

/** The uploaded files of a request that passed `geodataUpload`. */
export function uploadedFiles(req: Request): { file: Express.Multer.File; after?: Express.Multer.File } {
  const files = req.files as Record<string, Express.Multer.File[]>;
  return { file: files.file[0], after: files.after?.[0] };
}

/** Many catchments over one DEM: the DEM (`dem`), the catchment outlines (`catchmentOutline`), and the region's `glacierOutline` and `debrisOutline`. */
export function outlineBatchUpload(): RequestHandler {
  const fields = OUTLINE_BATCH_LAYERS.map((name) => ({ name, raster: name === 'dem' }));
  return diskUpload(() => ({ fields, required: 'dem', limitLabel: `for a DEM (outline files up to ${mb(GEODATA_LIMITS.outlineFileBytes)})` }));
}

/** The files of a request that passed `outlineBatchUpload`, by field. */
export function uploadedByField(req: Request): Partial<Record<string, Express.Multer.File>> {
  return Object.fromEntries(Object.entries((req.files ?? {}) as Record<string, Express.Multer.File[]>).map(([name, files]) => [name, files[0]]));
}
