import { conflict } from '../../apps/api/src/errors.ts';

/** Jobs for the job-thread test: each shows one way a job can end. */
export async function echo(value: { text: string; ids: number[] }) {
  return { ...value, thread: 'job' };
}

/** Keeps its thread busy for `ms` without yielding, as a long query does. */
export async function busy(ms: number) {
  const until = Date.now() + ms;
  let turns = 0;
  while (Date.now() < until) turns++;
  return turns;
}

export async function refuses() {
  throw conflict('Serial already taken', { serial: 'Taken at another build' });
}

export async function failsInSqlite() {
  throw Object.assign(new Error('database is locked'), { code: 'SQLITE_BUSY' });
}

export async function stops(): Promise<never> {
  process.exit(3);
}
