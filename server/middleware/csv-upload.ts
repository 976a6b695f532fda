import type { NextFunction, Request, RequestHandler, Response } from 'express';
import multer from 'multer';
import { AppError, badRequest } from '../errors';
import { MAX_UPLOAD_BYTES, MAX_UPLOAD_LABEL, notCsv } from '../services/catchments/csv/read-table';

const ALLOWED_EXTENSIONS = /\.(csv|txt)$/i;
const ALLOWED_TYPES = new Set(['text/csv', 'text/plain', 'application/csv', 'application/vnd.ms-excel', 'text/x-csv', 'application/octet-stream', '']);

/**
 * One CSV file in the multipart field `file`, held in memory (so no temporary files are left
 * behind) up to MAX_UPLOAD_BYTES. Refusals: too large → 413, not .csv/.txt or a non-text type → 415,
 * a malformed multipart body or no file → 400. The content itself is checked for binary data when it is read.
 */
export function csvUpload(): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 20, fieldSize: 10_000 },
    fileFilter: (_req, file, accept) => {
      if (!ALLOWED_EXTENSIONS.test(file.originalname) || !ALLOWED_TYPES.has(file.mimetype)) {
        accept(notCsv(`Only CSV files (.csv or .txt, comma, semicolon or tab separated) can be uploaded; "${file.originalname}" is not one.`));
        return;
      }
      accept(null, true);
    },
  }).single('file');
  return (req: Request, res: Response, next: NextFunction) => {
    upload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, 'too_large', `The file is larger than the ${MAX_UPLOAD_LABEL} limit; nothing was stored.`, 'file'));
        return next(badRequest(`The upload could not be read (${err.message}).`, 'file'));
      }
      if (err instanceof AppError) return next(err);
      // Anything else is the multipart body itself (a truncated part, no closing boundary, a bad
      // or oversized part header, the wrong boundary): the request is malformed, not our failure.
      if (err) return next(badRequest('The upload could not be read: the request is not a complete multipart form. Choose the file again and retry.', 'file'));
      if (!req.file) return next(badRequest('Choose a CSV file to upload.', 'file'));
      next();
    });
  };
}
