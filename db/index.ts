export { openDatabase, migrateToLatest, type Db, type MigrationStep } from './connect.ts';
export type { Database } from './schema/index.ts';
export { seedDemoNetwork, DEMO_PASSWORD } from './demo/generate.ts';
export { seedNetwork, type NetworkCounts } from './demo/network-history.ts';
export { demoEvidenceKinds } from './demo/claims-evidence.ts';
export { REFILL_ROLLUPS } from './migrations/042-create-rollup-sums.ts';
export { REFILL_MONTH_CLOSE_SUMS } from './migrations/056-create-month-close-sums.ts';
export { FLAG_CHANGED_FINAL_MONTHS } from './migrations/055-flag-changed-final-months.ts';
export { SHOP_SPAN } from './migrations/049-create-shop-build-search.ts';
