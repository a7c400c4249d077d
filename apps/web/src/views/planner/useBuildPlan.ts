import type { PlanRevisionView, PlanView } from '@busbar/shared';
import { ref, shallowRef, watch } from 'vue';
import { messageOf } from '../../api/client.ts';
import { getBuildPlan, listPlanRevisions, saveBuildPlan } from '../../api/plans.ts';
import { usePlanDraft } from './usePlanDraft.ts';

/** The power plan of one build: loaded, edited as a draft, saved in versions with their history. */
export function useBuildPlan(buildId: () => number) {
  const draft = usePlanDraft();
  const plan = shallowRef<PlanView | null>(null);
  const revisions = ref<PlanRevisionView[]>([]);
  const revisionsError = ref<string | null>(null);
  const loading = ref(true);
  const loadError = ref<string | null>(null);
  const saving = ref(false);

  async function loadRevisions() {
    revisionsError.value = null;
    try {
      revisions.value = plan.value ? await listPlanRevisions(buildId()) : [];
    } catch (failure) {
      revisionsError.value = messageOf(failure);
    }
  }

  async function load() {
    loading.value = true;
    loadError.value = null;
    try {
      plan.value = (await getBuildPlan(buildId())).plan;
      draft.reset(plan.value?.input ?? null);
      void loadRevisions();
    } catch (failure) {
      loadError.value = messageOf(failure);
    } finally {
      loading.value = false;
    }
  }
  watch(buildId, load, { immediate: true });

  /** Saves the draft as the next version; true when saved. A delivered build's correction carries its reason. */
  async function save(correctionNote?: string): Promise<boolean> {
    const input = draft.validated();
    if (!input) return false;
    saving.value = true;
    try {
      plan.value = await saveBuildPlan(buildId(), { version: plan.value?.version ?? 0, input, correctionNote });
      draft.reset(plan.value.input);
      void loadRevisions();
      return true;
    } catch (failure) {
      draft.failed(failure);
      return false;
    } finally {
      saving.value = false;
    }
  }

  return { ...draft, plan, revisions, revisionsError, loading, loadError, saving, load, save };
}
