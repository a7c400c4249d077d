import { JobThread, ownExtension } from './job-thread.ts';
import type * as Jobs from './jobs.ts';

/**
 * The one thread each app process runs long work on (jobs.ts): reads that take tens or hundreds
 * of milliseconds on a large network (a category's reliability over every shop, a year of
 * roll-ups) and imports. A lead's build detail is not kept waiting behind them. One thread, not
 * one per kind of work: each costs about 100 MB before it does anything. An import pauses between
 * its batches, and reads run in the pauses. A young generation of 8 MB (V8 gives a thread 16-32 MB
 * by default) keeps an import's many short-lived row objects from pushing the app past its memory
 * target; the largest file (5,000 rows, 5 MB) fits the old generation with room to spare.
 */
export const background = new JobThread<typeof Jobs>(new URL(`./jobs${ownExtension(import.meta.url)}`, import.meta.url), { maxYoungGenerationSizeMb: 8, maxOldGenerationSizeMb: 256 });
