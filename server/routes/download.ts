import type { Response } from 'express';
import type { DownloadFile } from '../services/download-file';

const BOM = '\uFEFF';

/**
 * Sends a file as an attachment, never cached by shared caches (it is tenant data). CSV text gets
 * a byte-order mark so spreadsheet programs read the units (°C, m³, km²) as UTF-8.
 */
export function sendDownload(res: Response, file: DownloadFile): void {
  const csv = file.contentType.startsWith('text/csv');
  res.setHeader('Content-Type', file.contentType);
  res.setHeader('Content-Disposition', `attachment; filename="${file.fileName.replace(/["\\\r\n]/g, '_')}"`);
  res.setHeader('Cache-Control', 'private, no-store');
  res.send(csv && typeof file.body === 'string' && !file.body.startsWith(BOM) ? `${BOM}${file.body}` : file.body);
}
