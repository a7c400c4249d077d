import type { GrantRoleBody, InviteBody, Page, PersonStatus, StaffPerson } from '@busbar/shared';
import { request } from './client.ts';

export interface StaffFilter {
  locationId?: number;
  status?: PersonStatus | 'all';
  q?: string;
  page?: number;
  pageSize?: number;
}

export const listStaff = (filter: StaffFilter) => request<Page<StaffPerson>>('/staff', { query: { ...filter } });

export const getStaffPerson = (id: number) => request<StaffPerson>(`/staff/${id}`);

export const invitePerson = (body: InviteBody) => request<StaffPerson>('/staff/invites', { method: 'POST', body });

export const resendInvite = (id: number) => request<void>(`/staff/${id}/invite`, { method: 'POST' });

export const grantRole = (id: number, body: GrantRoleBody) =>
  request<StaffPerson>(`/staff/${id}/roles`, { method: 'POST', body });

export const removeRole = (id: number, assignmentId: number) =>
  request<StaffPerson>(`/staff/${id}/roles/${assignmentId}`, { method: 'DELETE' });

export const deactivatePerson = (id: number) => request<StaffPerson>(`/staff/${id}/deactivate`, { method: 'POST' });

export const reactivatePerson = (id: number) => request<StaffPerson>(`/staff/${id}/reactivate`, { method: 'POST' });
