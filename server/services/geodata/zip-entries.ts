import yauzl from 'yauzl';
import { GeodataError } from '../../../shared/geodata/errors';
import { GEODATA_LIMITS } from '../../../shared/geodata/limits';

const MAX_ENTRIES = 2000;

/**
 * Reads the wanted files out of a zip archive into memory. Sizes are checked against the limit
 * from the archive's own directory before anything is unpacked (so a header claiming gigabytes
 * is refused at once), and yauzl checks while inflating that no entry grows past what it claims.
 * `want` picks entries by name; nested folders are fine, names are compared case-insensitively.
 */
export function readZipEntries(path: string, want: (name: string) => boolean, field: string): Promise<Map<string, Buffer>> {
  return new Promise((resolve, reject) => {
    const fail = (message: string, code: 'bad_archive' | 'too_large' = 'bad_archive') => reject(new GeodataError(code, message, field));
    yauzl.open(path, { lazyEntries: true, validateEntrySizes: true, strictFileNames: false }, (openError, zip) => {
      if (openError || !zip) return fail('The zip archive could not be opened: it is damaged or not a zip file.');
      const found = new Map<string, Buffer>();
      let entries = 0;
      zip.on('error', () => fail('The zip archive is damaged: an entry could not be read.'));
      zip.on('end', () => resolve(found));
      zip.on('entry', (entry: yauzl.Entry) => {
        entries++;
        if (entries > MAX_ENTRIES) { zip.close(); return fail(`The zip archive holds more than ${MAX_ENTRIES} files.`); }
        const name = entry.fileName;
        if (name.endsWith('/') || !want(name)) return zip.readEntry();
        if (entry.uncompressedSize > GEODATA_LIMITS.unzippedEntryBytes) {
          zip.close();
          return fail(`${baseName(name)} in the zip claims ${(entry.uncompressedSize / 1024 ** 2).toFixed(0)} MB unpacked, over the ${(GEODATA_LIMITS.unzippedEntryBytes / 1024 ** 2).toFixed(0)} MB limit.`, 'too_large');
        }
        zip.openReadStream(entry, (streamError, stream) => {
          if (streamError || !stream) { zip.close(); return fail(`${baseName(name)} in the zip could not be unpacked: the archive is damaged.`); }
          const chunks: Buffer[] = [];
          stream.on('data', (c: Buffer) => chunks.push(c));
          stream.on('error', () => { zip.close(); fail(`${baseName(name)} in the zip could not be unpacked: it is cut short or its size does not match the archive's directory.`); });
          stream.on('end', () => { found.set(name, Buffer.concat(chunks)); zip.readEntry(); });
        });
      });
      zip.readEntry();
    });
  });
}

export const baseName = (name: string) => name.split('/').pop() ?? name;
