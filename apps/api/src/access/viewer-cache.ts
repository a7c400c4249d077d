import type { Db } from '@busbar/db';
import { loadViewer, type Viewer } from './viewer.ts';

/**
 * Each signed-in person's ability, built once and kept while who may do what is unchanged: the
 * database counts every change to people, roles, locations and regions (migration 022, by
 * triggers, in the change's own transaction), and an entry built at an older count is built
 * again. The count is read on every request, so a change made by any process, a worker thread
 * or a script is seen by the next request everywhere.
 */
const MAX_ENTRIES = 10_000;

interface Entry {
  viewer: Viewer;
  generation: number;
}

// One cache per database, so two apps in one process (tests, the benchmark) never share people.
const caches = new WeakMap<Db, Map<number, Entry>>();

/** The person with their ability, from the cache when still valid; null when they may not sign in. */
export async function cachedViewer(db: Db, userId: number): Promise<Viewer | null> {
  let cache = caches.get(db);
  if (!cache) caches.set(db, (cache = new Map()));
  // Read before loading: a change committed during the load leaves the entry at the older count.
  const { generation } = await db.selectFrom('accessChanges').select('generation').executeTakeFirstOrThrow();
  const hit = cache.get(userId);
  if (hit?.generation === generation) return hit.viewer;
  const viewer = await loadViewer(db, userId);
  if (viewer) {
    if (cache.size >= MAX_ENTRIES) cache.clear();
    cache.set(userId, { viewer, generation });
  } else cache.delete(userId);
  return viewer;
}
