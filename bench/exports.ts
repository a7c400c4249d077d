import { DEMO_PASSWORD } from '@busbar/db';
import { addMonthsIso } from '@busbar/calc';
import type { ExportJob } from '@busbar/shared';
import { call, signIn } from './client.ts';
import { idsFor } from './screens.ts';
import { startApp, type PeakMemory } from './server.ts';
import { latency, ms, type Latency } from './stats.ts';

export interface ExportFigures {
  months: string;
  status: string;
  rows: number;
  seconds: number;
  fileMiB: number;
  /** Peak memory of the app from its start through the export (the export is all it does). */
  memory: PeakMemory;
  /** A lead's build detail meanwhile. */
  leadDetail: Latency;
}

/**
 * The accountant's workbook of the last twelve whole months of every shop, made by an app started
 * for it alone (so its peak memory is the export's), while a lead opens a build again and again.
 */
export async function measureExport(dataDir: string): Promise<ExportFigures> {
  const app = await startApp(dataDir);
  try {
    const accountant = await signIn(app.baseUrl, 'accountant@demo.busbar.test', DEMO_PASSWORD);
    const lead = await signIn(app.baseUrl, 'lead@demo.busbar.test', DEMO_PASSWORD);
    const buildId = (await idsFor(lead)).buildId;
    const thisMonth = new Date().toISOString().slice(0, 7);
    const [month, throughMonth] = [addMonthsIso(`${thisMonth}-01`, -12).slice(0, 7), addMonthsIso(`${thisMonth}-01`, -1).slice(0, 7)];
    const started = performance.now();
    const asked = await call(accountant, 'POST', '/api/exports', { kind: 'month-close', month, throughMonth });
    if (asked.status !== 202) throw new Error(`the export was refused (${asked.status}): ${asked.body}`);
    const { id } = JSON.parse(asked.body) as { id: number };
    const times: number[] = [];
    let job: ExportJob;
    for (;;) {
      for (let i = 0; i < 10; i++) times.push((await call(lead, 'GET', `/api/builds/${buildId}`)).ms);
      job = JSON.parse((await call(accountant, 'GET', `/api/exports/${id}`)).body) as ExportJob;
      if (job.status === 'done' || job.status === 'failed') break;
    }
    const seconds = (performance.now() - started) / 1000;
    return { months: `${month} to ${throughMonth}`, status: job.status === 'failed' ? `failed: ${job.error}` : 'done', rows: job.rowsTotal ?? 0, seconds, fileMiB: (job.fileBytes ?? 0) / 2 ** 20, memory: app.peakMemory(), leadDetail: latency(times) };
  } finally {
    await app.stop();
  }
}

export const exportLine = (label: string, f: ExportFigures) =>
  `| ${label} | ${f.months}: ${f.status}, ${f.rows.toLocaleString('en-US')} rows in ${f.seconds.toFixed(1)} s (${Math.round(f.rows / f.seconds).toLocaleString('en-US')} rows/s), ${f.fileMiB.toFixed(1)} MiB | ${f.memory.largestMiB.toFixed(0)} MiB (${f.memory.processes} processes: ${f.memory.totalMiB.toFixed(0)} MiB) | ${ms(f.leadDetail.p95)} ms (p50 ${ms(f.leadDetail.p50)}, ${f.leadDetail.count} requests) |`;

export const exportTable = (lines: string[]) => [
  "| data | the accountant's workbook of twelve months, every shop | peak RSS of the largest app process from its start through the export | a lead's build detail p95 meanwhile |",
  '|---|---|---|---|',
  ...lines,
];
