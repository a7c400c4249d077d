import type { RollupFigures, Rollups } from '@busbar/shared';

const whole = new Intl.NumberFormat('en-US');
const dollars = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD', maximumFractionDigits: 0 });
const tenth = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const day = (iso: string) => new Date(`${iso}T12:00:00Z`).toLocaleDateString('en-US', { weekday: 'short', month: 'short', day: 'numeric', year: 'numeric', timeZone: 'UTC' });

export interface DigestPlace {
  label: string;
  /** Its figures last week, the week before and the same week a year before (absent: nothing happened). */
  week?: RollupFigures;
  before?: RollupFigures;
  yearBefore?: RollupFigures;
}

/** "5 (week before 4, a year before 3)" */
function withComparisons(place: DigestPlace, read: (f: RollupFigures) => number | null | undefined, format: (n: number) => string): string | null {
  const value = (f: RollupFigures | undefined) => (f ? read(f) : 0);
  const now = value(place.week);
  if (now === null || now === undefined) return null;
  const then = [['week before', value(place.before)], ['a year before', value(place.yearBefore)]] as const;
  const beside = then.filter(([, v]) => v !== null && v !== undefined).map(([label, v]) => `${label} ${format(v!)}`);
  return `${format(now)}${beside.length ? ` (${beside.join(', ')})` : ''}`;
}

function placeLines(place: DigestPlace): string[] {
  const figures: [string, string | null][] = [
    ['Builds delivered', withComparisons(place, (f) => f.buildsDelivered, (n) => whole.format(n))],
    ['Revenue', place.week && !('revenueCents' in place.week) ? null : withComparisons(place, (f) => f.revenueCents, (n) => dollars.format(n / 100))],
    ['Claims opened', withComparisons(place, (f) => f.claimsOpened, (n) => whole.format(n))],
    ['Claims per 100 builds', place.week?.claimsPer100Builds == null ? null : tenth.format(place.week.claimsPer100Builds)],
  ];
  return [place.label, ...figures.filter(([, text]) => text !== null).map(([label, text]) => `  ${label}: ${text}`)];
}

/**
 * The weekly e-mail's text: each place (the person's shops, their region when they see it whole,
 * the network) with last week's figures beside the week before and the same week a year before.
 */
export function digestText(input: { name: string; week: { start: string; end: string }; places: DigestPlace[]; link: string; roleWords: string }): { subject: string; text: string } {
  const { start, end } = input.week;
  return {
    subject: `Busbar: last week's figures (${day(start)} to ${day(end)})`,
    text: [
      `Hello ${input.name.split(' ')[0]},`,
      '',
      `Last week, ${day(start)} to ${day(end)}, each shop's week in its own time zone:`,
      '',
      ...input.places.flatMap((place) => [...placeLines(place), '']),
      `Open Busbar: ${input.link}`,
      '',
      `You get this e-mail each Monday as ${input.roleWords}. To stop it, open Busbar's Overview and turn off "Weekly e-mail".`,
    ].join('\n'),
  };
}

/** The places of a roll-up of one week: each of the person's shops (`names`), whole regions, the network. */
export function placesOf(rollups: Rollups, names: Map<number, string>, regionNames: Map<number, string>): DigestPlace[] {
  const [asked] = rollups.periods;
  if (!asked) return [];
  const pick = <R extends { period: string }>(rows: R[]) => ({
    week: rows.find((r) => r.period === asked.period),
    before: rows.find((r) => r.period === asked.previous),
    yearBefore: rows.find((r) => r.period === asked.lastYear),
  });
  return [
    ...[...names.keys()].map((id) => ({ label: names.get(id)!, ...pick(rollups.rows.filter((r) => r.locationId === id)) })),
    ...[...new Set(rollups.regions.map((r) => r.regionId))].map((id) => ({ label: `${regionNames.get(id) ?? 'Your'} region`, ...pick(rollups.regions.filter((r) => r.regionId === id)) })),
    { label: 'The whole network', ...pick(rollups.network) },
  ];
}
