import { readdir, readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { brotliCompress, constants, gzip } from 'node:zlib';
import { promisify } from 'node:util';
import type { Plugin } from 'vite';

const brotli = promisify(brotliCompress);
const gzipped = promisify(gzip);

/** Text assets worth compressing (fonts in woff2 and pictures in png are compressed already). */
export const COMPRESSIBLE = /\.(js|css|svg|json|ttf|eot|woff|txt|map)$/;
/** Below this a compressed copy saves less than its headers cost. */
const MIN_BYTES = 1024;

/**
 * Writes a brotli (`.br`, quality 11) and a gzip (`.gz`, level 9) copy beside each built text
 * asset, once at build time, at levels too slow to use per request; the server sends the copy the
 * browser accepts (server/middleware/client-assets.ts). Copies that would not be smaller are not written.
 */
export function precompressAssets(): Plugin {
  let outDir = 'dist';
  return {
    name: 'tarnish-precompress-assets',
    apply: 'build',
    configResolved(config) {
      outDir = path.resolve(config.root, config.build.outDir, config.build.assetsDir);
    },
    async writeBundle() {
      const names = (await readdir(outDir)).filter((n) => COMPRESSIBLE.test(n));
      await Promise.all(names.map(async (name) => {
        const file = path.join(outDir, name);
        const data = await readFile(file);
        if (data.length < MIN_BYTES) return;
        const [br, gz] = await Promise.all([
          brotli(data, { params: { [constants.BROTLI_PARAM_QUALITY]: constants.BROTLI_MAX_QUALITY, [constants.BROTLI_PARAM_SIZE_HINT]: data.length } }),
          gzipped(data, { level: constants.Z_BEST_COMPRESSION }),
        ]);
        if (br.length < data.length) await writeFile(`${file}.br`, br);
        if (gz.length < data.length) await writeFile(`${file}.gz`, gz);
      }));
    },
  };
}
