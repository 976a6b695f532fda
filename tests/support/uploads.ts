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
}

/** Posts a series file with its provenance fields to the preview step. */
export function uploadSeries(agent: TestAgent, catchmentId: number, content: Buffer, options: UploadOptions = {}): Test {
  const request = agent
    .post(`/api/catchments/${catchmentId}/uploads`)
    .field('variable', options.variable ?? 'temperature')
    .field('timeZone', 'Asia/Kolkata')
    .field('source', 'Test camp logger')
    .field('accuracy', '±0.2 °C');
  if (options.unit) request.field('unit', options.unit);
  if (options.timeStep) request.field('timeStep', options.timeStep);
  return request.attach('file', content, { filename: options.fileName ?? 'series.csv', contentType: options.contentType ?? 'text/csv' });
}
