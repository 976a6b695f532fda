import { defineConfig } from 'vitest/config';
import vue from '@vitejs/plugin-vue';
import { quasar } from '@quasar/vite-plugin';
import { fileURLToPath } from 'node:url';

const alias = {
  '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
  src: fileURLToPath(new URL('./src', import.meta.url)),
};

/**
 * Three projects: `unit` (pure code, components in happy-dom), `api` (HTTP + the
 * test MariaDB database, run one file at a time), `e2e` (Chromium against a served build).
 */
export default defineConfig({
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          include: ['shared/**/*.test.ts', 'server/**/*.test.ts', 'stripe-fake/**/*.test.ts', 'seeds/**/*.test.ts', 'scripts/**/*.test.ts'],
          environment: 'node',
          // Whole seasons, PDF layout and DEM derivations take seconds, more while the suite's projects and
          // worker processes share the machine's cores: a guard against hangs, not a speed check.
          testTimeout: 30_000,
        },
      },
      {
        plugins: [vue(), quasar()],
        resolve: { alias },
        test: {
          name: 'component',
          include: ['src/**/*.test.ts'],
          environment: 'happy-dom',
          setupFiles: ['tests/setup/component-setup.ts'],
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          setupFiles: ['tests/setup/api-log.ts'],
          globalSetup: ['tests/setup/worker-process.ts'],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/setup/worker-process.ts'],
          fileParallelism: false,
          testTimeout: 90_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
