const TOLERANCE = 1e-12;
const MAX_STEPS = 200;

/**
 * Root in β of the censored Weibull shape equation g(β) = Σ e^{β lᵢ} lᵢ / Σ e^{β lᵢ} − 1/β − mean(failed lᵢ)
 * for log times lᵢ. g rises strictly from −∞, so Newton's steps are kept inside a bracket
 * that halves whenever a step would leave it.
 */
export function weibullShapeRoot(logTimes: readonly number[], failedLogTimes: readonly number[]): number {
  const failedMean = failedLogTimes.reduce((sum, l) => sum + l, 0) / failedLogTimes.length;
  const equation = (shape: number) => {
    let weightSum = 0;
    let first = 0;
    let second = 0;
    for (const l of logTimes) {
      const weight = Math.exp(shape * l);
      weightSum += weight;
      first += weight * l;
      second += weight * l * l;
    }
    const mean = first / weightSum;
    return { value: mean - 1 / shape - failedMean, slope: second / weightSum - mean * mean + 1 / (shape * shape) };
  };
  let low = 0;
  let high = 1;
  while (equation(high).value < 0) high *= 2;
  let shape = 1;
  for (let step = 0; step < MAX_STEPS; step++) {
    const { value, slope } = equation(shape);
    if (value < 0) low = shape;
    else high = shape;
    const newton = shape - value / slope;
    const next = newton > low && newton < high ? newton : (low + high) / 2;
    if (Math.abs(next - shape) <= TOLERANCE * next) return next;
    shape = next;
  }
  return shape;
}
