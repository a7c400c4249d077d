import { quickPlanCreate, type PlanView } from '@busbar/shared';
import { computed, ref, shallowRef, watch } from 'vue';
import { messageOf } from '../../api/client.ts';
import { createQuickPlan, getPlan, updateQuickPlan } from '../../api/plans.ts';
import { messagesFromIssues } from './planErrors.ts';
import { usePlanDraft } from './usePlanDraft.ts';

const heading = quickPlanCreate.pick({ locationId: true, name: true });

/** A quick plan from a consultation: its shop and name beside the plan itself; a new one when `id` is absent. */
export function useQuickPlan(id: () => number | undefined) {
  const draft = usePlanDraft();
  const plan = shallowRef<PlanView | null>(null);
  const name = ref('');
  const locationId = ref<number>();
  const headMessages = ref<{ name?: string; locationId?: string }>({});
  const loading = ref(false);
  const loadError = ref<string | null>(null);
  const saving = ref(false);

  const unsaved = computed(() => draft.unsaved.value || name.value.trim() !== (plan.value?.name ?? ''));
  watch(name, () => delete headMessages.value.name);
  watch(locationId, () => delete headMessages.value.locationId);

  function show(view: PlanView | null) {
    plan.value = view;
    name.value = view?.name ?? '';
    if (view) locationId.value = view.locationId;
    draft.reset(view?.input ?? null);
  }

  /** Loads the plan of the address; `again` also when it is on screen already (after someone else saved it). */
  async function load(again = false) {
    const wanted = id();
    // The plan just created is already on screen when the address changes to it.
    if (!again && wanted !== undefined && plan.value?.id === wanted) return;
    loadError.value = null;
    if (wanted === undefined) return show(null);
    loading.value = true;
    try {
      show(await getPlan(wanted));
    } catch (failure) {
      loadError.value = messageOf(failure);
    } finally {
      loading.value = false;
    }
  }
  watch(id, () => load(), { immediate: true });

  /** Creates or saves the plan; answers it, or null when something needs fixing. */
  async function save(): Promise<PlanView | null> {
    const head = heading.safeParse({ locationId: locationId.value, name: name.value });
    headMessages.value = head.success ? {} : messagesFromIssues(head.error.issues);
    const input = draft.validated();
    if (!head.success || !input) return null;
    saving.value = true;
    try {
      const current = plan.value;
      const body = { name: head.data.name, input };
      show(current ? await updateQuickPlan(current.id, { ...body, version: current.version }) : await createQuickPlan({ ...body, locationId: head.data.locationId }));
      return plan.value;
    } catch (failure) {
      draft.failed(failure);
      const { name: nameMessage, locationId: locationMessage } = draft.serverMessages.value;
      headMessages.value = { name: nameMessage, locationId: locationMessage };
      return null;
    } finally {
      saving.value = false;
    }
  }

  return { ...draft, unsaved, plan, name, locationId, headMessages, loading, loadError, saving, load, save };
}
