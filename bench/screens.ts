import { call, type Person } from './client.ts';
import { LAST_MONTH, MONTH_BEFORE_LAST, QUARTER_BY_WEEK, rollupPath, YEAR_BY_MONTH } from './rollups.ts';
import { latency, type Latency } from './stats.ts';

/** The API requests behind every list, search, detail and report screen (and the session and pickers every page asks for), as the screen first asks them. */
export const SCREENS: readonly (readonly [label: string, path: (ids: Ids) => string])[] = [
  ['builds, first page', () => '/api/builds'],
  ['builds, delivered, by total', () => '/api/builds?status=delivered&sort=totalCents'],
  ['builds, booked, by date', () => '/api/builds?status=booked&sort=bookedFor&order=asc'],
  ['builds, text search: customer', () => '/api/builds?q=Holloway'],
  ['builds, text search: serial', () => '/api/builds?q=LK2506'],
  // Where the key figures, the comparison and the month close link: last month's deliveries, by delivery day as the list then reads them.
  ['builds, delivered last month', () => `/api/builds?status=delivered&deliveredFrom=${LAST_MONTH.from}&deliveredTo=${LAST_MONTH.to}&sort=deliveredOn`],
  // Rows 476 to 500: a page the demo's lead also has (540 builds in the shop).
  ['builds, page 20', () => '/api/builds?page=20&pageSize=25'],
  // The list's lead technician filter over every shop of the person's.
  ['builds, lead technicians to filter by', () => '/api/locations/technicians'],
  ['build detail', (ids) => `/api/builds/${ids.buildId}`],
  ['build detail, power plan', (ids) => `/api/builds/${ids.buildId}/plan`],
  ['build detail, history', (ids) => `/api/builds/${ids.buildId}/history`],
  ['build detail, plan revisions', (ids) => `/api/builds/${ids.buildId}/plan/revisions`],
  ['serial search, prefix', () => '/api/serials?q=NV25'],
  ['customers', () => '/api/customers'],
  ['customers, search', () => '/api/customers?q=Pemberton'],
  ['customer detail', (ids) => `/api/customers/${ids.customerId}`],
  ['customer detail, builds', (ids) => `/api/customers/${ids.customerId}/builds`],
  ['customer detail, saved plans', (ids) => `/api/customers/${ids.customerId}/plans`],
  ['catalog', () => '/api/catalog'],
  ['catalog item', (ids) => `/api/catalog/${ids.reliabilityItemId}`],
  ['vendors', () => '/api/vendors'],
  ['staff', () => '/api/staff'],
  ['staff member', (ids) => `/api/staff/${ids.staffId}`],
  // Every page asks for the person and their places when it opens.
  ['session', () => '/api/session'],
  ['locations, for pickers', () => '/api/locations'],
  ['regions, for pickers', () => '/api/regions'],
  ['locations, with settings', () => '/api/locations/settings'],
  ['location, technicians', (ids) => `/api/locations/${ids.locationId}/technicians`],
  ['audit log', () => '/api/audit'],
  ['audit log, builds only', () => '/api/audit?entity=build'],
  ['quick plans', () => '/api/plans'],
  ['quick plans, stock items', () => '/api/plans/stock'],
  ['outbox', () => '/api/outbox'],
  ['exports', () => '/api/exports'],
  ['claims, queue', () => '/api/claims'],
  ['claim detail', (ids) => `/api/claims/${ids.claimId}`],
  ['claims, overdue', () => '/api/claims?overdue=true'],
  ['claims, sent to vendor', () => '/api/claims?status=sent_to_vendor'],
  ['claims, filtered by vendor', () => '/api/claims?vendorId=1'],
  ['claims, house batteries', () => '/api/claims?category=house_battery'],
  ['claims, failed last month', () => `/api/claims?failedFrom=${LAST_MONTH.from}&failedTo=${LAST_MONTH.to}`],
  ['claims, logged last month', () => `/api/claims?loggedFrom=${LAST_MONTH.from}&loggedTo=${LAST_MONTH.to}`],
  ['reliability, by item', () => '/api/reliability'],
  ['reliability, by vendor, a year', () => '/api/reliability?groupBy=vendor&from=2025-01&to=2025-12'],
  ['reliability, one item', (ids) => `/api/reliability/item/${ids.reliabilityItemId}`],
  ['reliability, one category', () => '/api/reliability/category/house_battery'],
  // No screen asks for shops' rows (the API gives them a page of shops at a time): timed as the largest answers.
  ['roll-ups API, a page of shops, a year by month', () => rollupPath(YEAR_BY_MONTH)],
  // What the comparison screen asks for its key figures and trend: the sums without a row per shop.
  ['roll-ups, a year by month, sums only', () => `${rollupPath(YEAR_BY_MONTH)}&rows=none`],
  ['roll-ups API, a page of shops, a quarter by week', () => rollupPath(QUARTER_BY_WEEK)],
  // The comparison screen's table: each shop of the scope over the months, judged against the network.
  ['roll-ups, shops compared', () => `/api/rollups/locations?from=${YEAR_BY_MONTH.from.slice(0, 7)}&to=${YEAR_BY_MONTH.to.slice(0, 7)}`],
  ['month close, last month', () => `/api/closes?month=${LAST_MONTH.from.slice(0, 7)}`],
  ['month close, a region', (ids) => `/api/closes?month=2025-03&regionId=${ids.regionId}`],
  ['month close, the month before last (final)', () => `/api/closes?month=${MONTH_BEFORE_LAST}`],
  // The close status screen's default: the last twelve whole months.
  ['close status, twelve months', () => `/api/closes/status?from=${YEAR_BY_MONTH.from.slice(0, 7)}&to=${LAST_MONTH.from.slice(0, 7)}`],
];

