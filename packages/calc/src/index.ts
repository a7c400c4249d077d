export { buildTotals, type BuildTotals, type PricedLine } from './build-totals.ts';
