import type { LocationQuery } from 'vue-router';
import { positiveInt } from '../../composables/usePagedList.ts';

/** The locations list's filters as the address bar holds them. */
export function readLocationFilters(query: LocationQuery) {
  const q = typeof query.q === 'string' ? query.q.trim() : '';
  return { q: q || undefined, regionId: positiveInt(query.regionId) };
}
