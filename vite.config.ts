import { fileURLToPath, URL } from 'node:url';
import { configDefaults, defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

/** Suites about SQLite itself (its connection set-up, file backups, crash safety of the file): not run on PostgreSQL. */
const sqliteOnly = ['tests/api/database.test.ts', 'tests/api/backup.test.ts', 'tests/api/crash.test.ts'];

const apiTarget = `http://127.0.0.1:${process.env.PORT ?? 3000}`;

export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: {
    alias: {
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
      '@': fileURLToPath(new URL('./src', import.meta.url)),
    },
  },
  server: {
    port: 5173,
    proxy: { '/api': apiTarget, '/auth': apiTarget },
  },
  build: { outDir: 'dist', sourcemap: false },
  test: {
    include: ['tests/**/*.test.ts'],
    // TEST_DATABASE=postgres (`npm run test:postgres`): the API suite against a throwaway PostgreSQL cluster.
    exclude: process.env.TEST_DATABASE === 'postgres' ? [...configDefaults.exclude, ...sqliteOnly] : configDefaults.exclude,
    environment: 'node',
    globalSetup: ['tests/setup/global-setup.ts'],
    setupFiles: ['tests/setup/worker-setup.ts'],
    testTimeout: 30_000,
    hookTimeout: 60_000,
  },
});
