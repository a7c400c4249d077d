import { monthSchema } from '@busbar/shared';
import { computed } from 'vue';
import { useRoute } from 'vue-router';
import { useSessionStore } from '../../stores/session.ts';
import { addMonths } from '../network/comparedMonths.ts';

/** The month (YYYY-MM) the address bar asks for; last month, the one the accountant closes next, when it asks for none or a malformed one. */
export function useAskedMonth() {
  const route = useRoute();
  const session = useSessionStore();
  return computed(() => {
    const asked = String(route.query.month ?? '');
    return monthSchema.safeParse(asked).success ? asked : addMonths(session.today.slice(0, 7), -1);
  });
}
