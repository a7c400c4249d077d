import type { ExportBody, ExportJob, Page } from '@busbar/shared';
import { request } from './client.ts';

/** Starts an export; it runs on the server, and its progress is read with `getExport`. */
export const startExport = (body: ExportBody) => request<{ id: number }>('/exports', { method: 'POST', body });

/** The person's exports (the owner's: everyone's), newest first. */
export const listExports = (page: number, pageSize: number) => request<Page<ExportJob>>('/exports', { query: { page, pageSize } });

export const getExport = (id: number) => request<ExportJob>(`/exports/${id}`);

/** Where an export's file downloads from: a plain link sends the session cookie. */
export const exportFileUrl = (id: number) => `/api/exports/${id}/file`;
