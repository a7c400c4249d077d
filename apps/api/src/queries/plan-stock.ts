import type { Chemistry, PlanStock } from '@busbar/calc';
import type { Db } from '@busbar/db';

/** Sizes of the house batteries (by chemistry) and DC-DC chargers the active catalog offers, each listed once, smallest first. */
export async function planStock(db: Db): Promise<PlanStock> {
  const rows = await db
    .selectFrom('catalogItems')
    .select(['category', 'specs'])
    .where('active', '=', 1)
    .where('category', 'in', ['house_battery', 'dc_dc_charger'])
    .execute();
  const bankAh: Partial<Record<Chemistry, Set<number>>> = {};
  const chargerA = new Set<number>();
  for (const { category, specs } of rows) {
    const parsed = JSON.parse(specs) as { chemistry?: Chemistry; capacityAh?: number; outputA?: number };
    if (category === 'house_battery' && parsed.chemistry && parsed.capacityAh) (bankAh[parsed.chemistry] ??= new Set()).add(parsed.capacityAh);
    if (category === 'dc_dc_charger' && parsed.outputA) chargerA.add(parsed.outputA);
  }
  const sorted = (sizes: Set<number>) => [...sizes].sort((a, b) => a - b);
  return {
    bankAh: Object.fromEntries(Object.entries(bankAh).map(([chemistry, sizes]) => [chemistry, sorted(sizes)])),
    chargerA: sorted(chargerA),
  };
}
