import { standardNormalQuantile, tailOf } from './quantiles.ts';
import { checkObservations, unitsOf, type SurvivalObservation } from './survival-data.ts';

export interface SurvivalRow {
  time: number;
  atRisk: number;
  events: number;
  survival: number;
  standardError: number;
  lower: number;
  upper: number;
}

/**
 * Kaplan–Meier product-limit survival at each distinct failure time (Kaplan & Meier 1958, JASA 53:457–481),
 * Greenwood's standard error, and the log-log band S^exp(±z·σ/ln S) with σ² = Σ d/(n(n − d))
 * (Klein & Moeschberger, Survival Analysis, 2nd ed. 2003, §4.3), which stays inside [0, 1].
 * A unit censored at a failure time counts as still at risk then; a grouped observation counts as its units.
 */
export function kaplanMeier(observations: readonly SurvivalObservation[], options: { confidence?: number } = {}): SurvivalRow[] {
  const { confidence = 0.95 } = options;
  checkObservations(observations);
  const z = standardNormalQuantile(1 - tailOf(confidence) / 2);
  const sorted = [...observations].sort((a, b) => a.time - b.time);
  const rows: SurvivalRow[] = [];
  let survival = 1;
  let greenwoodSum = 0;
  let remaining = sorted.reduce((sum, o) => sum + unitsOf(o), 0);
  let index = 0;
  while (index < sorted.length) {
    const time = sorted[index]!.time;
    let events = 0;
    let leaving = 0;
    for (; index < sorted.length && sorted[index]!.time === time; index++) {
      const units = unitsOf(sorted[index]!);
      leaving += units;
      if (sorted[index]!.failed) events += units;
    }
    const atRisk = remaining;
    remaining -= leaving;
    if (events === 0) continue;
    survival *= 1 - events / atRisk;
    if (events < atRisk) greenwoodSum += events / (atRisk * (atRisk - events));
    rows.push({ time, atRisk, events, survival, ...greenwood(survival, greenwoodSum, z) });
  }
  return rows;
}

// Once every unit at risk has failed the curve is 0 with certainty: no spread left to show.
function greenwood(survival: number, greenwoodSum: number, z: number) {
  if (survival === 0) return { standardError: 0, lower: 0, upper: 0 };
  const sigma = Math.sqrt(greenwoodSum);
  const theta = Math.exp((z * sigma) / Math.log(survival));
  return { standardError: survival * sigma, lower: survival ** (1 / theta), upper: survival ** theta };
}
