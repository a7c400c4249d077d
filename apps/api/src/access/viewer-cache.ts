import type { Db } from '@busbar/db';
import { loadViewer, type Viewer } from './viewer.ts';

/**
 * Each signed-in person's ability, built once and kept until their access may have changed.
 * Every write that changes who may do what (role granted or removed, person deactivated,
 * reactivated or activated) calls `forgetViewers()`; roles change rarely, so it forgets everyone.
 * A load that began before such a write is not kept, so a slow read cannot bring old rules back.
 * Entries also lapse after a minute, which bounds how long a change made outside this process
 * (another process on the same database) can go unseen.
 */
const MAX_AGE_MS = 60_000;
const MAX_ENTRIES = 10_000;

interface Entry {
  viewer: Viewer;
  generation: number;
  loadedAt: number;
}

let generation = 0;
// One cache per database, so two apps in one process (tests, the benchmark) never share people.
const caches = new WeakMap<Db, Map<number, Entry>>();

/** Drops every cached ability; call it in the same step as any change of roles or of a person's status. */
export function forgetViewers(): void {
  generation++;
}

/** The person with their ability, from the cache when still valid; null when they may not sign in. */
export async function cachedViewer(db: Db, userId: number): Promise<Viewer | null> {
  let cache = caches.get(db);
  if (!cache) caches.set(db, (cache = new Map()));
  const hit = cache.get(userId);
  if (hit && hit.generation === generation && Date.now() - hit.loadedAt < MAX_AGE_MS) return hit.viewer;
  const started = generation;
  const viewer = await loadViewer(db, userId);
  if (viewer && started === generation) {
    if (cache.size >= MAX_ENTRIES) cache.clear();
    cache.set(userId, { viewer, generation: started, loadedAt: Date.now() });
  }
  return viewer;
}
