import { CheckCircleOutlined, CloseCircleOutlined, HourglassOutlined, SyncOutlined } from '@ant-design/icons-vue';
import { EXPORT_SHEET_NAMES, type ExportJob, type ExportStatus } from '@busbar/shared';
import type { Component } from 'vue';
import type { Tone } from '../../theme.ts';
import { monthName } from '../network/comparedMonths.ts';

/** An export's status: a word, an icon and a tone, never colour alone. */
export const EXPORT_STATUS_LOOK: Record<ExportStatus, { label: string; tone: Tone; icon: Component }> = {
  queued: { label: 'Waiting', tone: 'neutral', icon: HourglassOutlined },
  running: { label: 'Running', tone: 'info', icon: SyncOutlined },
  done: { label: 'Done', tone: 'success', icon: CheckCircleOutlined },
  failed: { label: 'Failed', tone: 'danger', icon: CloseCircleOutlined },
};

/** Still to finish: its progress is worth following. */
export const isActive = (job: Pick<ExportJob, 'status'>) => job.status === 'queued' || job.status === 'running';

/** "Jun 2026", or "Jan 2026 – Mar 2026". */
export const monthsText = (job: Pick<ExportJob, 'month' | 'throughMonth'>) =>
  job.month === job.throughMonth ? monthName(job.month) : `${monthName(job.month)} – ${monthName(job.throughMonth)}`;

/** "Workbook (xlsx)", or "CSV: Delivered builds". */
export const formatText = (job: Pick<ExportJob, 'format' | 'sheet'>) => (job.format === 'xlsx' ? 'Workbook (xlsx)' : `CSV: ${EXPORT_SHEET_NAMES[job.sheet ?? 'summary']}`);

/** Bytes in words: "840 B", "12.4 KB", "3.1 MB" (1 KB = 1,024 bytes). */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  const [value, unit] = bytes < 1024 * 1024 ? [bytes / 1024, 'KB'] : [bytes / (1024 * 1024), 'MB'];
  return `${value.toLocaleString('en-US', { maximumFractionDigits: 1 })} ${unit}`;
}

/** How far a running export has got, in percent (0 until its rows are counted). */
export const percentDone = (job: Pick<ExportJob, 'rowsDone' | 'rowsTotal'>) => (job.rowsTotal ? Math.min(100, Math.floor((job.rowsDone / job.rowsTotal) * 100)) : 0);

/** "1,200 of 5,400 rows", or "Counting rows" before the total is known. */
export const progressText = (job: Pick<ExportJob, 'rowsDone' | 'rowsTotal'>) =>
  job.rowsTotal === null ? 'Counting rows' : `${job.rowsDone.toLocaleString('en-US')} of ${job.rowsTotal.toLocaleString('en-US')} rows`;
