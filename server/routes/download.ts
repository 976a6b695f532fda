import type { Response } from 'express';
import { withByteOrderMark } from '../../shared/csv/csv-writing';
import type { DownloadFile } from '../services/download-file';

/**
 * Sends a file as an attachment, never cached by shared caches (it is tenant data). CSV text gets
 * a byte-order mark so spreadsheet programs read the units (°C, m³, km²) as UTF-8.
 */
export function sendDownload(res: Response, file: DownloadFile): void {
  res.setHeader('Content-Type', file.contentType);
  res.setHeader('Content-Disposition', `attachment; filename="${file.fileName.replace(/["\\\r\n]/g, '_')}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.send(file.contentType.startsWith('text/csv') && typeof file.body === 'string' ? withByteOrderMark(file.body) : file.body);
}
