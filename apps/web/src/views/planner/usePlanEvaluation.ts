import { evaluatePlan, type PlanInput, type PlanResult } from '@busbar/calc';
import { planInputSchema } from '@busbar/shared';
import { onBeforeUnmount, ref, shallowRef, watch } from 'vue';
import { messageFromRangeError, messagesFromIssues, type FieldMessages } from './planErrors.ts';

/** Checks a plan with the shared schema, then with the computation itself; answers the result or the messages. */
export function checkPlan(input: unknown): { result: PlanResult; input: PlanInput } | { messages: FieldMessages } {
  const parsed = planInputSchema.safeParse(input);
  if (!parsed.success) return { messages: messagesFromIssues(parsed.error.issues) };
  try {
    return { result: evaluatePlan(parsed.data), input: parsed.data };
  } catch (error) {
    if (error instanceof RangeError) return { messages: messageFromRangeError(error) };
    throw error;
  }
}

/**
 * The plan evaluated in the browser as the person types, after a short pause. While an input is
 * wrong the last good result stays on screen, marked as out of date.
 */
export function usePlanEvaluation(input: () => unknown, delayMs = 150) {
  const result = shallowRef<PlanResult | null>(null);
  const messages = ref<FieldMessages>({});
  const outOfDate = ref(false);
  /** A change is waiting for its evaluation. */
  const pending = ref(false);
  let timer: ReturnType<typeof setTimeout> | undefined;

  function evaluate() {
    pending.value = false;
    const checked = checkPlan(input());
    if ('result' in checked) {
      result.value = checked.result;
      messages.value = {};
      outOfDate.value = false;
    } else {
      messages.value = checked.messages;
      outOfDate.value = result.value !== null;
    }
  }

  watch(
    () => JSON.stringify(input()),
    () => {
      clearTimeout(timer);
      pending.value = true;
      timer = setTimeout(evaluate, delayMs);
    },
  );
  evaluate();
  onBeforeUnmount(() => clearTimeout(timer));

  return { result, messages, outOfDate, pending };
}
