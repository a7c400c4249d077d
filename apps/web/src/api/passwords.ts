import type { AcceptPasswordResetBody, ChangePasswordBody, PasswordResetRequestBody, PasswordResetView, SessionView } from '@busbar/shared';
import { request } from './client.ts';

export const changePassword = (body: ChangePasswordBody) => request<void>('/session/password', { method: 'POST', body });

export const requestPasswordReset = (body: PasswordResetRequestBody) => request<{ message: string }>('/password-resets', { method: 'POST', body });

export const getPasswordReset = (token: string) => request<PasswordResetView>(`/password-resets/${encodeURIComponent(token)}`);

export const acceptPasswordReset = (body: AcceptPasswordResetBody) => request<SessionView>('/password-resets/accept', { method: 'POST', body });
