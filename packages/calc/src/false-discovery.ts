import { checkNumber } from './checks.ts';

/**
 * How many of the smallest p-values the Benjamini–Hochberg step-up rule rejects at false
 * discovery rate `rate`: the largest k with p₍ₖ₎ ≤ k/m × rate for the sorted p₍₁₎ ≤ … ≤ p₍ₘ₎
 * (Benjamini & Hochberg 1995, "Controlling the false discovery rate", J R Stat Soc B 57:289–300).
 */
export function benjaminiHochberg(pValues: readonly number[], rate: number): number {
  checkNumber('rate', rate, { above: 0, below: 1 });
  pValues.forEach((p, i) => checkNumber(`pValues[${i}]`, p, { min: 0, max: 1 }));
  const sorted = [...pValues].sort((a, b) => a - b);
  for (let k = sorted.length; k >= 1; k--) if (sorted[k - 1]! <= (k / sorted.length) * rate) return k;
  return 0;
}
