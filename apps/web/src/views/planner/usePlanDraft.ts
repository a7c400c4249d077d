import type { PlanInput } from '@busbar/calc';
import { computed, ref, shallowRef, watch } from 'vue';
import { ApiError, isStale, messageOf } from '../../api/client.ts';
import { clonePlan, newPlanInput, samePlan } from './draft.ts';
import { messagesFromServer, type FieldMessages } from './planErrors.ts';
import { checkPlan } from './usePlanEvaluation.ts';
import { useUnits } from './useUnits.ts';

/**
 * The plan as the person edits it, beside the plan it started from. A refused save leaves the
 * edits on screen with the server's messages on their fields; someone else's save first is
 * reported as stale.
 */
export function usePlanDraft() {
  const { gauge } = useUnits();
  const baseline = shallowRef<PlanInput>(newPlanInput(gauge.value));
  const draft = ref<PlanInput>(clonePlan(baseline.value));
  const serverMessages = ref<FieldMessages>({});
  const formError = ref<string | null>(null);
  const stale = ref<string | null>(null);

  const unsaved = computed(() => !samePlan(draft.value, baseline.value));
  // What the server said about a field goes once the person changes the plan.
  watch(draft, () => (serverMessages.value = {}), { deep: true });

  /** Starts over from a saved plan, or from a new plan's defaults. */
  function reset(input: PlanInput | null) {
    baseline.value = input ? clonePlan(input) : newPlanInput(gauge.value);
    draft.value = clonePlan(baseline.value);
    serverMessages.value = {};
    formError.value = null;
    stale.value = null;
  }

  /** The draft as the server will take it, or null after saying what to fix. */
  function validated(): PlanInput | null {
    const checked = checkPlan(draft.value);
    formError.value = 'messages' in checked ? 'Some inputs need fixing before the plan can be saved; see the marked fields.' : null;
    return 'input' in checked ? checked.input : null;
  }

  function failed(error: unknown) {
    if (isStale(error)) {
      stale.value = error.message;
      return;
    }
    const fields = error instanceof ApiError ? messagesFromServer(error.fields) : {};
    serverMessages.value = fields;
    const message = messageOf(error);
    formError.value = Object.values(fields).includes(message) ? null : message;
  }

  return { draft, unsaved, serverMessages, formError, stale, reset, validated, failed };
}
