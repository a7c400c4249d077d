import { dayOfIso, isoDay } from '@busbar/calc';
import type { BuildView } from '@busbar/shared';

/** The seven days from `today` (YYYY-MM-DD) on. */
export function weekFrom(today: string): string[] {
  const first = dayOfIso(today);
  return Array.from({ length: 7 }, (_, i) => isoDay(first + i));
}

/** The Monday (YYYY-MM-DD) of the week `today` lies in: the week's deliveries count from it. */
export function mondayOf(today: string): string {
  const day = dayOfIso(today);
  // 1970-01-01 was a Thursday: day 4 of a week that begins on Monday 1969-12-29 (day -3).
  return isoDay(day - (((day + 3) % 7) + 7) % 7);
}

/** The week's bookings by day, in date order; days with none are left out. */
export function byDay(builds: BuildView[], days: string[]): { day: string; builds: BuildView[] }[] {
  return days.map((day) => ({ day, builds: builds.filter((b) => b.bookedFor === day) })).filter((d) => d.builds.length > 0);
}
