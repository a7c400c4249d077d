import { newCustomer, type DemoCustomer } from './customers.ts';
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
  const customer: SimCustomer = { ...newCustomer(random, shop.code, shop.name), shop, createdAt, vehicles: [] };
  const vehicle: SimVehicle = { ...newVehicle(random, new Date(createdAt).getUTCFullYear()), customer };
  customer.vehicles.push(vehicle);
  customers.push(customer);
  return { customer, vehicle };
}

/** Every build the shop took in its last two years (or since it opened), day by day up to the clock. */
export function simulateShop(random: Random, shop: Shop, nowMs: number): { customers: SimCustomer[]; builds: SimBuild[] } {
  const { profile, timeZone } = shop;
  const today = localDay(timeZone, nowMs);
  const openedDay = today - profile.openedDaysAgo;
  const mix = JOB_KINDS.map((kind) => [kind, profile.jobMix[kind]] as const);
  const customers: SimCustomer[] = [];
  const builds: SimBuild[] = [];
  for (let day = today - Math.min(HISTORY_DAYS, profile.openedDaysAgo); day <= today; day++) {
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
  }
  return { customers, builds };
}
