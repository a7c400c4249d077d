import type { Area } from './customers.ts';
import { DEMO_AREAS } from './customers.ts';
import { between, chance, type Random } from './draw.ts';
import type { NetworkLocation, NetworkRegion } from './generate.ts';
import { CANADIAN_CITIES, US_CITIES, type CityRow } from './network-cities.ts';
import { DEMO_LOCATIONS, DEMO_REGIONS } from './network.ts';
import { JOB_KINDS, LOCATION_PROFILES, type JobKind, type LocationProfile } from './profiles.ts';

/** Second and later shops in one city take the name of their part of town (invented). */
const DISTRICTS = ['Northgate', 'Riverside', 'Eastfield', 'Westbrook', 'Southpoint', 'Airport Road', 'Hillcrest', 'Old Town'] as const;

/** How much busier a shop of a large network is than the demo's small one: about 1,000 builds a shop a year. */
const NETWORK_BUSYNESS = 4.5;

export interface GeneratedNetwork {
  regions: NetworkRegion[];
  locations: NetworkLocation[];
  profiles: Record<string, LocationProfile>;
  areas: Record<string, Area>;
}

const regionOf = ([, , zone]: CityRow, canadian: boolean) =>
  canadian ? 'CAN' : /Los_Angeles|Denver|Boise|Phoenix|Anchorage/.test(zone) ? 'WEST' : 'EAST';

/** A job mix near the network's usual one, each share moved by up to a third. */
function mixFor(random: Random): Record<JobKind, number> {
  const usual = LOCATION_PROFILES['DEN']!.jobMix;
  return Object.fromEntries(JOB_KINDS.map((kind) => [kind, usual[kind] * (0.67 + random() * 0.66)])) as Record<JobKind, number>;
}

/**
 * A network of `count` shops: the demo's eight first (busier, keeping their character), then shops
 * in the cities of network-cities.ts, a second shop in a city once every city has one, and so on.
 * Most shops are older than the history; about one in four opened during it.
 */
export function generateNetwork(random: Random, count: number, historyDays: number): GeneratedNetwork {
  const network: GeneratedNetwork = { regions: [], locations: [], profiles: {}, areas: {} };
  for (const location of DEMO_LOCATIONS.slice(0, count)) {
    network.locations.push(location);
    const profile = LOCATION_PROFILES[location.code]!;
    network.profiles[location.code] = { ...profile, weeklyBuilds: profile.weeklyBuilds * NETWORK_BUSYNESS };
    network.areas[location.code] = DEMO_AREAS[location.code]!;
  }
  const cities = [...US_CITIES.map((c) => [c, false] as const), ...CANADIAN_CITIES.map((c) => [c, true] as const)];
  // A city whose name another city has too (Portland, Charleston) is told apart by its state.
  const cityNames = [...DEMO_LOCATIONS.map((l) => l.name), ...cities.map(([[, city]]) => city)];
  const shopName = (city: string, state: string, round: number) => {
    const name = cityNames.indexOf(city) === cityNames.lastIndexOf(city) ? city : `${city}, ${state}`;
    return round === 0 ? name : `${name} ${DISTRICTS[(round - 1) % DISTRICTS.length]}`;
  };
  for (let n = 0; network.locations.length < count; n++) {
    const [city, canadian] = cities[n % cities.length]!;
    const round = Math.floor(n / cities.length);
    const [code, name, timeZone, state, areaCode, postalPrefix] = city;
    const shopCode = round === 0 ? code : `${code}${round + 1}`;
    network.locations.push({
      region: regionOf(city, canadian),
      code: shopCode,
      name: shopName(name, state, round),
      timeZone,
      laborRateCents: between(random, 10500, 16500, 500),
      royaltyBasisPoints: between(random, 550, 650, 50),
    });
    network.areas[shopCode] = { state, areaCode, zipPrefix: postalPrefix, city: name, ...(canadian ? { country: 'CA' as const } : {}) };
    network.profiles[shopCode] = {
      weeklyBuilds: between(random, 14, 30, 0.1),
      openedDaysAgo: chance(random, 0.75) ? historyDays + between(random, 0, 3000) : between(random, 60, historyDays),
      laborFactor: between(random, 0.85, 1.25, 0.05),
      jobMix: mixFor(random),
      northvaneShare: between(random, 0.15, 0.5, 0.01),
    };
  }
  const used = new Set(network.locations.map((l) => l.region));
  network.regions = [...DEMO_REGIONS, { code: 'CAN', name: 'Canada' }].filter((r) => used.has(r.code));
  return network;
}
