import type { AcceptInviteBody, InviteView, SessionSettingsBody, SessionView, SignInBody } from '@busbar/shared';
import { request } from './client.ts';

export const getSession = () => request<SessionView>('/session');

export const signIn = (body: SignInBody) => request<SessionView>('/session', { method: 'POST', body });

export const changeSettings = (body: SessionSettingsBody) => request<SessionView>('/session', { method: 'PATCH', body });

export const signOut = () => request<void>('/session', { method: 'DELETE' });

export const getInvite = (token: string) => request<InviteView>(`/invites/${encodeURIComponent(token)}`);

export const acceptInvite = (body: AcceptInviteBody) =>
  request<SessionView>('/invites/accept', { method: 'POST', body });
