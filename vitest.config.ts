import { defineConfig } from 'vitest/config';

// Four projects: pure units, API routes against a fresh SQLite file, checks against published
// sources, and end-to-end runs of the built app in Chromium. Every file has its own app, database
// and browser, so the end-to-end files share the workers with the rest instead of running one by
// one after them (which left a core idle for half the run).
export default defineConfig({
  test: {
    projects: [
      { test: { name: 'unit', include: ['tests/unit/**/*.test.ts'] } },
      { test: { name: 'external', include: ['tests/external/**/*.test.ts'] } },
      { test: { name: 'api', include: ['tests/api/**/*.test.ts'], testTimeout: 20000 } },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          testTimeout: 60000,
          hookTimeout: 60000,
        },
      },
    ],
  },
});
