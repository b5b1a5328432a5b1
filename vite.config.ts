import { configDefaults, defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import path from 'node:path';

const root = import.meta.dirname;
const alias = {
  '@shared': path.join(root, 'shared'),
  '@': path.join(root, 'src'),
};

// One config for the client build, the dev server and the test runner.
export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: { alias },
  build: {
    outDir: 'dist',
    sourcemap: true,
    manifest: true,
    // Every browser the product supports preloads modules natively (Chrome 66, Firefox 115, Safari 17):
    // no polyfill in the first page's script.
    modulePreload: { polyfill: false },
    rollupOptions: { treeshake: { manualPureFunctions: ['z'] } },
  },
  server: {
    host: '127.0.0.1',
    port: Number(process.env.VITE_PORT ?? 5173),
    strictPort: true,
    proxy: { '/api': `http://127.0.0.1:${process.env.PORT ?? 3000}` },
  },
  test: {
    // `npm run test:faults` writes its own report (VITEST_JSON), so it never overwrites the full run's.
    reporters: ['default', ['json', { outputFile: process.env.VITEST_JSON ?? 'test-results/vitest.json' }]],
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          include: ['shared/**/*.test.ts', 'fake-mail/**/*.test.ts', 'server/**/*.test.ts', 'src/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          include: ['tests/**/*.test.ts'],
          exclude: [...configDefaults.exclude, 'tests/faults/**'],
          environment: 'node',
          globalSetup: ['tests/setup/global-setup.ts'],
          setupFiles: ['tests/setup/per-file.ts'],
          fileParallelism: false,
          execArgv: ['--import', 'tsx'],
          testTimeout: 30_000,
          hookTimeout: 120_000,
        },
      },
      {
        resolve: { alias },
        test: {
          // Real server processes (started, killed, restarted) on the throwaway cluster: after the
          // other projects (groupOrder), never beside the integration files that truncate the database.
          name: 'faults',
          include: ['tests/faults/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/setup/global-setup.ts'],
          setupFiles: ['tests/setup/per-file.ts'],
          fileParallelism: false,
          execArgv: ['--import', 'tsx'],
          testTimeout: 120_000,
          hookTimeout: 200_000,
          sequence: { groupOrder: 1 },
        },
      },
    ],
  },
});
