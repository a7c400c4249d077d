import type { ClaimCreate, ClaimDetail, ClaimQuery, ClaimStatus, ClaimUpdate, ClaimView, Page } from '@busbar/shared';
import { ApiError, csrfToken, request } from './client.ts';

export type ClaimFilter = Partial<Omit<ClaimQuery, 'page' | 'pageSize'>> & { page?: number; pageSize?: number };

export interface ClaimStatusMove {
  version: number;
  to: ClaimStatus;
  note?: string;
  creditApprovedCents?: number;
  creditReceivedCents?: number;
}

export interface ReplacementUnit {
  version: number;
  serialNumber: string;
  replacedOn: string;
  catalogItemId?: number;
}

export const listClaims = (filter: ClaimFilter) => request<Page<ClaimView>>('/claims', { query: { ...filter } });

export const getClaim = (id: number) => request<ClaimDetail>(`/claims/${id}`);

export const createClaim = (body: ClaimCreate) => request<ClaimDetail>('/claims', { method: 'POST', body });

export const updateClaim = (id: number, body: ClaimUpdate) => request<ClaimDetail>(`/claims/${id}`, { method: 'PATCH', body });

export const moveClaim = (id: number, body: ClaimStatusMove) =>
  request<ClaimDetail>(`/claims/${id}/status`, { method: 'POST', body });

export const sendClaim = (id: number, version: number) =>
  request<ClaimDetail>(`/claims/${id}/send`, { method: 'POST', body: { version } });

export const recordReplacement = (id: number, body: ReplacementUnit) =>
  request<ClaimDetail>(`/claims/${id}/replacement`, { method: 'POST', body });

export const deleteEvidence = (id: number, evidenceId: number, reason: string) =>
  request<ClaimDetail>(`/claims/${id}/evidence/${evidenceId}`, { method: 'DELETE', body: { reason } });

/** Where the browser opens an evidence file (or its thumbnail); the session cookie goes along. */
export const evidenceUrl = (id: number, evidenceId: number, thumbnail = false) =>
  `/api/claims/${id}/evidence/${evidenceId}${thumbnail ? '?thumbnail=true' : ''}`;

/**
 * Uploads one photo or document (multipart field `file`), reporting the share sent so far (0–1).
 * XMLHttpRequest, because fetch does not report upload progress.
 */
export function uploadEvidence(id: number, file: File, onProgress: (share: number) => void): Promise<ClaimDetail> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/claims/${id}/evidence`);
    xhr.setRequestHeader('Accept', 'application/json');
    const token = csrfToken();
    if (token) xhr.setRequestHeader('X-CSRF-Token', token);
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.onerror = () => reject(new ApiError(0, 'network', 'Busbar could not reach the server. Check the connection and try again.'));
    xhr.onload = () => {
      const body = (() => {
        try {
          return JSON.parse(xhr.responseText) as unknown;
        } catch {
          return null;
        }
      })();
      if (xhr.status >= 200 && xhr.status < 300) return resolve(body as ClaimDetail);
      const error = (body as { error?: { code: string; message: string; fields?: Record<string, string> } } | null)?.error;
      reject(new ApiError(xhr.status, error?.code ?? 'internal', error?.message ?? `The upload failed (${xhr.status}). Try again.`, error?.fields));
    };
    const form = new FormData();
    form.append('file', file);
    xhr.send(form);
  });
}
