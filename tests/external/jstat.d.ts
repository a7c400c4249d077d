// jstat ships no types; only the functions the reliability checks call.
declare module 'jstat' {
  interface JStat {
    median(values: number[]): number;
    meddev(values: number[]): number;
    normal: { inv(p: number, mean: number, sd: number): number };
    chisquare: { inv(p: number, degreesOfFreedom: number): number; cdf(x: number, degreesOfFreedom: number): number };
    poisson: { cdf(count: number, mean: number): number };
    binomial: { cdf(count: number, trials: number, p: number): number };
    weibull: { pdf(x: number, scale: number, shape: number): number; cdf(x: number, scale: number, shape: number): number };
  }
  const jStat: JStat;
  export default jStat;
}
