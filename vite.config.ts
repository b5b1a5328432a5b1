import { configDefaults, defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import path from 'node:path';
import fs from 'node:fs';
import crypto from 'node:crypto';
import type { Plugin } from 'vite';

const root = import.meta.dirname;
const alias = {
  '@shared': path.join(root, 'shared'),
  '@': path.join(root, 'src'),
};

/**
 * Writes dist/sw.js from scripts/sw/service-worker.js with the built shell to precache: index.html and every
 * script, stylesheet and font of the build (source maps and the manifest left out). Its version is a hash of
 * that list, so each build's worker replaces the last one's shell.
 */
function offlineShell(): Plugin {
  return {
    name: 'tillwell-offline-shell',
    apply: 'build',
    generateBundle(_options, bundle) {
      const files = ['/index.html', ...Object.keys(bundle).filter((f) => /\.(js|css|woff2)$/.test(f)).map((f) => `/${f}`)].sort();
      const version = crypto.createHash('sha256').update(files.join('\n')).digest('hex').slice(0, 12);
      const source = fs
        .readFileSync(path.join(root, 'scripts', 'sw', 'service-worker.js'), 'utf8')
        .replace('self.__SHELL_FILES__', JSON.stringify(files))
        .replace('self.__SHELL_VERSION__', JSON.stringify(version));
      this.emitFile({ type: 'asset', fileName: 'sw.js', source });
    },
  };
}

// One config for the client build, the dev server and the test runner.
export default defineConfig({
  plugins: [react(), tailwindcss(), offlineShell()],
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
