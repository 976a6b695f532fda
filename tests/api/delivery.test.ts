import { readdirSync, statSync } from 'node:fs';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../support/test-app';

// The built client (npm test builds it before the suites) as a browser receives it.
const t = createTestApp({ CLIENT_DIR: 'dist' });
afterAll(() => t.close());
const script = readdirSync('dist/assets').find((f) => f.endsWith('.js') && f.startsWith('index-'))!;

describe('delivery of the client', () => {
  it('sends hashed assets as the copies compressed at build time (brotli or gzip, as asked) with a year of immutable cache', async () => {
    for (const [asked, sent, suffix] of [['gzip, deflate, br, zstd', 'br', '.br'], ['gzip', 'gzip', '.gz'], ['br;q=0, gzip', 'gzip', '.gz']] as const) {
      const res = await request(t.app).get(`/assets/${script}`).set('Accept-Encoding', asked);
      expect(res.status).toBe(200);
      expect(res.headers['content-encoding']).toBe(sent);
      expect(res.headers['content-type']).toMatch(/javascript/);
      expect(res.headers.vary).toMatch(/Accept-Encoding/);
      expect(Number(res.headers['content-length'])).toBe(statSync(`dist/assets/${script}${suffix}`).size);
      expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    }
  });

  it('sends an asset as it is to a browser that takes no compression, with a subresource\'s headers only', async () => {
    const res = await request(t.app).get(`/assets/${script}`).set('Accept-Encoding', 'identity');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(Number(res.headers['content-length'])).toBe(statSync(`dist/assets/${script}`).size);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['cross-origin-resource-policy']).toBe('same-origin');
    // The page's policies come with index.html.
    expect(res.headers['content-security-policy']).toBeUndefined();
  });

  it('answers 404 for an asset that is not there (a page of an older build asks for scripts that are gone), not with the page', async () => {
    for (const path of ['/assets/index-0000.js', '/assets/../index.html', '/assets/%2e%2e%2findex.html']) {
      const res = await request(t.app).get(path);
      expect(res.status).toBe(404);
      expect(res.headers['content-type'] ?? '').not.toMatch(/html/);
    }
  });

  it('revalidates the page itself on every load, at any client route, with its security headers', async () => {
    for (const path of ['/', '/catchments/12/results']) {
      const res = await request(t.app).get(path).set('Accept-Encoding', 'gzip');
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toMatch(/text\/html/);
      expect(res.headers['cache-control']).toBe('no-cache');
      expect(res.headers['content-security-policy']).toMatch(/script-src 'self'/);
    }
  });

  it('compresses JSON answers of the API and keeps them out of caches', async () => {
    const res = await request(t.app).get('/api/health').set('Accept-Encoding', 'gzip');
    expect(res.headers['cache-control']).toBe('no-store');
    // Small answers are sent as they are (compression starts at 1 kB); the header says a cache must vary by encoding.
    expect(res.headers.vary ?? '').toMatch(/Accept-Encoding/i);
  });
});
