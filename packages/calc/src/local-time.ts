/**
 * Local calendar arithmetic: periods are cut in each location's own IANA time zone. A local day
 * is counted in days since 1970-01-01 on the location's calendar; a moment is a local day and a
 * minute of that day. Offsets come from the platform's time zone database (Intl).
 */
export const DAY_MS = 86_400_000;

const formatters = new Map<string, Intl.DateTimeFormat>();
const offsets = new Map<string, number>();

function formatter(zone: string): Intl.DateTimeFormat {
  let format = formatters.get(zone);
  if (!format) {
    format = new Intl.DateTimeFormat('en-US', {
      timeZone: zone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
    });
    formatters.set(zone, format);
  }
  return format;
}

/** The wall-clock time in `zone` at `ms`, read back as if it were UTC. */
function wallClockMs(zone: string, ms: number): number {
  const part = Object.fromEntries(formatter(zone).formatToParts(new Date(ms)).map((p) => [p.type, Number(p.value)]));
  return Date.UTC(part.year!, part.month! - 1, part.day!, part.hour!, part.minute!);
}

/** Minutes `zone` is ahead of UTC during the working hours of a local day (DST changes at night). */
function offsetMinutes(zone: string, day: number): number {
  const key = `${zone} ${day}`;
  let offset = offsets.get(key);
  if (offset === undefined) {
    const middayUtc = day * DAY_MS + 18 * 3_600_000;
    offset = (wallClockMs(zone, middayUtc) - middayUtc) / 60_000;
    offsets.set(key, offset);
  }
  return offset;
}

/** The UTC instant (ms) of a local day and minute in `zone`. */
export function localMoment(zone: string, day: number, minute: number): number {
  return day * DAY_MS + (minute - offsetMinutes(zone, day)) * 60_000;
}

/** The local day in `zone` at the instant `ms`. */
export function localDay(zone: string, ms: number): number {
  return Math.floor(wallClockMs(zone, ms) / DAY_MS);
}

/** The local day of a YYYY-MM-DD date. */
export function dayOfIso(date: string): number {
  return Math.floor(Date.parse(`${date}T00:00:00Z`) / DAY_MS);
}

/** YYYY-MM-DD of a local day. */
export function isoDay(day: number): string {
  return new Date(day * DAY_MS).toISOString().slice(0, 10);
}

/** 0 for Sunday to 6 for Saturday (1970-01-01 was a Thursday). */
export function weekday(day: number): number {
  return (day + 4) % 7;
}

/** 0 for January to 11 for December. */
export function monthOf(day: number): number {
  return new Date(day * DAY_MS).getUTCMonth();
}

/** The working day (Monday to Saturday) `count` working days after `day`. */
export function addWorkdays(day: number, count: number): number {
  let next = day;
  for (let left = count; left > 0; ) {
    next++;
    if (weekday(next) !== 0) left--;
  }
  return next;
}

/** The date `months` calendar months after a YYYY-MM-DD date, the day kept or, past the month's end, its last day (2024-01-31 + 1 month = 2024-02-29): a warranty's end. */
export function addMonthsIso(date: string, months: number): string {
  const [year, month, day] = date.split('-').map(Number) as [number, number, number];
  const monthIndex = year * 12 + (month - 1) + months;
  const lastDay = new Date(Date.UTC(Math.floor(monthIndex / 12), (monthIndex % 12) + 1, 0)).getUTCDate();
  return isoDay(Math.floor(Date.UTC(Math.floor(monthIndex / 12), monthIndex % 12, Math.min(day, lastDay)) / DAY_MS));
}
