import type { ClaimDetail } from '@busbar/shared';
import { inject, provide, ref, shallowRef, watch, type InjectionKey, type Ref } from 'vue';
import { ApiError, isStale, messageOf } from '../../api/client.ts';
import { getClaim } from '../../api/claims.ts';

/** Sends one change made against the version on screen and answers the whole new claim. */
export type ClaimChange = (send: (version: number) => Promise<ClaimDetail>) => Promise<boolean>;

interface ClaimState {
  stale: Ref<string | null>;
  loading: Ref<boolean>;
  load: () => Promise<void>;
}
const stateKey: InjectionKey<ClaimState> = Symbol('claim state');

/** The stale notice and reload of the claim page, for dialogs that cover the page's own notice. */
export function useClaimState(): ClaimState {
  const state = inject(stateKey);
  if (!state) throw new Error('useClaimState needs a claim page above it');
  return state;
}

/**
 * One claim on screen. Every change carries the version the person saw; when someone else changed
 * the claim first, the page says so and offers a reload. Other failures are thrown to the caller.
 */
export function useClaim(id: () => number) {
  const claim = shallowRef<ClaimDetail | null>(null);
  const loading = ref(true);
  const error = ref<string | null>(null);
  const notFound = ref(false);
  const stale = ref<string | null>(null);

  async function load() {
    loading.value = true;
    error.value = null;
    notFound.value = false;
    try {
      claim.value = await getClaim(id());
      stale.value = null;
    } catch (failure) {
      claim.value = null;
      notFound.value = failure instanceof ApiError && failure.status === 404;
      error.value = messageOf(failure);
    } finally {
      loading.value = false;
    }
  }
  watch(id, load, { immediate: true });

  const change: ClaimChange = async (send) => {
    if (!claim.value) return false;
    try {
      claim.value = await send(claim.value.version);
      stale.value = null;
      return true;
    } catch (failure) {
      if (isStale(failure)) {
        stale.value = failure.message;
        return false;
      }
      throw failure;
    }
  };

  /** A whole claim answered by a request that carries no version (an upload). */
  const replace = (next: ClaimDetail) => {
    claim.value = next;
  };

  provide(stateKey, { stale, loading, load });
  return { claim, loading, error, notFound, stale, load, change, replace };
}
