import { readdirSync } from 'node:fs';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../support/test-app';

// The built client (npm test builds it before the suites) as a browser receives it.
const t = createTestApp({ CLIENT_DIR: 'dist' });
afterAll(() => t.close());
const script = readdirSync('dist/assets').find((f) => f.endsWith('.js') && f.startsWith('index-'))!;

describe('delivery of the client', () => {
  it('sends hashed assets compressed (brotli or gzip, as asked) with a year of immutable cache', async () => {
    for (const [asked, sent] of [['br, gzip', 'br'], ['gzip', 'gzip']] as const) {
      const res = await request(t.app).get(`/assets/${script}`).set('Accept-Encoding', asked);
      expect(res.status).toBe(200);
      expect(res.headers['content-encoding']).toBe(sent);
      expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    }
  });

  it('revalidates the page itself on every load, at any client route', async () => {
    for (const path of ['/', '/catchments/12/results']) {
      const res = await request(t.app).get(path).set('Accept-Encoding', 'gzip');
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toMatch(/text\/html/);
      expect(res.headers['cache-control']).toBe('no-cache');
    }
  });

  it('compresses JSON answers of the API and keeps them out of caches', async () => {
    const res = await request(t.app).get('/api/health').set('Accept-Encoding', 'gzip');
    expect(res.headers['cache-control']).toBe('no-store');
    // Small answers are sent as they are (compression starts at 1 kB); the header says a cache must vary by encoding.
    expect(res.headers.vary ?? '').toMatch(/Accept-Encoding/i);
  });
});
