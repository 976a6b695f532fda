import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Test } from 'supertest';
import type TestAgent from 'supertest/lib/agent';

const FIXTURES = path.join(import.meta.dirname, '..', 'fixtures', 'csv');

export function fixture(name: string): Buffer {
  return readFileSync(path.join(FIXTURES, name));
}

export interface UploadOptions {
  variable?: string;
  unit?: string;
  timeStep?: string;
  fileName?: string;
  contentType?: string;
  /** The station the series belongs to (default: the reference station for climate series). */
  stationId?: string;
  source?: string;
}

/** Posts a series file with its provenance fields to the preview step. */
export function uploadSeries(agent: TestAgent, catchmentId: number, content: Buffer, options: UploadOptions = {}): Test {
  const request = agent
    .post(`/api/catchments/${catchmentId}/uploads`)
    .field('variable', options.variable ?? 'temperature')
    .field('timeZone', 'Asia/Kolkata')
    .field('source', options.source ?? 'Test camp logger')
    .field('accuracy', '±0.2 °C');
  if (options.unit) request.field('unit', options.unit);
  if (options.stationId) request.field('stationId', options.stationId);
  if (options.timeStep) request.field('timeStep', options.timeStep);
  return request.attach('file', content, { filename: options.fileName ?? 'series.csv', contentType: options.contentType ?? 'text/csv' });
}

/** Previews and confirms a file (a fixture's name, or the content itself): the stored dataset (throws when either step fails). */
export async function storeSeries(agent: TestAgent, catchmentId: number, file: string | Buffer, options: UploadOptions = {}) {
  const [content, fileName] = typeof file === 'string' ? [fixture(file), file] : [file, options.fileName ?? 'series.csv'];
  const preview = await uploadSeries(agent, catchmentId, content, { fileName, ...options });
  if (preview.status !== 201) throw new Error(`preview of ${fileName} failed: ${preview.status} ${JSON.stringify(preview.body)}`);
  const confirmed = await agent.post(`/api/catchments/${catchmentId}/uploads/${preview.body.token}/confirm`);
  if (confirmed.status !== 201) throw new Error(`storing ${fileName} failed: ${confirmed.status} ${JSON.stringify(confirmed.body)}`);
  return confirmed.body.dataset;
}
