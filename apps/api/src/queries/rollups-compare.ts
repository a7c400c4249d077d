import { funnelSide, median, MODIFIED_Z_LIMIT, modifiedZScores } from '@busbar/calc';
import type { Db } from '@busbar/db';
import { COMPARED_FIGURES, fewestPeriods, type ComparedFigures, type ComparisonQuery, type LocationComparison, type RollupFigures } from '@busbar/shared';
import { sql } from 'kysely';
import type { LocationScope } from '../access/locations.ts';
import { figuresJson, summed, type MoneyReads } from './rollups-json.ts';
import { moneyReads, type MoneyScopes } from './rollups-report.ts';

type Outliers = LocationComparison['locations'][number]['outliers'];

/** Claims per 100 builds stand apart outside the Poisson funnel at this confidence, as on the reliability funnel. */
const FUNNEL_CONFIDENCE = 0.998;
const PRICE_FIGURES: readonly string[] = ['revenueCents', 'averageTicketCents', 'warrantyCostShare'];
const COST_FIGURES: readonly string[] = ['grossMarginShare'];

/** The roll-up figures the compared ones are read from: the job mix and the rest are not summed for nothing. */
const FROM_FIGURES = ['buildsDelivered', 'claimsOpened', 'revenueCents', 'averageTicketCents', 'grossMarginCents', 'laborHoursPerBuild', 'claimsPer100Builds', 'warrantyCostShare'] as const;

type FromFigures = Pick<RollupFigures, (typeof FROM_FIGURES)[number]>;

function compared(all: FromFigures): ComparedFigures {
  return {
    buildsDelivered: all.buildsDelivered,
    claimsOpened: all.claimsOpened,
    revenueCents: all.revenueCents!,
    averageTicketCents: all.averageTicketCents!,
    grossMarginShare: all.revenueCents! > 0 ? all.grossMarginCents! / all.revenueCents! : null,
    laborHoursPerBuild: all.laborHoursPerBuild,
    claimsPer100Builds: all.claimsPer100Builds,
    warrantyCostShare: all.warrantyCostShare!,
  };
}

/** `figures` (or outlier marks) without the money the person may not read. */
function moneyShown<T extends object>(figures: T, reads: MoneyReads): T {
  if (reads.prices && reads.costs) return figures;
  return Object.fromEntries(Object.entries(figures).filter(([field]) => (reads.prices || !PRICE_FIGURES.includes(field)) && (reads.costs || !COST_FIGURES.includes(field)))) as T;
}

/** Marks of the figures of `figures` that stand apart from the rest (see LocationComparison). */
function outliersOf(figures: { locationId: number; figures: ComparedFigures }[]): Map<number, Outliers> {
  const marks = new Map(figures.map((f) => [f.locationId, {} as Outliers]));
  for (const field of COMPARED_FIGURES.filter((f) => f !== 'claimsPer100Builds')) {
    const known = figures.filter((f) => f.figures[field] !== null && f.figures[field] !== undefined);
    modifiedZScores(known.map((f) => f.figures[field]!)).forEach((z, i) => {
      if (Math.abs(z) > MODIFIED_Z_LIMIT) marks.get(known[i]!.locationId)![field] = z > 0 ? 'high' : 'low';
    });
  }
  const delivered = figures.reduce((n, f) => n + f.figures.buildsDelivered, 0);
  const claims = figures.reduce((n, f) => n + f.figures.claimsOpened, 0);
  if (claims === 0) return marks;
  for (const f of figures) {
    const side = funnelSide(f.figures.claimsOpened, (claims / delivered) * f.figures.buildsDelivered, { confidence: FUNNEL_CONFIDENCE });
    if (side !== 'within') marks.get(f.locationId)!.claimsPer100Builds = side === 'above' ? 'high' : 'low';
  }
  return marks;
}

/**
 * Every location of the network summed over the months (from the roll-ups of the fewest whole
 * years, quarters and months that make them up) and judged against all the others that delivered
 * a build in them; then only the person's locations kept.
 * The medians and marks come from the whole network, so a lead's shop is compared with shops
 * they never see. A location of the scope that delivered nothing is listed with no marks.
 */
export async function compareLocations(db: Db, query: ComparisonQuery, scope: LocationScope, money: MoneyScopes): Promise<LocationComparison> {
  const periods = fewestPeriods(query.from, query.to);
  const grains = [...new Set(periods.map((p) => p.grain))].map((grain) => sql`(f.grain = ${grain} and f.period in (${sql.join(periods.filter((p) => p.grain === grain).map((p) => p.key))}))`);
  const { rows } = await sql<{ id: number; json: string }>`
    select l.id, ${figuresJson([], summed, { prices: true, costs: true }, FROM_FIGURES)} as json
    from locations l left join rollup_figures f on f.location_id = l.id and (${sql.join(grains, sql` or `)})
    group by l.id order by l.id`.execute(db);
  const all = rows.map((row) => ({ locationId: row.id, figures: compared(JSON.parse(row.json) as FromFigures) }));
  const active = all.filter((f) => f.figures.buildsDelivered > 0);
  const marks = outliersOf(active);

  const middle = (values: number[]) => (values.length > 0 ? median(values) : 0);
  const medians: ComparedFigures = { buildsDelivered: middle(active.map((f) => f.figures.buildsDelivered)), claimsOpened: middle(active.map((f) => f.figures.claimsOpened)) };
  for (const field of COMPARED_FIGURES.filter((f) => f !== 'buildsDelivered')) {
    const values = active.map((f) => f.figures[field]).filter((v): v is number => v !== null && v !== undefined);
    medians[field] = values.length > 0 ? median(values) : null;
  }
  const reads = moneyReads(money);
  const inScope = (id: number) => scope === 'all' || scope.includes(id);
  return {
    from: query.from,
    to: query.to,
    comparedLocations: active.length,
    median: moneyShown(medians, reads(scope === 'all' ? rows.map((l) => l.id) : scope)),
    locations: all
      .filter((f) => inScope(f.locationId))
      .map((f) => ({ locationId: f.locationId, figures: moneyShown(f.figures, reads([f.locationId])), outliers: moneyShown(marks.get(f.locationId) ?? {}, reads([f.locationId])) })),
  };
}
