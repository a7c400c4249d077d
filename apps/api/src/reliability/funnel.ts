import { funnelLimits, funnelSide } from '@busbar/calc';
import { RATE_PER_UNIT_MONTHS, type FunnelLimit, type FunnelPoint, type FunnelSignal } from '@busbar/shared';
import type { ServiceSums } from '../queries/unit-exposure.ts';
import { unitMonthsOf } from './figures.ts';

/** Spiegelhalter's two funnels: 95 % warns, 99.8 % (about three standard errors) alarms. */
const WARN = 0.95;
const ALARM = 0.998;
/** Points the limit lines are drawn through, spaced evenly on a log scale of exposure. */
const CURVE_POINTS = 24;

export interface NamedLocation {
  id: number;
  code: string;
  name: string;
}

/**
 * Each location's rate against the network's at its own exposure. Locations the person may not see
 * stay on the funnel without id, code or name, in exposure order so the order tells nothing.
 */
export function funnelOf(
  byLocation: Map<number, ServiceSums>,
  workmanship: Map<number, number>,
  named: Map<number, NamedLocation>,
  todayDay: number,
): { points: FunnelPoint[]; limits: FunnelLimit[] } {
  const exposed = [...byLocation].map(([id, s]) => ({ id, sums: s, unitMonths: unitMonthsOf(s, todayDay) })).filter((l) => l.unitMonths > 0);
  const totalFailures = exposed.reduce((sum, l) => sum + l.sums.failures, 0);
  const networkRate = totalFailures / exposed.reduce((sum, l) => sum + l.unitMonths, 0);
  const points = exposed
    .sort((a, b) => a.unitMonths - b.unitMonths)
    .map(({ id, sums, unitMonths }): FunnelPoint => {
      const location = named.get(id);
      return {
        locationId: location?.id ?? null,
        code: location?.code ?? null,
        name: location?.name ?? null,
        unitMonths,
        failures: sums.failures,
        rate: (sums.failures / unitMonths) * RATE_PER_UNIT_MONTHS,
        signal: totalFailures > 0 ? signalOf(sums.failures, networkRate * unitMonths) : 'within',
        // Each failure is one claim.
        claims: sums.failures,
        workmanshipClaims: workmanship.get(id) ?? 0,
      };
    });
  return { points, limits: totalFailures > 0 ? limitCurve(networkRate, points) : [] };
}

function signalOf(failures: number, expected: number): FunnelSignal {
  const alarm = funnelSide(failures, expected, { confidence: ALARM });
  if (alarm !== 'within') return alarm === 'above' ? 'above_998' : 'below_998';
  const warn = funnelSide(failures, expected, { confidence: WARN });
  return warn === 'within' ? 'within' : warn === 'above' ? 'above_95' : 'below_95';
}

function limitCurve(networkRate: number, points: readonly FunnelPoint[]): FunnelLimit[] {
  const least = Math.log(points[0]!.unitMonths);
  const most = Math.log(points.at(-1)!.unitMonths);
  const steps = most > least ? CURVE_POINTS : 1;
  return Array.from({ length: steps }, (_, i) => {
    const unitMonths = Math.exp(least + ((most - least) * i) / Math.max(1, steps - 1));
    const warn = funnelLimits(networkRate, unitMonths, { confidence: WARN });
    const alarm = funnelLimits(networkRate, unitMonths, { confidence: ALARM });
    const perThousand = (rate: number) => rate * RATE_PER_UNIT_MONTHS;
    return { unitMonths, lower998: perThousand(alarm.lower), lower95: perThousand(warn.lower), upper95: perThousand(warn.upper), upper998: perThousand(alarm.upper) };
  });
}
