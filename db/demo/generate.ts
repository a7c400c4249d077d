import type { Role } from '@busbar/shared';
import type { Db } from '../connect.ts';
import { seedDemoHistory } from './history.ts';
import { DEMO_LOCATIONS, DEMO_REGIONS, DEMO_SIGN_INS, FIRST_NAMES, LAST_NAMES } from './network.ts';
import { pick, seededRandom } from './random.ts';

/** The one password of every demo sign-in, printed in the README. */
export const DEMO_PASSWORD = 'kestrel-demo-2026';

export interface DemoOptions {
  /** Hash of DEMO_PASSWORD; one hash serves every demo person, since they share the password. */
  passwordHash: string;
  now: Date;
  seed?: number;
  /** Also two years of vendors, catalog, customers and builds up to `now` (see history.ts). */
  history?: boolean;
}

interface StaffSeed {
  email: string;
  name: string;
  role: Role;
  region?: string;
  location?: string;
}

/** The named demo sign-ins plus generated staff: every shop has a lead, technicians and a clerk. */
function demoStaff(random: () => number): StaffSeed[] {
  const staff: StaffSeed[] = [...DEMO_SIGN_INS];
  const taken = new Set(staff.map((s) => s.email));
  const person = (role: Role, place: { region?: string; location?: string }) => {
    for (;;) {
      const name = `${pick(random, FIRST_NAMES)} ${pick(random, LAST_NAMES)}`;
      const email = `${name.toLowerCase().replace(' ', '.')}@demo.busbar.test`;
      if (taken.has(email)) continue;
      taken.add(email);
      staff.push({ email, name, role, ...place });
      return;
    }
  };
  person('regional_manager', { region: 'EAST' });
  for (const location of DEMO_LOCATIONS) {
    const has = (role: Role) => staff.some((s) => s.location === location.code && s.role === role);
    if (!has('location_lead')) person('location_lead', { location: location.code });
    const technicians = 2 + Math.floor(random() * 3) - (has('technician') ? 1 : 0);
    for (let i = 0; i < technicians; i++) person('technician', { location: location.code });
    if (!has('warranty_clerk')) person('warranty_clerk', { location: location.code });
  }
  return staff;
}

/** Fills an empty database with the invented demo network. Deterministic for a seed and clock. */
export async function seedDemoNetwork(db: Db, options: DemoOptions): Promise<void> {
  const seed = options.seed ?? 20261202;
  const random = seededRandom(seed);
  const createdAt = options.now.toISOString();
  await db.transaction().execute(async (trx) => {
    const regionIds = new Map<string, number>();
    for (const region of DEMO_REGIONS) {
      const row = await trx.insertInto('regions').values(region).returning('id').executeTakeFirstOrThrow();
      regionIds.set(region.code, row.id);
    }
    const locationIds = new Map<string, number>();
    for (const { region, ...location } of DEMO_LOCATIONS) {
      const row = await trx
        .insertInto('locations')
        .values({ ...location, regionId: regionIds.get(region)! })
        .returning('id')
        .executeTakeFirstOrThrow();
      locationIds.set(location.code, row.id);
    }
    for (const person of demoStaff(random)) {
      const user = await trx
        .insertInto('users')
        .values({ email: person.email, name: person.name, passwordHash: options.passwordHash, status: 'active', createdAt })
        .returning('id')
        .executeTakeFirstOrThrow();
      const regionId = person.region ? regionIds.get(person.region)! : null;
      const locationId = person.location ? locationIds.get(person.location)! : null;
      const scope = locationId ? 'location' : regionId ? 'region' : 'network';
      await trx
        .insertInto('roleAssignments')
        .values({ userId: user.id, role: person.role, scope, regionId, locationId, createdAt, createdBy: null })
        .execute();
    }
    if (options.history) await seedDemoHistory(trx, { now: options.now, seed });
  });
}
