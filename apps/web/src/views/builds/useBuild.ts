import type { BuildDetail } from '@busbar/shared';
import { inject, provide, ref, shallowRef, watch, type InjectionKey, type Ref } from 'vue';
import { ApiError, isStale, messageOf } from '../../api/client.ts';
import { getBuild } from '../../api/builds.ts';

/** Sends one change made against the version on screen and answers the whole new build. */
export type BuildChange = (send: (version: number) => Promise<BuildDetail>) => Promise<boolean>;

interface BuildState {
  stale: Ref<string | null>;
  loading: Ref<boolean>;
  load: () => Promise<void>;
}
const stateKey: InjectionKey<BuildState> = Symbol('build state');

/** The stale notice and reload of the build page, for dialogs that cover the page's own notice. */
export function useBuildState(): BuildState {
  const state = inject(stateKey);
  if (!state) throw new Error('useBuildState needs a build page above it');
  return state;
}

/**
 * One build on screen. Every change carries the version the person saw; when someone else changed
 * the build first, the page says so and offers a reload, and the forms keep what was typed.
 */
export function useBuild(id: () => number) {
  const build = shallowRef<BuildDetail | null>(null);
  const loading = ref(true);
  const error = ref<string | null>(null);
  const notFound = ref(false);
  const stale = ref<string | null>(null);

  async function load() {
    loading.value = true;
    error.value = null;
    notFound.value = false;
    try {
      build.value = await getBuild(id());
      stale.value = null;
    } catch (failure) {
      build.value = null;
      notFound.value = failure instanceof ApiError && failure.status === 404;
      error.value = messageOf(failure);
    } finally {
      loading.value = false;
    }
  }
  watch(id, load, { immediate: true });

  /** True when the change was saved; false when the build was stale. Other failures are thrown to the form. */
  const change: BuildChange = async (send) => {
    if (!build.value) return false;
    try {
      build.value = await send(build.value.version);
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

  provide(stateKey, { stale, loading, load });
  return { build, loading, error, notFound, stale, load, change };
}
