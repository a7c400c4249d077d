import type { LocationView } from '@busbar/shared';
import { computed, watch, type Ref } from 'vue';
import { useRoute, useRouter, type LocationQueryRaw } from 'vue-router';
import type { ReliabilityFilter } from '../../api/reliability.ts';
import { useScopeStore } from '../../stores/scope.ts';
import { filterQuery, readReliabilityFilter } from './reliabilityFilters.ts';

/**
 * The reliability filters of the address bar, and changing them there (so links and the back button
 * keep them). Shops the person does not see (an old or edited link) leave the address once their
 * shops are known, so the API is not asked for them. `sent` is the filter as asked of the API: with
 * no shops chosen, the shops of the header's scope.
 */
export function useReliabilityRoute(locations: Ref<LocationView[]>, locationsLoading: Ref<boolean>) {
  const route = useRoute();
  const router = useRouter();
  const scope = useScopeStore();
  const filter = computed(() => readReliabilityFilter(route.query));
  const sent = computed<ReliabilityFilter>(() =>
    filter.value.locationIds.length > 0 || scope.scope.kind === 'all' ? filter.value : { ...filter.value, locationIds: scope.shops.map((l) => l.id) },
  );
  /** The filter as query, for links between the list and the details. */
  const query = computed(() => filterQuery(filter.value));

  /** Changes the filter (and other keys of the query, such as the grouping); a cleared filter leaves the address. */
  function setFilter(change: Partial<ReliabilityFilter>, other: LocationQueryRaw = {}) {
    const { from: _from, to: _to, locations: _locations, ...rest } = route.query;
    void router.replace({ query: { ...rest, ...other, ...filterQuery({ ...filter.value, ...change }) } });
  }

  watch([filter, locationsLoading], () => {
    if (locationsLoading.value || !locations.value.length) return;
    const known = filter.value.locationIds.filter((id) => locations.value.some((l) => l.id === id));
    if (known.length < filter.value.locationIds.length) setFilter({ locationIds: known });
  });

  return { route, filter, sent, query, setFilter };
}
