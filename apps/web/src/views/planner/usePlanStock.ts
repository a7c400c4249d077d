import type { PlanStock } from '@busbar/calc';
import { shallowRef, type ShallowRef } from 'vue';
import { getPlanStock } from '../../api/planStock.ts';

// The catalog's bank and charger sizes change seldom: asked once a visit, asked again after a failure.
const stock = shallowRef<PlanStock | undefined>();
let asking: Promise<void> | null = null;

/**
 * The sizes the shops can buy, so the browser rounds its recommended bank and charger as the
 * server does on save; undefined until they arrive (the common sizes meanwhile).
 */
export function usePlanStock(): Readonly<ShallowRef<PlanStock | undefined>> {
  asking ??= getPlanStock().then(
    (answer) => {
      stock.value = answer;
    },
    () => {
      asking = null;
    },
  );
  return stock;
}
