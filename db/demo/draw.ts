/** Draws from the seeded generator beyond `pick`: ranges, weights and counts of events. */
export type Random = () => number;

/** A number between `low` and `high`, rounded to a multiple of `step`. */
export function between(random: Random, low: number, high: number, step = 1): number {
  return Math.round((low + random() * (high - low)) / step) * step;
}

/** True with probability `p`. */
export function chance(random: Random, p: number): boolean {
  return random() < p;
}

/** One of the choices, each as likely as its weight. */
export function weighted<T>(random: Random, choices: readonly (readonly [T, number])[]): T {
  const total = choices.reduce((sum, [, weight]) => sum + weight, 0);
  let left = random() * total;
  for (const [choice, weight] of choices) {
    left -= weight;
    if (left < 0) return choice;
  }
  const last = choices[choices.length - 1];
  if (!last) throw new Error('weighted pick from an empty list');
  return last[0];
}

/** A Poisson count with the given mean (Knuth's method; the demo's means are small). */
export function poisson(random: Random, mean: number): number {
  const limit = Math.exp(-mean);
  let count = 0;
  for (let product = random(); product > limit; product *= random()) count++;
  return count;
}
