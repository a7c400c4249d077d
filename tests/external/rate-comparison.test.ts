import { binomialUpperTail, excessChance } from '@busbar/calc';
import jStat from 'jstat';
import { describe, expect, it } from 'vitest';

// Independent library: jstat 1.9.6, whose binomial CDF sums the probabilities term by term (and rounds to 10 places).
describe('binomial upper tail agrees with jstat', () => {
  it('for 1 to 200 trials across success probabilities', () => {
    for (const trials of [1, 2, 5, 12, 40, 200]) {
      for (const p of [0.01, 0.1, 0.37, 0.5, 0.9]) {
        for (let count = 0; count <= trials; count++) {
          const expected = count === 0 ? 1 : 1 - jStat.binomial.cdf(count - 1, trials, p);
          expect(binomialUpperTail(count, trials, p)).toBeCloseTo(expected, 9);
        }
      }
    }
  });
});

describe('excessChance', () => {
  it('is the exact conditional test: 10 failures against 2 at equal exposure is P(X ≥ 10) for 12 fair tosses, 79/4096 (by hand)', () => {
    const result = excessChance([{ events: 10, exposure: 500, peerEvents: 2, peerExposure: 500 }]);
    expect(result.expected).toBe(6);
    expect(result.chance).toBeCloseTo(79 / 4096, 12);
  });

  it('judges a group whose peers have not failed at all', () => {
    // 9 failures and none among peers with as much exposure: (1/2)^9.
    expect(excessChance([{ events: 9, exposure: 570, peerEvents: 0, peerExposure: 570 }]).chance).toBeCloseTo(1 / 512, 12);
  });

  it("approaches the Poisson tail at the peers' rate when the peers' exposure is vast", () => {
    for (const [events, exposure, rate] of [[3, 100, 0.01], [14, 459, 0.0088], [40, 5_000, 0.006]] as const) {
      const peerExposure = 1e8;
      const chance = excessChance([{ events, exposure, peerEvents: Math.round(rate * peerExposure), peerExposure }]).chance;
      // P(X ≥ k) for a Poisson mean, by jstat (its CDF is exact for means this small).
      const poissonTail = 1 - jStat.poisson.cdf(events - 1, rate * exposure);
      expect(chance / poissonTail).toBeCloseTo(1, 2);
    }
  });

  it('adds the events expected stratum by stratum and leaves out strata that say nothing', () => {
    // Quarter 1: 2 of 4 events at a quarter of the exposure (1 expected); quarter 2: 3 of 6 at half (3 expected).
    const result = excessChance([
      { events: 2, exposure: 100, peerEvents: 2, peerExposure: 300 },
      { events: 3, exposure: 200, peerEvents: 3, peerExposure: 200 },
      { events: 0, exposure: 50, peerEvents: 0, peerExposure: 80 },
    ]);
    expect(result).toMatchObject({ events: 5, expected: 4 });
    expect(result.chance).toBeCloseTo(1 - jStat.binomial.cdf(4, 10, 0.4), 9);
    expect(() => excessChance([{ events: 1.5, exposure: 1, peerEvents: 0, peerExposure: 1 }])).toThrow(/strata\[0\]\.events must be/);
  });
});
