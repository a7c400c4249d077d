import type { LocationView, RegionView } from '@busbar/shared';
import { defineStore } from 'pinia';
import { computed, ref, watch } from 'vue';
import { listLocations, listRegions } from '../api/admin.ts';
import { messageOf } from '../api/client.ts';
import { ability, useSessionStore } from './session.ts';

/** The part of the network a person looks at: all they see, one region of it, or one shop. */
export type Scope = { kind: 'all' } | { kind: 'region'; regionId: number } | { kind: 'shop'; locationId: number };

/** What a list request adds for the scope: a shop or a region (the server keeps to what the person may see in it). */
export type ScopeParams = { locationId?: number; regionId?: number };

const storageKey = (personId: number) => `busbar.scope.${personId}`;

function stored(personId: number): Scope {
  try {
    const value = JSON.parse(localStorage.getItem(storageKey(personId)) ?? 'null') as Scope | null;
    return value && typeof value === 'object' && ['all', 'region', 'shop'].includes(value.kind) ? value : { kind: 'all' };
  } catch {
    return { kind: 'all' };
  }
}

/**
 * The scope chosen in the header, which every list and figure screen narrows to. Kept per person in
 * this browser, so it outlasts a reload; a scope that no longer names a shop or region the person
 * sees falls back to all of it.
 */
export const useScopeStore = defineStore('scope', () => {
  const session = useSessionStore();
  const locations = ref<LocationView[]>([]);
  const regions = ref<RegionView[]>([]);
  const error = ref<string | null>(null);
  const loaded = ref(false);
  const choice = ref<Scope>({ kind: 'all' });

  async function load(personId: number) {
    choice.value = stored(personId);
    try {
      const regionRequest = ability.can('read', 'Region') ? listRegions() : Promise.resolve([]);
      [locations.value, regions.value] = await Promise.all([listLocations(), regionRequest]);
      error.value = null;
      loaded.value = true;
    } catch (failure) {
      error.value = messageOf(failure);
    }
  }

  watch(
    () => session.person?.id,
    (personId) => {
      locations.value = [];
      regions.value = [];
      loaded.value = false;
      if (personId !== undefined) void load(personId);
    },
    { immediate: true },
  );

  /** Regions with a shop the person sees, named when the person may read regions. */
  const regionChoices = computed(() => {
    const ids = [...new Set(locations.value.map((l) => l.regionId))];
    return ids.map((id) => ({ id, name: regions.value.find((r) => r.id === id)?.name ?? `Region ${id}` })).sort((a, b) => a.name.localeCompare(b.name));
  });

  /**
   * The chosen scope; once the person's shops are known, all of them when it names none of their
   * shops or regions. Until then it is taken as stored, so the first lists already keep to it.
   */
  const scope = computed<Scope>(() => {
    const c = choice.value;
    if (!loaded.value) return c;
    if (c.kind === 'shop' && locations.value.some((l) => l.id === c.locationId)) return c;
    if (c.kind === 'region' && regionChoices.value.length > 1 && regionChoices.value.some((r) => r.id === c.regionId)) return c;
    return { kind: 'all' };
  });

  /** The shops in the scope. */
  const shops = computed(() => {
    const s = scope.value;
    if (s.kind === 'shop') return locations.value.filter((l) => l.id === s.locationId);
    if (s.kind === 'region') return locations.value.filter((l) => l.regionId === s.regionId);
    return locations.value;
  });

  const params = computed<ScopeParams>(() => {
    const s = scope.value;
    return s.kind === 'shop' ? { locationId: s.locationId } : s.kind === 'region' ? { regionId: s.regionId } : {};
  });

  /** The scope in words: "All 8 shops", "Central and Eastern region", "Denver (DEN)". */
  const label = computed(() => {
    const s = scope.value;
    if (!loaded.value) return '';
    if (s.kind === 'shop') {
      const shop = locations.value.find((l) => l.id === s.locationId)!;
      return `${shop.name} (${shop.code})`;
    }
    if (s.kind === 'region') return `${regionChoices.value.find((r) => r.id === s.regionId)!.name} region`;
    return locations.value.length === 1 ? `${locations.value[0]!.name} (${locations.value[0]!.code})` : `All ${locations.value.length} shops`;
  });

  function choose(next: Scope) {
    choice.value = next;
    const personId = session.person?.id;
    if (personId !== undefined) localStorage.setItem(storageKey(personId), JSON.stringify(next));
  }

  return { locations, regionChoices, scope, shops, params, label, error, choose };
});
