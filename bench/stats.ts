/** Latency figures of a set of timed requests, in ms. */
export interface Latency {
  p50: number;
  p95: number;
  p99: number;
  max: number;
  count: number;
}

/** The q-th quantile by the nearest-rank method. */
function quantile(sorted: number[], q: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))]!;
}

export function latency(samples: number[]): Latency {
  const sorted = [...samples].sort((a, b) => a - b);
  return { p50: quantile(sorted, 0.5), p95: quantile(sorted, 0.95), p99: quantile(sorted, 0.99), max: sorted.at(-1) ?? NaN, count: sorted.length };
}

export const ms = (value: number) => (Number.isFinite(value) ? (value < 10 ? value.toFixed(1) : value.toFixed(0)) : '–');
