import { gzipSync } from 'node:zlib';
import { STAKE_VARIABLE } from '../../../../shared/schemas/dataset-variables';
import type { StakeReading } from '../../../../shared/schemas/stakes';
import { decodeCsvText } from './read-table';
import { readSeriesFile, type ReadSeries, type SeriesFileOptions } from './series-file';
import { readStakeFile } from './stake-file';

/** What a previewed upload keeps until it is confirmed: the preview and the values to store. */
export interface ReadUpload {
  preview: ReadSeries['preview'];
  times: string[];
  values: number[];
  /** Stake readings have their own columns; every other variable is a time series. */
  stakes?: StakeReading[];
}

/** Decodes, reads and checks an uploaded series or stake file (throws AppErrors for files that cannot be read at all). */
export function readUpload(buffer: Buffer, fields: SeriesFileOptions): ReadUpload {
  const text = decodeCsvText(buffer);
  if (fields.variable !== STAKE_VARIABLE) return readSeriesFile(text, fields);
  const read = readStakeFile(text, fields.unit);
  return { preview: read.preview, times: read.times, values: read.values, stakes: read.readings };
}

/** The read upload as stored with the pending upload: gzip-compressed JSON, so confirming never reads the file again. */
export const packUpload = (read: ReadUpload): Buffer => gzipSync(JSON.stringify(read), { level: 1 });
