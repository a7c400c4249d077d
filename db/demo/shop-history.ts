import { newCustomer, type Area, type DemoCustomer } from './customers.ts';
import { between, chance, poisson, weighted, type Random } from './draw.ts';
import { designJob, type Job } from './jobs.ts';
import { localDay, monthOf, weekday } from '@busbar/calc';
import { HISTORY_DAYS, JOB_KINDS, MONTH_FACTORS, WEEKDAY_FACTORS, type LocationProfile } from './profiles.ts';
import { pick } from './random.ts';
import { planTimeline, type StatusEvent } from './timeline.ts';
import { newVehicle, type DemoVehicle } from './vehicles.ts';

/** A shop as the history needs it: its row, its people and its character. */
export interface Shop {
  id: number;
  code: string;
  name: string;
  timeZone: string;
  laborRateCents: number;
  leadId: number;
  technicianIds: number[];
  profile: LocationProfile;
  /** Where the shop's customers live, for their addresses and phone numbers. */
  area: Area;
}

export interface SimCustomer extends DemoCustomer {
  shop: Shop;
  createdAt: number;
  vehicles: SimVehicle[];
}

export interface SimVehicle extends DemoVehicle {
  customer: SimCustomer;
}

export interface SimBuild {
  shop: Shop;
  customer: SimCustomer;
  vehicle: SimVehicle;
  createdAt: number;
  job: Job;
  laborHours: number;
  leadTechnicianId: number;
  /** Status changes up to the clock; later ones have not happened yet. */
  events: StatusEvent[];
  bookedForDay: number | null;
}

const WEEKDAY_TOTAL = WEEKDAY_FACTORS.reduce((sum, f) => sum + f, 0);
const RETURNING_SHARE = 0.18;

/** Who the build is for: mostly someone new, sometimes a returning customer, now and then with another vehicle. */
function customerFor(random: Random, shop: Shop, customers: SimCustomer[], createdAt: number) {
  if (customers.length > 0 && chance(random, RETURNING_SHARE)) {
    const customer = pick(random, customers);
    if (chance(random, 0.7)) return { customer, vehicle: pick(random, customer.vehicles) };
    const vehicle: SimVehicle = { ...newVehicle(random, new Date(createdAt).getUTCFullYear()), customer };
    customer.vehicles.push(vehicle);
    return { customer, vehicle };
  }
  const customer: SimCustomer = { ...newCustomer(random, shop.area, shop.area.city ?? shop.name), shop, createdAt, vehicles: [] };
  const vehicle: SimVehicle = { ...newVehicle(random, new Date(createdAt).getUTCFullYear()), customer };
  customer.vehicles.push(vehicle);
  customers.push(customer);
  return { customer, vehicle };
}

/**
 * The shop's history as it happens, one local day at a time over the last `historyDays` (days
 * before it opened stay empty): each step answers the builds taken that day. New customers join
 * `customers`, where later builds find them again.
 */
export function* shopDays(random: Random, shop: Shop, nowMs: number, historyDays: number, customers: SimCustomer[]): Generator<SimBuild[]> {
  const { profile, timeZone } = shop;
  const today = localDay(timeZone, nowMs);
  const openedDay = today - profile.openedDaysAgo;
  const mix = JOB_KINDS.map((kind) => [kind, profile.jobMix[kind]] as const);
  for (let day = today - historyDays; day <= today; day++) {
    const builds: SimBuild[] = [];
    if (day < openedDay) {
      yield builds;
      continue;
    }
    // A new shop takes a few months to fill its calendar.
    const rampUp = Math.min(1, 0.35 + (0.65 * (day - openedDay)) / 120);
    const mean = ((profile.weeklyBuilds * MONTH_FACTORS[monthOf(day)]! * WEEKDAY_FACTORS[weekday(day)]!) / WEEKDAY_TOTAL) * rampUp;
    for (let n = poisson(random, mean); n > 0; n--) {
      const minute = between(random, 480, 1050);
      const job = designJob(random, weighted(random, mix), profile.northvaneShare);
      const laborHours = Math.round(job.laborHours * profile.laborFactor * 4) / 4;
      const timeline = planTimeline(random, timeZone, day, minute, laborHours);
      const created = timeline.events[0]!.at;
      if (created > nowMs) continue;
      builds.push({
        shop,
        ...customerFor(random, shop, customers, created),
        createdAt: created,
        job,
        laborHours,
        leadTechnicianId: pick(random, shop.technicianIds),
        events: timeline.events.filter((e) => e.at <= nowMs),
        bookedForDay: timeline.bookedForDay,
      });
    }
    yield builds;
  }
}

/** Every build the shop took in its last two years (or since it opened), day by day up to the clock. */
export function simulateShop(random: Random, shop: Shop, nowMs: number): { customers: SimCustomer[]; builds: SimBuild[] } {
  const customers: SimCustomer[] = [];
  const builds: SimBuild[] = [];
  for (const day of shopDays(random, shop, nowMs, HISTORY_DAYS, customers)) builds.push(...day);
  return { customers, builds };
}
