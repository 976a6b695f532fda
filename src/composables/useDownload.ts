/** Saving files from the browser (CSV through the shared writer, which escapes formula-like cells). */
export { csvDocument as toCsv, withByteOrderMark } from '@shared/csv/csv-writing';

export function downloadUrl(url: string, fileName: string): void {
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  link.click();
}

export function downloadText(text: string, fileName: string, type: string): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  downloadUrl(url, fileName);
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
