import { defineConfig } from 'vite';
import vue from '@vitejs/plugin-vue';
import { quasar, transformAssetUrls } from '@quasar/vite-plugin';
import { fileURLToPath } from 'node:url';
import { precompressAssets } from './scripts/build/precompress-assets';
import { staticImportsOf } from './scripts/build/static-imports';

const apiPort = process.env.PORT ?? '3000';
const chartLibraries = /[\\/]node_modules[\\/](echarts|zrender|vue-echarts|tslib)[\\/]/;
/** The drawn chart (src/components/BaseChart.vue loads it after the page): what it imports statically is the chart code every chart needs. */
const chartCanvas = fileURLToPath(new URL('./src/components/BaseChartCanvas.vue', import.meta.url));

export default defineConfig({
  plugins: [
    vue({ template: { transformAssetUrls } }),
    quasar({ sassVariables: fileURLToPath(new URL('./src/css/quasar.variables.scss', import.meta.url)) }),
    precompressAssets(),
  ],
  resolve: {
    alias: {
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
      src: fileURLToPath(new URL('./src', import.meta.url)),
    },
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false } },
  },
  build: {
    outDir: 'dist',
    sourcemap: false,
    chunkSizeWarningLimit: 900,
    rolldownOptions: {
      output: {
        // A cold load fetches few, larger files: fewer requests and headers, better compression.
        codeSplitting: {
          groups: [
            // Everything the first page needs (Vue, Quasar's core, router, stores, schemas, the API client) in one file.
            { name: 'app', tags: ['$initial'] },
            // What every chart draws with in one file; the parts only some charts use (src/boot/echarts.ts) stay apart.
            {
              name: (id, ctx) => (staticImportsOf(ctx, chartCanvas).has(id) ? 'echarts' : null),
              test: chartLibraries,
            },
          ],
        },
      },
    },
  },
});
