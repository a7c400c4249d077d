import type { Page, PlanAttachBody, PlanRevisionView, PlanSaveBody, PlanView, QuickPlanCreate, QuickPlanSummary, QuickPlanUpdate } from '@busbar/shared';
import { request } from './client.ts';

export const getBuildPlan = (buildId: number) => request<{ plan: PlanView | null }>(`/builds/${buildId}/plan`);

export const saveBuildPlan = (buildId: number, body: PlanSaveBody) =>
  request<PlanView>(`/builds/${buildId}/plan`, { method: 'PUT', body });

export const listPlanRevisions = (buildId: number) => request<PlanRevisionView[]>(`/builds/${buildId}/plan/revisions`);

export const listQuickPlans = (query: { locationId?: number; regionId?: number; page?: number; pageSize?: number }) =>
  request<Page<QuickPlanSummary>>('/plans', { query: { ...query } });

export const getPlan = (id: number) => request<PlanView>(`/plans/${id}`);

export const createQuickPlan = (body: QuickPlanCreate) => request<PlanView>('/plans', { method: 'POST', body });

export const updateQuickPlan = (id: number, body: QuickPlanUpdate) => request<PlanView>(`/plans/${id}`, { method: 'PUT', body });

export const attachPlan = (id: number, body: PlanAttachBody) => request<PlanView>(`/plans/${id}/attach`, { method: 'POST', body });
