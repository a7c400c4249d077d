import type { BuildStatus } from '@busbar/shared';
import { between, chance, weighted, type Random } from './draw.ts';
import { addWorkdays, localMoment } from '@busbar/calc';
import { pick } from './random.ts';

/** One change of status; `by` says who makes it: the shop's lead plans, the lead technician works. */
export interface StatusEvent {
  at: number;
  from: BuildStatus | null;
  to: BuildStatus;
  by: 'lead' | 'technician';
  note: string;
}

export interface Timeline {
  events: StatusEvent[];
  /** The local day the build is booked into the bay, once it is booked. */
  bookedForDay: number | null;
}

const CANCEL_REASONS = [
  'Customer chose to wait until next season',
  'Vehicle sold before the install',
  'No reply to the quote after three follow-ups',
  'Customer went with a smaller setup elsewhere',
  'Over budget for now; will come back in the spring',
] as const;

const REWORK_NOTES = [
  'Final check: re-torqued a battery lug',
  'Final check: moved the main fuse closer to the battery',
  'Final check: re-routed a cable away from the exhaust',
] as const;

const MINUTES_OPEN = [540, 1020] as const;

/**
 * The whole life of a build from its first draft, as the shop would live it: quoted within days,
 * booked a week or two later, in the bay on the booked day for as many working days as its
 * hours take, checked, and delivered; about one build in eleven is cancelled before the bay.
 */
export function planTimeline(random: Random, zone: string, createdDay: number, createdMinute: number, laborHours: number): Timeline {
  const events: StatusEvent[] = [];
  let last = localMoment(zone, createdDay, createdMinute);
  events.push({ at: last, from: null, to: 'draft', by: 'lead', note: '' });
  const step = (day: number, minute: number, from: BuildStatus, to: BuildStatus, by: StatusEvent['by'], note = '') => {
    last = Math.max(localMoment(zone, day, minute), last + between(random, 10, 90) * 60_000);
    events.push({ at: last, from, to, by, note });
  };
  const open = () => between(random, ...MINUTES_OPEN);
  const cancelFrom = chance(random, 0.09) ? weighted<BuildStatus>(random, [['draft', 3], ['quoted', 5], ['booked', 2]]) : null;
  const cancelled = (from: BuildStatus, day: number, bookedForDay: number | null): Timeline => {
    step(day, open(), from, 'cancelled', 'lead', pick(random, CANCEL_REASONS));
    return { events, bookedForDay };
  };

  if (cancelFrom === 'draft') return cancelled('draft', addWorkdays(createdDay, between(random, 1, 10)), null);
  const quotedDay = addWorkdays(createdDay, between(random, 0, 3));
  step(quotedDay, open(), 'draft', 'quoted', 'lead');
  if (cancelFrom === 'quoted') return cancelled('quoted', addWorkdays(quotedDay, between(random, 2, 15)), null);
  const bookedDay = addWorkdays(quotedDay, between(random, 1, 10));
  const bookedForDay = addWorkdays(bookedDay, between(random, 3, 25));
  step(bookedDay, open(), 'quoted', 'booked', 'lead');
  if (cancelFrom === 'booked') return cancelled('booked', addWorkdays(bookedDay, between(random, 1, 3)), bookedForDay);

  step(bookedForDay, between(random, 450, 570), 'booked', 'in_bay', 'technician');
  const checkDay = addWorkdays(bookedForDay, Math.max(0, Math.ceil(laborHours / 8) - 1));
  step(checkDay, between(random, 840, 1020), 'in_bay', 'quality_check', 'technician');
  if (chance(random, 0.05)) {
    step(checkDay, 0, 'quality_check', 'in_bay', 'technician', pick(random, REWORK_NOTES));
    step(checkDay, 0, 'in_bay', 'quality_check', 'technician');
  }
  const nextMorning = chance(random, 0.5);
  step(nextMorning ? addWorkdays(checkDay, 1) : checkDay, nextMorning ? between(random, 540, 720) : 0, 'quality_check', 'delivered', 'technician');
  return { events, bookedForDay };
}
