import type { Database } from '@busbar/db';
import { CATEGORIES, type Category } from '@busbar/shared';

/** The stored sums of a period (migration 021), from which every roll-up figure is made. */
export type RollupSums = Omit<Database['rollupFigures'], 'grain' | 'period' | 'locationId'>;

/** The column of a category's job mix: `dc_dc_charger` is `mixDcDcCharger`. */
export const mixColumn = (category: Category) =>
  `mix${category.split('_').map((word) => word[0]!.toUpperCase() + word.slice(1)).join('')}` as keyof RollupSums;

export const SUM_FIELDS = [
  'buildsDelivered', 'buildsBooked', 'revenueCents', 'partsCostCents', 'laborCentihours', 'claimsOpened', 'warrantyCostCents', 'creditsReceivedCents',
  ...CATEGORIES.map(mixColumn),
] as const satisfies readonly (keyof RollupSums)[];
export type SumField = (typeof SUM_FIELDS)[number];
