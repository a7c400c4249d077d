import { JobThread } from './job-thread.ts';
import type * as ReadJobs from './read-jobs.ts';

/**
 * Reads that take tens or hundreds of milliseconds on a large network (a category's reliability
 * over every shop, a year of roll-ups) run here, one after another, so a lead's build detail is
 * not kept waiting behind them. Its heap is capped well inside the app's memory target.
 */
export const readThread = new JobThread<typeof ReadJobs>(new URL('./read-jobs.ts', import.meta.url), { maxYoungGenerationSizeMb: 8, maxOldGenerationSizeMb: 192 });
