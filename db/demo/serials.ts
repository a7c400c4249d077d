import { between, type Random } from './draw.ts';

/**
 * Serial numbers as vendors print them: the vendor's prefix, the year and month of manufacture
 * and a running number per SKU. The running number only grows, so a serial never repeats within
 * a SKU; the gaps are units sold through other shops.
 */
export function serialNumbers(random: Random): (sku: string, vendorPrefix: string, installedAt: number) => string {
  const running = new Map<string, number>();
  return (sku, vendorPrefix, installedAt) => {
    const next = (running.get(sku) ?? between(random, 1000, 20000)) + between(random, 1, 9);
    running.set(sku, next);
    const made = new Date(installedAt - between(random, 20, 150) * 86_400_000);
    const yymm = `${String(made.getUTCFullYear() % 100).padStart(2, '0')}${String(made.getUTCMonth() + 1).padStart(2, '0')}`;
    return `${vendorPrefix}${yymm}-${String(next).padStart(6, '0')}`;
  };
}

/** A price or cost as it was `yearsAgo`: the catalog's figures have risen about 3.5 % a year. */
export function atTheTime(todayCents: number, yearsAgo: number, roundToCents: number): number {
  return Math.round((todayCents / (1 + 0.035 * yearsAgo)) / roundToCents) * roundToCents;
}
