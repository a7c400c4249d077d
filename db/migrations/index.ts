import type { Migration } from 'kysely';
import * as createFoundation from './001-create-foundation.ts';
import * as createBuilds from './002-create-builds.ts';
import * as createPowerPlans from './003-create-power-plans.ts';

/** Every migration, in order. A new one is added here by hand: nothing is discovered from the disk. */
export const migrations: Record<string, Migration> = {
  '001-create-foundation': createFoundation,
  '002-create-builds': createBuilds,
  '003-create-power-plans': createPowerPlans,
};
