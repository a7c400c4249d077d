import type { CloseStatus, LocationClose, MonthClose } from '@busbar/shared';
import type { ScopeParams } from '../stores/scope.ts';
import { request } from './client.ts';

/** A month (YYYY-MM) of the person's shops as it is closed, or of the shop or region in `within`. */
export const getMonthClose = (month: string, within: ScopeParams = {}) => request<MonthClose>('/closes', { query: { month, ...within } });

/** Marks a location's month final; answers its close as closed. */
export const markFinal = (locationId: number, month: string) => request<LocationClose>(`/closes/${locationId}/${month}/final`, { method: 'POST' });

/** Where each of the person's shops (or those of `within`) stands with each month from `from` to `to` (YYYY-MM). */
export const getCloseStatus = (from: string, to: string, within: ScopeParams = {}) => request<CloseStatus>('/closes/status', { query: { from, to, ...within } });
