import { designMargins, evaluatePlan, type PlanInput } from '@busbar/calc';
import { sql, type Kysely } from 'kysely';

const PAGE = 500;

/**
 * The design-margin bands of plans saved before `plan_margins` existed (migration 019), so their
 * builds' units count in their bands and not as "no plan". The API keeps the bands from here on.
 * A stored plan that no longer evaluates, or whose margins cannot be known, gets no row, as the
 * API would do on its next save.
 */
export async function up(db: Kysely<any>): Promise<void> {
  let after = 0;
  for (;;) {
    const { rows } = await sql<{ buildId: number; input: string }>`
      select p.build_id as "buildId", p.input from power_plans p
      where p.build_id > ${after} and not exists (select 1 from plan_margins m where m.build_id = p.build_id)
      order by p.build_id limit ${PAGE}`.execute(db);
    if (rows.length === 0) return;
    for (const { buildId, input } of rows) {
      const margins = marginsOf(input);
      if (margins) {
        await sql`insert into plan_margins (build_id, drop_band, load_band, discharge_band)
          values (${buildId}, ${margins.dropBand}, ${margins.loadBand}, ${margins.dischargeBand})`.execute(db);
      }
    }
    after = rows.at(-1)!.buildId;
  }
}

function marginsOf(input: string) {
  try {
    return designMargins(evaluatePlan(JSON.parse(input) as PlanInput));
  } catch {
    return null;
  }
}

export async function down(): Promise<void> {
  // The rows stay: they are what the API would have written.
}
