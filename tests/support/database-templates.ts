import { mkdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';

declare module 'vitest' {
  export interface ProvidedContext {
    /** The folder where this run keeps its migrated and seeded databases (api-harness.ts). */
    databaseTemplates: string;
  }
}

/**
 * Global setup: one folder per run of vitest (the api and e2e projects share it), so a database is
 * migrated and seeded once per demo variant and copied for each harness, and a run never reuses
 * another's after migrations or the demo changed.
 */
export default function setup(project: TestProject) {
  const folder = join(tmpdir(), `busbar-templates-${process.pid}`);
  mkdirSync(folder, { recursive: true });
  project.provide('databaseTemplates', folder);
  return () => rmSync(folder, { recursive: true, force: true });
}
