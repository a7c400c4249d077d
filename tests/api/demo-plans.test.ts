import { designMargins, evaluatePlan, type PlanInput } from '@busbar/calc';
import { planInputSchema } from '@busbar/shared';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { plannedParts } from '../../db/demo/plans.ts';
import { startHarness, type Harness } from '../support/api-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
}, 60_000);
afterAll(() => h.close());

const plans = () =>
  h.db
    .selectFrom('powerPlans as p')
    .innerJoin('builds as b', 'b.id', 'p.buildId')
    .innerJoin('powerPlanRevisions as r', 'r.planId', 'p.id')
    .leftJoin('planMargins as m', 'm.buildId', 'p.buildId')
    .select(['p.id', 'p.buildId', 'p.name', 'p.input', 'p.version', 'p.createdBy', 'p.locationId', 'b.number', 'b.status', 'b.locationId as buildLocationId', 'b.leadTechnicianId'])
    .select(['r.version as revision', 'r.input as revisionInput', 'r.savedBy', 'm.dropBand', 'm.loadBand', 'm.dischargeBand'])
    .orderBy('p.id')
    .execute();

async function linesByBuild(): Promise<Map<number, { sku: string; quantity: number }[]>> {
  const lines = await h.db.selectFrom('buildItems').select(['buildId', 'sku', 'quantity']).where('unitPriceCents', '>', 0).execute();
  const byBuild = new Map<number, { sku: string; quantity: number }[]>();
  for (const { buildId, ...line } of lines) byBuild.set(buildId, [...(byBuild.get(buildId) ?? []), line]);
  return byBuild;
}

describe('demo power plans', () => {
  it('plans about two in three delivered builds with a house battery and a charger, each around its own bank, charger and inverter, as the API stores a first save', async () => {
    const all = await plans();
    const lines = await linesByBuild();
    const delivered = await h.db.selectFrom('builds').select('id').where('status', '=', 'delivered').execute();
    const eligible = delivered.filter((b) => plannedParts(lines.get(b.id) ?? []) !== null);
    expect(all.length).toBeGreaterThan(300);
    expect(all.length / eligible.length).toBeGreaterThan(0.55);
    expect(all.length / eligible.length).toBeLessThan(0.75);
    for (const plan of all) {
      expect([plan.status, plan.name, plan.locationId, plan.version, plan.revision, plan.revisionInput]).toEqual(['delivered', plan.number, plan.buildLocationId, 1, 1, plan.input]);
      expect([plan.createdBy, plan.savedBy]).toEqual([plan.leadTechnicianId, plan.leadTechnicianId]);
      const input = JSON.parse(plan.input) as PlanInput;
      expect(planInputSchema.safeParse(input).error, plan.number).toBeUndefined();
      const parts = plannedParts(lines.get(plan.buildId!)!)!;
      expect([input.bank?.chemistry, input.bank?.capacityAh, input.dcdcCharger?.outputA, input.inverter?.ratedW ?? null]).toEqual([
        parts.chemistry,
        parts.bankAh,
        parts.chargerA,
        parts.inverter?.ratedW ?? null,
      ]);
      const margins = designMargins(evaluatePlan(input))!;
      expect([plan.dropBand, plan.loadBand, plan.dischargeBand], plan.number).toEqual([margins.dropBand, margins.loadBand, margins.dischargeBand]);
    }
  });

  it("shows the lead of a tight build's shop the plan with the finding that made it tight", async () => {
    const tight = await h.db
      .selectFrom('planMargins as m')
      .innerJoin('builds as b', 'b.id', 'm.buildId')
      .innerJoin('locations as l', 'l.id', 'b.locationId')
      .select(['b.id', 'm.dropBand', 'm.loadBand'])
      .where('l.code', '=', 'DEN')
      .where((eb) => eb.or([eb('m.dropBand', '=', 4), eb('m.loadBand', '=', 4)]))
      .orderBy('b.id')
      .executeTakeFirstOrThrow();
    const lead = await h.signedIn(SIGN_INS.lead);
    const res = await lead.get(`/api/builds/${tight.id}/plan`);
    expect(res.status).toBe(200);
    const codes = (res.body.plan.result.findings as { code: string }[]).map((f) => f.code);
    const past = (code: string) => codes.includes(code) || codes.includes('no-conductor-fits');
    expect([tight.dropBand === 4 && past('circuit-over-drop'), tight.loadBand === 4 && past('conductor-over-ampacity')]).toContain(true);
    if (tight.dropBand === 4) expect(past('circuit-over-drop')).toBe(true);
    if (tight.loadBand === 4) expect(past('conductor-over-ampacity')).toBe(true);
  });

  it('counts units in every band of every measure, as the builds and their plans say', async () => {
    for (const [measure, column] of [[1, 'drop_band'], [2, 'load_band'], [3, 'discharge_band']] as const) {
      const kept = await sql<{ band: number; units: number }>`select band, sum(units) as units from unit_exposure_bands where measure = ${measure} group by 1 having sum(units) != 0 order by 1`.execute(h.db);
      expect(kept.rows.map((r) => r.band), column).toEqual([1, 2, 3, 4]);
      for (const row of kept.rows) expect(row.units, `${column} ${row.band}`).toBeGreaterThan(0);
      const direct = await sql<{ band: number; units: number }>`select ${sql.ref(column)} as band, sum(quantity) as units from installed_unit_source where drop_band > 0 group by 1 order by 1`.execute(h.db);
      expect(kept.rows).toEqual(direct.rows);
    }
  });

  it('has the connections of units on builds planned past a conductor limit come loose or burn more often than on other planned builds', async () => {
    const shares = await sql<{ tight: number; units: number; loose: number }>`
      select (m.drop_band = 4 or m.load_band = 4) as tight, count(*) as units,
        sum(exists (select 1 from warranty_claims w where w.build_item_id = i.id and w.failure_mode = 'loose_or_burnt_connection')) as loose
      from build_items i join plan_margins m on m.build_id = i.build_id join builds b on b.id = i.build_id join locations l on l.id = b.location_id
      join catalog_items c on c.id = i.catalog_item_id
      where i.serial_number is not null and i.unit_price_cents > 0 and c.category != 'solar_panel' and l.code != 'AUS'
      group by 1 order by 1`.execute(h.db);
    // A few hundred units on tight builds give a handful of such failures: the draw's own factor is checked in tests/unit/demo-failures.test.ts.
    const [roomy, tight] = shares.rows.map((r) => r.loose / r.units);
    expect(shares.rows[1]!.loose).toBeGreaterThan(4);
    expect(tight!).toBeGreaterThan(1.5 * roomy!);
  });
});
