import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';

// Three projects so each kind of test gets the environment it needs:
// unit (pure shared/ and machines/ code), component (jsdom), api (supertest against PostgreSQL),
// e2e (the built app in Debian's Chromium through playwright-core).
export default defineConfig({
  plugins: [react()],
  test: {
    globals: true,
    projects: [
      {
        extends: true,
        test: { name: 'unit', environment: 'node', include: ['tests/unit/**/*.test.ts'] },
      },
      {
        extends: true,
        test: {
          name: 'component',
          environment: 'jsdom',
          include: ['tests/component/**/*.test.tsx'],
          setupFiles: ['tests/support/component-setup.ts'],
        },
      },
      {
        extends: true,
        test: {
          name: 'api',
          environment: 'node',
          include: ['tests/api/**/*.test.ts'],
          setupFiles: ['tests/support/api-setup.ts'],
          // One database shared by all API files: run them one file at a time.
          fileParallelism: false,
          hookTimeout: 30000,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          environment: 'node',
          include: ['tests/e2e/**/*.test.ts'],
          setupFiles: ['tests/support/api-setup.ts'],
          fileParallelism: false,
          testTimeout: 90000,
          hookTimeout: 60000,
        },
      },
    ],
  },
});
