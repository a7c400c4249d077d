import { describe, expect, it } from 'vitest';
import { HttpError } from '../../apps/api/src/errors.ts';
import { JobThread } from '../../apps/api/src/threads/job-thread.ts';
import type * as Jobs from '../support/thread-jobs.ts';

const jobs = () => new JobThread<typeof Jobs>(new URL('../support/thread-jobs.ts', import.meta.url), { maxOldGenerationSizeMb: 64 });

describe('a job thread', () => {
  it('answers with what the job returned', async () => {
    await expect(jobs().run('echo', { text: 'Longbay Wren', ids: [3, 5] })).resolves.toEqual({ text: 'Longbay Wren', ids: [3, 5], thread: 'job' });
  });

  it('leaves the calling thread free while a job runs', async () => {
    const thread = jobs();
    await thread.run('echo', { text: 'warm', ids: [] });
    const ticks: number[] = [];
    const timer = setInterval(() => ticks.push(performance.now()), 10);
    const started = performance.now();
    await thread.run('busy', 400);
    clearInterval(timer);
    // Run on this thread, the loop would have held every tick until it ended.
    expect(ticks.filter((t) => t - started < 300).length).toBeGreaterThan(10);
  });

  it('keeps an HTTP error its status, code and fields, and another error its code', async () => {
    const thread = jobs();
    const refused = await thread.run('refuses').catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(HttpError);
    expect(refused).toMatchObject({ status: 409, code: 'conflict', message: 'Serial already taken', fields: { serial: 'Taken at another build' } });
    const busy = await thread.run('failsInSqlite').catch((e: unknown) => e);
    expect(busy).not.toBeInstanceOf(HttpError);
    expect(busy).toMatchObject({ code: 'SQLITE_BUSY', message: 'database is locked' });
  });

  it('fails the jobs of a thread that stops and starts a new one for the next', async () => {
    const thread = jobs();
    await expect(thread.run('stops')).rejects.toThrow('A worker thread stopped (exit code 3)');
    await expect(thread.run('echo', { text: 'again', ids: [1] })).resolves.toMatchObject({ text: 'again' });
  });
});
