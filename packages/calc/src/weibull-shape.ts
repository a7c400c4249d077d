/** A log time and the number of units that share it. */
export interface LogTimes {
  logTime: number;
  units: number;
}

const TOLERANCE = 1e-12;
const MAX_STEPS = 200;

/**
 * Root in β of the censored Weibull shape equation g(β) = Σ e^{β lᵢ} lᵢ / Σ e^{β lᵢ} − 1/β − mean(failed lᵢ)
 * for log times lᵢ, each counted as many times as the units it stands for. g rises strictly from −∞,
 * so Newton's steps are kept inside a bracket that halves whenever a step would leave it.
 */
export function weibullShapeRoot(all: readonly LogTimes[], failed: readonly LogTimes[]): number {
  const failedUnits = failed.reduce((sum, f) => sum + f.units, 0);
  const failedMean = failed.reduce((sum, f) => sum + f.units * f.logTime, 0) / failedUnits;
  const equation = (shape: number) => {
    let weightSum = 0;
    let first = 0;
    let second = 0;
    for (const { logTime: l, units } of all) {
      const weight = units * Math.exp(shape * l);
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
