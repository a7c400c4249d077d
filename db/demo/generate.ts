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
  /** Regions and locations instead of the demo's own (a generated network, see network-shops.ts). */
  network?: { regions: readonly NetworkRegion[]; locations: readonly NetworkLocation[] };
}

export interface NetworkRegion {
  code: string;
  name: string;
}

/** Every demo shop's royalty terms apply from before its history, with a marketing fund of 1.5 % (invented). */
const DEMO_TERMS_FROM = '2020-01';
const DEMO_MARKETING_BASIS_POINTS = 150;

export interface NetworkLocation {
  region: string;
  code: string;
  name: string;
  timeZone: string;
  laborRateCents: number;
  royaltyBasisPoints: number;
}

interface StaffSeed {
  email: string;
  name: string;
  role: Role;
  region?: string;
  location?: string;
}

/** The named demo sign-ins (those whose place exists) plus generated staff: every shop has a lead, technicians and a clerk. */
function demoStaff(random: () => number, regions: readonly NetworkRegion[], locations: readonly NetworkLocation[]): StaffSeed[] {
  const exists = (s: StaffSeed) =>
    (!s.region || regions.some((r) => r.code === s.region)) && (!s.location || locations.some((l) => l.code === s.location));
  const staff: StaffSeed[] = DEMO_SIGN_INS.filter(exists);
  const taken = new Set(staff.map((s) => s.email));
  const person = (role: Role, place: { region?: string; location?: string }) => {
    // A large network runs out of name pairs: past a few tries, a number tells namesakes apart.
    for (let tries = 1; ; tries++) {
      const name = `${pick(random, FIRST_NAMES)} ${pick(random, LAST_NAMES)}`;
      const local = name.toLowerCase().replace(' ', '.');
      let email = `${local}@demo.busbar.test`;
      for (let n = 2; tries > 20 && taken.has(email); n++) email = `${local}${n}@demo.busbar.test`;
      if (taken.has(email)) continue;
      taken.add(email);
      staff.push({ email, name, role, ...place });
      return;
    }
  };
  for (const region of regions) {
    if (!staff.some((s) => s.region === region.code)) person('regional_manager', { region: region.code });
  }
  for (const location of locations) {
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
  const { regions, locations } = options.network ?? { regions: DEMO_REGIONS, locations: DEMO_LOCATIONS };
  await db.transaction().execute(async (trx) => {
    const regionIds = new Map<string, number>();
    for (const region of regions) {
      const row = await trx.insertInto('regions').values(region).returning('id').executeTakeFirstOrThrow();
      regionIds.set(region.code, row.id);
    }
    const locationIds = new Map<string, number>();
    for (const { region, royaltyBasisPoints, ...location } of locations) {
      const row = await trx
        .insertInto('locations')
        .values({ ...location, regionId: regionIds.get(region)! })
        .returning('id')
        .executeTakeFirstOrThrow();
      locationIds.set(location.code, row.id);
      await trx
        .insertInto('royaltyTerms')
        .values({ locationId: row.id, appliesFrom: DEMO_TERMS_FROM, royaltyBasisPoints, marketingBasisPoints: DEMO_MARKETING_BASIS_POINTS, createdBy: null, createdAt })
        .execute();
    }
    for (const person of demoStaff(random, regions, locations)) {
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
