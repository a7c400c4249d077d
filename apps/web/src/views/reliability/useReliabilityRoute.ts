import { computed } from 'vue';
import { useRoute, useRouter, type LocationQueryRaw } from 'vue-router';
import type { ReliabilityFilter } from '../../api/reliability.ts';
import { filterQuery, readReliabilityFilter } from './reliabilityFilters.ts';

/** The reliability filters of the address bar, and changing them there (so links and the back button keep them). */
export function useReliabilityRoute() {
  const route = useRoute();
  const router = useRouter();
  const filter = computed(() => readReliabilityFilter(route.query));
  /** The filter as query, for links between the list and the details. */
  const query = computed(() => filterQuery(filter.value));

  /** Changes the filter (and other keys of the query, such as the grouping); a cleared filter leaves the address. */
  function setFilter(change: Partial<ReliabilityFilter>, other: LocationQueryRaw = {}) {
    const { from: _from, to: _to, locations: _locations, ...rest } = route.query;
    void router.replace({ query: { ...rest, ...other, ...filterQuery({ ...filter.value, ...change }) } });
  }

  return { route, filter, query, setFilter };
}
