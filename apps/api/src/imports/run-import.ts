import type { ImportResult } from '@busbar/shared';
import { JobThread } from '../threads/job-thread.ts';
import type * as ImportJobs from './import-job.ts';
import type { ImportJob } from './import-job.ts';

/**
 * The worker's heap: a young generation of 8 MB (V8 gives a thread 16-32 MB by default) keeps an
 * import's many short-lived row objects from pushing the app past its memory target; the largest
 * file (5,000 rows, 5 MB) fits the old generation with room to spare.
 */
const imports = new JobThread<typeof ImportJobs>(new URL('./import-job.ts', import.meta.url), { maxYoungGenerationSizeMb: 8, maxOldGenerationSizeMb: 256 });

/**
 * Runs an import in a worker thread with its own database connection: parsing and checking
 * thousands of rows and writing them in one transaction would otherwise hold the one thread
 * every other request is answered on.
 */
export function runImport(job: ImportJob): Promise<ImportResult> {
  return imports.run('importBuilds', job);
}
