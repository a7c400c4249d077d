/** One row: how many times who may do what has changed (raised by triggers, migration 022). */
export interface AccessChangesTable {
  id: number;
  generation: number;
}
