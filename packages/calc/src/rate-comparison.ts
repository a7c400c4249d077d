import { checkNumber } from './checks.ts';
import { binomialUpperTail } from './quantiles.ts';

/** One stratum (say, units installed in one quarter): a group's events and exposure beside its peers'. */
export interface RateStratum {
  events: number;
  exposure: number;
  peerEvents: number;
  peerExposure: number;
}

/**
 * Whether a group fails more than its peers, stratum by stratum. Under equal rates within each
 * stratum, the group's share of a stratum's events follows its share of the exposure, so the events
 * expected of the group are Σ exposure × (events + peer events) / (exposure + peer exposure), and its
 * count among all n events is binomial with p = expected / n: the chance is P(X ≥ events). With one
 * stratum this is the exact conditional test of two Poisson rates (Przyborowski & Wilenski 1940,
 * Biometrika 31:313–323), which needs no peer failures to judge, unlike a test that takes the
 * peers' rate as known. Strata without events or exposure say nothing and are left out.
 */
export function excessChance(strata: readonly RateStratum[]): { events: number; expected: number; chance: number } {
  let events = 0;
  let total = 0;
  let expected = 0;
  strata.forEach((s, i) => {
    for (const key of ['events', 'peerEvents'] as const) checkNumber(`strata[${i}].${key}`, s[key], { min: 0, integer: true });
    for (const key of ['exposure', 'peerExposure'] as const) checkNumber(`strata[${i}].${key}`, s[key], { min: 0 });
    const all = s.events + s.peerEvents;
    if (all === 0 || s.exposure === 0 || s.peerExposure === 0) return;
    events += s.events;
    total += all;
    expected += (s.exposure * all) / (s.exposure + s.peerExposure);
  });
  return { events, expected, chance: total === 0 ? 1 : binomialUpperTail(events, total, expected / total) };
}
