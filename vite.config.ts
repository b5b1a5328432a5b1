import { defineConfig } from 'vitest/config';
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
    rollupOptions: { treeshake: { manualPureFunctions: ['z'] } },
  },
  server: {
    host: '127.0.0.1',
    port: Number(process.env.VITE_PORT ?? 5173),
    strictPort: true,
    proxy: { '/api': `http://127.0.0.1:${process.env.PORT ?? 3000}` },
  },
  test: {
    reporters: ['default', ['json', { outputFile: 'test-results/vitest.json' }]],
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
          environment: 'node',
          globalSetup: ['tests/setup/global-setup.ts'],
          setupFiles: ['tests/setup/per-file.ts'],
          fileParallelism: false,
          execArgv: ['--import', 'tsx'],
          testTimeout: 30_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
