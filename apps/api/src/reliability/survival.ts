import { kaplanMeier, WEIBULL_MIN_FAILURE_TIMES, weibullAgeTrend, type SurvivalObservation } from '@busbar/calc';
import { DAYS_PER_MONTH, type ReliabilityDetail, type SurvivalPoint } from '@busbar/shared';
import type { UnitSums } from '../queries/unit-exposure.ts';

/** A failure on the day of install counts as half a day in service (times must be above 0). */
const SAME_DAY = 0.5;
/** The survival curve's least step, in days of service. */
const STEP_DAYS = 7;
/** Failures needed before the Weibull shape is read aloud: fewer leave it too uncertain to name. */
export const WEIBULL_MIN_FAILURES_TO_READ = 10;

/**
 * The units as survival observations, in days: each failure at its own age, and the units still in
 * service grouped by install month, censored at their mean age today (the cells keep their install
 * days' sum, not each day, so a month's units share one age; their time in service stays exact).
 */
export function observationsOf(ages: readonly { days: number; failures: number }[], byMonth: readonly UnitSums[], todayDay: number): SurvivalObservation[] {
  const failedAt = new Map<number, number>();
  for (const { days, failures } of ages) failedAt.set(Math.max(SAME_DAY, days), (failedAt.get(Math.max(SAME_DAY, days)) ?? 0) + failures);
  const observations: SurvivalObservation[] = [...failedAt].map(([time, count]) => ({ time, failed: true, count }));
  for (const s of byMonth) {
    const working = s.units - s.failures;
    const age = working > 0 ? todayDay - (s.installedDaySum - s.failedInstalledDaySum) / working : 0;
    if (age > 0) observations.push({ time: age, failed: false, count: working });
  }
  return observations;
}

/**
 * The Kaplan–Meier curve, one step per week of service at most: years of history fail on a thousand
 * or more distinct days, steps no chart or table tells apart (and a few hundred kilobytes to send).
 * Each step is the exact curve and band after the week's last failure.
 */
export function survivalCurve(observations: readonly SurvivalObservation[]): SurvivalPoint[] {
  if (observations.length === 0) return [];
  const points: SurvivalPoint[] = [];
  let week = -1;
  for (const row of kaplanMeier(observations)) {
    const earlier = Math.floor(row.time / STEP_DAYS) === week ? points.pop() : undefined;
    week = Math.floor(row.time / STEP_DAYS);
    points.push({
      months: row.time / DAYS_PER_MONTH,
      atRisk: earlier?.atRisk ?? row.atRisk,
      failures: (earlier?.failures ?? 0) + row.events,
      survival: row.survival,
      lower: row.lower,
      upper: row.upper,
    });
  }
  return points;
}

/** The Weibull fit in months with a plain reading of its shape (early, steady or wear-out, by the likelihood-ratio test), or why there is none. */
export function weibullOf(observations: readonly SurvivalObservation[]): Pick<ReliabilityDetail, 'weibull' | 'weibullNote'> {
  const failures = observations.reduce((sum, o) => sum + (o.failed ? (o.count ?? 1) : 0), 0);
  if (failures < WEIBULL_MIN_FAILURES_TO_READ || observations.filter((o) => o.failed).length < WEIBULL_MIN_FAILURE_TIMES) {
    return { weibull: null, weibullNote: `${failures} failure${failures === 1 ? '' : 's'}: a shape is read from ${WEIBULL_MIN_FAILURES_TO_READ} or more` };
  }
  const { shape, scale, trend } = weibullAgeTrend(observations);
  return { weibull: { shape, scaleMonths: scale / DAYS_PER_MONTH, reading: trend }, weibullNote: null };
}
