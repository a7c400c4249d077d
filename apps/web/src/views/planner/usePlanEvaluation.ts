import { evaluatePlan, type PlanInput, type PlanResult, type PlanStock } from '@busbar/calc';
import { planInputSchema } from '@busbar/shared';
import { onBeforeUnmount, ref, shallowRef, watch } from 'vue';
import { messageFromRangeError, messagesFromIssues, type FieldMessages } from './planErrors.ts';
import { usePlanStock } from './usePlanStock.ts';

/**
 * Checks a plan with the shared schema, then with the computation itself (rounding to the sizes in
 * `stock`, as the server does); answers the result or the messages.
 */
export function checkPlan(input: unknown, stock?: PlanStock): { result: PlanResult; input: PlanInput } | { messages: FieldMessages } {
  const parsed = planInputSchema.safeParse(input);
  if (!parsed.success) return { messages: messagesFromIssues(parsed.error.issues) };
  try {
    return { result: evaluatePlan(parsed.data, { stock }), input: parsed.data };
  } catch (error) {
    if (error instanceof RangeError) return { messages: messageFromRangeError(error) };
    throw error;
  }
}

/**
 * The plan evaluated in the browser as the person types, after a short pause, with the catalog's
 * sizes once they arrive. While an input is wrong the last good result stays on screen, marked as
 * out of date.
 */
export function usePlanEvaluation(input: () => unknown, delayMs = 150) {
  const stock = usePlanStock();
  const result = shallowRef<PlanResult | null>(null);
  const messages = ref<FieldMessages>({});
  const outOfDate = ref(false);
  /** A change is waiting for its evaluation. */
  const pending = ref(false);
  let timer: ReturnType<typeof setTimeout> | undefined;

  function evaluate() {
    pending.value = false;
    const checked = checkPlan(input(), stock.value);
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
  watch(stock, evaluate);
  evaluate();
  onBeforeUnmount(() => clearTimeout(timer));

  return { result, messages, outOfDate, pending };
}
