import { createAbility, type AcceptInviteBody, type AcceptPasswordResetBody, type SessionSettingsBody, type SessionView, type SignInBody } from '@busbar/shared';
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import { ApiError, messageOf } from '../api/client.ts';
import { acceptPasswordReset as acceptReset } from '../api/passwords.ts';
import * as api from '../api/session.ts';

/** The one ability of the app: menus, buttons and the route guard all ask it; sign-in and sign-out update it. */
export const ability = createAbility();

export const useSessionStore = defineStore('session', () => {
  const view = ref<SessionView | null>(null);
  const loadError = ref<string | null>(null);
  let loading: Promise<void> | null = null;

  const person = computed(() => view.value?.person ?? null);
  const assignments = computed(() => view.value?.assignments ?? []);
  /** The server's date, for counting months from the same day as the figures. */
  const today = computed(() => view.value?.today ?? new Date().toISOString().slice(0, 10));

  function apply(next: SessionView | null) {
    view.value = next;
    ability.update(next?.rules ?? []);
  }

  async function load() {
    try {
      apply(await api.getSession());
      loadError.value = null;
    } catch (error) {
      apply(null);
      if (!(error instanceof ApiError && error.status === 401)) loadError.value = messageOf(error);
    }
  }

  /** Asks the server once who is signed in; later calls wait for the same answer. */
  function ensureLoaded(): Promise<void> {
    loading ??= load();
    return loading;
  }

  async function signIn(body: SignInBody) {
    apply(await api.signIn(body));
    loadError.value = null;
  }

  /** Changes the person's own settings (the weekly e-mail) and takes the answer as the session. */
  async function changeSettings(body: SessionSettingsBody) {
    apply(await api.changeSettings(body));
  }

  async function acceptInvite(body: AcceptInviteBody) {
    apply(await api.acceptInvite(body));
    loadError.value = null;
  }

  /** Sets a new password with an e-mailed reset link; the server signs the person in. */
  async function acceptPasswordReset(body: AcceptPasswordResetBody) {
    apply(await acceptReset(body));
    loadError.value = null;
  }

  /** Signs out on the server first: a person must not believe they left while the session lives on. */
  async function signOut() {
    try {
      await api.signOut();
    } catch (error) {
      if (!(error instanceof ApiError && error.status === 401)) throw error;
    }
    apply(null);
  }

  /** Forgets the person without asking the server (it already said the session is gone). */
  function forget() {
    apply(null);
  }

  return { person, assignments, today, loadError, ensureLoaded, signIn, changeSettings, acceptInvite, acceptPasswordReset, signOut, forget };
});