export interface Ids {
  buildId: number;
  customerId: number;
  claimId: number;
  /** The item with the most failures the person sees: the largest single-item view. */
  reliabilityItemId: string;
  /** The first location the person sees, and its region. */
  locationId: number;
  regionId: number;
  /** The first person of the staff list. */
  staffId: number;
}

/**
 * Figures of one screen for one person: latencies and how many rows the answer held (a short page
 * at the demo's size is not like for like with a full one; a report's rows grow with the shops), or
 * the refusal they get (a lead reads no audit log). `sameRows`: the same list asked for a page of
 * the demo's rows, where the demo's page was shorter.
 */
export type ScreenFigure = (Latency & { rows: number | null; sameRows?: Latency }) | { status: number };

/** The rows of a list's page or of a whole list, a report's rows, the shops of a page of roll-ups or of a month close, or a build's history; null for a single record. */
function rowsOf(body: string): number | null {
  const answer = JSON.parse(body) as unknown;
  if (Array.isArray(answer)) return answer.length;
  const { items, locationIds, rows: reportRows, locations, entries } = answer as Record<string, unknown>;
  const rows = [items, locationIds, reportRows, locations, entries].find(Array.isArray);
  return rows ? rows.length : null;
}

/** `path` asking for pages of `rows` rows. */
function withPageSize(path: string, rows: number): string {
  const url = new URL(path, 'http://bench');
  url.searchParams.set('pageSize', String(rows));
  return `${url.pathname}${url.search}`;
}

/** The first record of one of the person's lists. */
async function firstOf(person: Person, list: string): Promise<number> {
  const answer = await call(person, 'GET', `/api/${list}?pageSize=1`);
  const first = (JSON.parse(answer.body) as { items: { id: number }[] }).items[0];
  if (!first) throw new Error(`the person sees no ${list}`);
  return first.id;
}

