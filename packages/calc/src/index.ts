export { buildTotals, type BuildTotals, type PricedLine } from './build-totals.ts';
export { addWorkdays, DAY_MS, dayOfIso, isoDay, localDay, localMoment, monthOf, weekday } from './local-time.ts';
