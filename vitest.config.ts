import { defineConfig } from 'vitest/config';

/** Migrates and seeds a database once per run for the harnesses to copy (tests/support/api-harness.ts). */
const DATABASE_TEMPLATES = 'tests/support/database-templates.ts';

// Four projects: pure units, API routes against a fresh SQLite file, checks against published
// sources, and end-to-end runs of the built app in Chromium. Every file has its own app, database
// and browser, so the end-to-end files share the workers with the rest instead of running one by
// one after them (which left a core idle for half the run). Two workers: Vitest's default, one
// fewer than the CPUs, ran the files one at a time on a 2-core machine (789 s; 670 s with two).
//
// Files run one after another in a worker that keeps the modules it loaded (isolate: false):
// loading the API and its libraries afresh for each file cost more than two minutes of the run.
// Nothing a test asserts may hang on module state left by another file: fixtures hand back the
// names and numbers they made (tests/support/*-fixtures.ts), and each harness its own app and database;
// spies are put back before each test (restoreMocks), so a silenced console stays in its own test.
export default defineConfig({
  test: {
    maxWorkers: 2,
    isolate: false,
    restoreMocks: true,
    projects: [
      { extends: true, test: { name: 'unit', include: ['tests/unit/**/*.test.ts'] } },
      { extends: true, test: { name: 'external', include: ['tests/external/**/*.test.ts'] } },
      { extends: true, test: { name: 'api', include: ['tests/api/**/*.test.ts'], testTimeout: 20000, globalSetup: [DATABASE_TEMPLATES] } },
      {
        extends: true,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          testTimeout: 60000,
          hookTimeout: 60000,
          globalSetup: [DATABASE_TEMPLATES],
        },
      },
    ],
  },
});