/** A build, a customer and a claim the person can open (the first of their lists), their most failed item and a region. */
export async function idsFor(person: Person): Promise<Ids> {
  const { rows } = JSON.parse((await call(person, 'GET', '/api/reliability')).body) as { rows: { key: string; failures: number }[] };
  const reliabilityItemId = rows.reduce((most, row) => (row.failures > most.failures ? row : most)).key;
  const [location] = JSON.parse((await call(person, 'GET', '/api/locations')).body) as { id: number; regionId: number }[];
  return {
    buildId: await firstOf(person, 'builds'),
    customerId: await firstOf(person, 'customers'),
    claimId: await firstOf(person, 'claims'),
    reliabilityItemId,
    locationId: location!.id,
    regionId: location!.regionId,
    staffId: await firstOf(person, 'staff'),
  };
}

/** One series of a screen's timed requests: a person at one size, the path they ask. */
interface Series {
  person: Person;
  path: string;
  times: number[];
}

/** Timed requests of one series in a row before the next series takes its turn. */
const TURN = 20;

/**
 * Each series' request `warmUps` times untimed, then `samples` times, the series taking turns of
 * TURN requests, each turn after one untimed request: this machine's speed drifts by half from one
 * minute to the next (a screen's p50 4.8 ms, then 3.1), which fell on whichever size ran at the
 * time and now falls on all alike. Turns of one request each ran every one 30–40 % slower than a
 * series alone (each app idle while the others answer): the untimed request keeps that out.
 */
async function timedInTurn(label: string, series: readonly Series[], samples: number, warmUps: number): Promise<void> {
  for (const { person, path } of series) for (let i = 0; i < warmUps; i++) await call(person, 'GET', path);
  for (let done = 0; done < samples; done += TURN) {
    for (const { person, path, times } of series) {
      await call(person, 'GET', path);
      for (let i = done; i < Math.min(samples, done + TURN); i++) {
        const answer = await call(person, 'GET', path);
        if (answer.status !== 200) throw new Error(`${label} answered ${answer.status} while timed: ${answer.body.slice(0, 200)}`);
        times.push(answer.ms);
      }
    }
  }
}

/**
 * Each screen's request for one person at each size (`people`, the demo's first), timed together
 * (see timedInTurn). A list whose page at the demo's size was shorter is timed once more at the
 * other sizes with pages of the demo's rows, like for like. Answers each size's figures, in order.
 */
export async function measureScreens(people: readonly Person[], samples: number, onScreen: (label: string) => void): Promise<Map<string, ScreenFigure>[]> {
  const ids = await Promise.all(people.map(idsFor));
  const figures = people.map(() => new Map<string, ScreenFigure>());
  for (const [label, path] of SCREENS) {
    onScreen(label);
    const firsts = await Promise.all(people.map((person, i) => call(person, 'GET', path(ids[i]!))));
    const answered = firsts.map((first) => (first.status === 200 ? { rows: rowsOf(first.body), paged: typeof (JSON.parse(first.body) as { pageSize?: unknown }).pageSize === 'number' } : null));
    const demoRows = answered[0]?.rows ?? null;
    const series = people.map((person, i): Series | null => (answered[i] ? { person, path: path(ids[i]!), times: [] } : null));
    const likeForLike = people.map((person, i): Series | null => {
      const own = answered[i];
      const shorter = i > 0 && own?.paged && own.rows !== null && demoRows !== null && demoRows > 0 && demoRows < own.rows;
      return shorter ? { person, path: withPageSize(path(ids[i]!), demoRows), times: [] } : null;
    });
    await timedInTurn(label, [...series, ...likeForLike].filter((s) => s !== null), samples, 5);
    people.forEach((_person, i) => {
      const timed = series[i];
      if (!timed) return void figures[i]!.set(label, { status: firsts[i]!.status });
      const figure: ScreenFigure = { ...latency(timed.times), rows: answered[i]!.rows };
      if (likeForLike[i]) figure.sameRows = latency(likeForLike[i]!.times);
      figures[i]!.set(label, figure);
    });
  }
  return figures;
}
