import type { AppAbility, LocationView, RegionView } from '@busbar/shared';
import { useAbility } from '@casl/vue';
import { onMounted, ref } from 'vue';
import { listLocations, listRegions } from '../api/admin.ts';
import { messageOf } from '../api/client.ts';

/** The locations and regions the person may see, for filters, forms and labels. */
export function useScopeLists() {
  const ability = useAbility<AppAbility>();
  const locations = ref<LocationView[]>([]);
  const regions = ref<RegionView[]>([]);
  const loading = ref(true);
  const error = ref<string | null>(null);

  onMounted(async () => {
    try {
      // People who may not read regions go without them rather than meet a refusal.
      const regionRequest = ability.can('read', 'Region') ? listRegions() : Promise.resolve([]);
      [locations.value, regions.value] = await Promise.all([listLocations(), regionRequest]);
    } catch (failure) {
      error.value = messageOf(failure);
    } finally {
      loading.value = false;
    }
  });

  return { locations, regions, loading, error };
}
