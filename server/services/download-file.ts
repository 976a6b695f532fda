/** A file a route sends as a download (see server/routes/download.ts). */
export interface DownloadFile {
  fileName: string;
  contentType: string;
  body: Buffer | string;
}

/** A CSV download; the byte-order mark is added when it is sent. */
export function csvFile(fileName: string, text: string): DownloadFile {
  return { fileName, contentType: 'text/csv; charset=utf-8', body: text };
}
