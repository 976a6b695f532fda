import { rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import multer from 'multer';
import { AppError, badRequest } from '../errors';
import { GEODATA_LIMITS } from '../services/geodata/limits';
import { RASTER_LAYERS, type GeodataLayer } from '../../shared/schemas/geodata';

const RASTER_NAMES = /\.(tif|tiff)$/i;
const OUTLINE_NAMES = /\.(geojson|json|zip)$/i;
const mb = (bytes: number) => `${bytes / 1024 ** 2} MB`;

/**
 * A geodata file in the multipart field `file` (and `after`, the second DEM of an elevation
 * change), streamed to the temporary folder rather than held in memory, up to the stated limit of
 * its kind: rasters (GeoTIFF, .tif) up to GEODATA_LIMITS.rasterFileBytes, outlines (GeoJSON or a
 * zipped shapefile) up to outlineFileBytes. The files are removed when the response ends, stored
 * or not. Refusals: too large → 413, wrong kind of file → 415, no file → 400.
 */
export function geodataUpload(): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => {
    const layer = req.params.layer as GeodataLayer;
    const raster = RASTER_LAYERS.includes(layer);
    const limit = raster ? GEODATA_LIMITS.rasterFileBytes : GEODATA_LIMITS.outlineFileBytes;
    const upload = multer({
      storage: multer.diskStorage({ destination: tmpdir() }),
      limits: { fileSize: limit, files: 2, fields: 20, fieldSize: 10_000 },
      fileFilter: (_req, file, accept) => {
        if (!(raster ? RASTER_NAMES : OUTLINE_NAMES).test(file.originalname)) {
          accept(new AppError(415, 'unsupported_file', raster
            ? `"${file.originalname}" is not a GeoTIFF: upload rasters as .tif files.`
            : `"${file.originalname}" is neither GeoJSON (.geojson, .json) nor a zipped shapefile (.zip).`, 'file'));
          return;
        }
        accept(null, true);
      },
    }).fields([{ name: 'file', maxCount: 1 }, { name: 'after', maxCount: 1 }]);
    const uploaded = () => Object.values((req.files ?? {}) as Record<string, Express.Multer.File[]>).flat();
    res.on('close', () => {
      void Promise.all(uploaded().map((f) => rm(f.path, { force: true })));
    });
    upload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, 'too_large', `The file is larger than the ${mb(limit)} accepted for this layer; nothing was stored.`, 'file'));
        return next(badRequest(`The upload could not be read (${err.message}).`, 'file'));
      }
      if (err) return next(err);
      if (!uploaded().some((f) => f.fieldname === 'file')) return next(badRequest('Choose a file to upload.', 'file'));
      next();
    });
  };
}

/** The uploaded files of a request that passed `geodataUpload`. */
export function uploadedFiles(req: Request): { file: Express.Multer.File; after?: Express.Multer.File } {
  const files = req.files as Record<string, Express.Multer.File[]>;
  return { file: files.file[0], after: files.after?.[0] };
}
