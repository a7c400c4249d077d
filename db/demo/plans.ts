import { designMargins, evaluatePlan, type Chemistry, type DesignMargins, type PlanInput } from '@busbar/calc';
import type { Insertable } from 'kysely';
import type { Database } from '../schema/index.ts';
import { DEMO_CATALOG } from './catalog.ts';
import { chance, type Random } from './draw.ts';
import type { HistoryRows } from './history-rows.ts';
import { planVariant, type PlannedParts } from './plan-variants.ts';
import { pick } from './random.ts';

/**
 * Power plans of the demo's delivered builds that have a house battery and a DC-DC charger: about
 * two in three such builds were planned in Busbar (invented share), each plan drawn around the
 * build's own bank, charger and inverter, stored as the API stores a first save (a power_plans row
 * and its revision 1), with its design-margin bands in plan_margins. Plans are drawn from a few
 * variants per kind of build, each evaluated once, so a network of any size evaluates a few
 * hundred plans at most.
 */
const PLANNED_SHARE = 0.65;
/** The plans draw from a stream of their own, so the builds stay as they were without them. */
export const PLAN_STREAM = 0x91a2_5eed;
const VARIANTS_PER_KIND = 8;

type Rows<T extends keyof Database> = Insertable<Database[T]>[];
export interface PlanRows {
  powerPlans: Rows<'powerPlans'>;
  powerPlanRevisions: Rows<'powerPlanRevisions'>;
  planMargins: Rows<'planMargins'>;
  /** Builds whose plan runs a conductor past its allowed drop or its amperage (band 4). */
  tightBuilds: Set<number>;
}

interface Variant {
  json: string;
  margins: DesignMargins;
}

const SPECS = new Map(DEMO_CATALOG.map((item) => [item.sku, item]));

/** The bank, charger and inverter a build's lines add up to; null without a house battery or a charger. */
export function plannedParts(lines: readonly { sku: string; quantity: number }[]): PlannedParts | null {
  let chemistry: Chemistry | null = null;
  let bankAh = 0;
  let chargerA = 0;
  let inverter: PlannedParts['inverter'] = null;
  for (const { sku, quantity } of lines) {
    const item = SPECS.get(sku);
    const specs = (item?.specs ?? {}) as { chemistry?: Chemistry; capacityAh?: number; outputA?: number; continuousW?: number; efficiency?: number };
    if (item?.category === 'house_battery') {
      chemistry ??= specs.chemistry!;
      bankAh += specs.capacityAh! * quantity;
    }
    if (item?.category === 'dc_dc_charger') chargerA = Math.max(chargerA, specs.outputA!);
    if (item?.category === 'inverter') inverter = { ratedW: specs.continuousW!, efficiency: specs.efficiency! };
  }
  return chemistry && chargerA > 0 ? { chemistry, bankAh, chargerA, inverter } : null;
}

/** Plans for the delivered builds of batch after batch; plan ids carry on across batches. */
export function planMaker(random: Random, firstPlanId: number): (rows: HistoryRows) => PlanRows {
  const variants = new Map<string, Variant[]>();
  let nextPlanId = firstPlanId;

  const variantFor = (parts: PlannedParts): Variant => {
    const kind = `${parts.chemistry}/${parts.bankAh}/${parts.chargerA}/${parts.inverter?.ratedW ?? 0}`;
    const known = variants.get(kind) ?? [];
    variants.set(kind, known);
    if (known.length >= VARIANTS_PER_KIND) return pick(random, known);
    const input: PlanInput = planVariant(random, parts);
    // Every variant drawn has circuits and a planned bank, so its margins are known.
    const variant = { json: JSON.stringify(input), margins: designMargins(evaluatePlan(input))! };
    known.push(variant);
    return variant;
  };

  return (rows) => {
    const plans: PlanRows = { powerPlans: [], powerPlanRevisions: [], planMargins: [], tightBuilds: new Set() };
    const lines = new Map<number, { sku: string; quantity: number }[]>();
    for (const line of rows.buildItems) {
      if (!lines.has(line.buildId)) lines.set(line.buildId, []);
      lines.get(line.buildId)!.push({ sku: line.sku, quantity: line.quantity });
    }
    for (const build of rows.builds) {
      if (build.status !== 'delivered') continue;
      const parts = plannedParts(lines.get(build.id!) ?? []);
      if (!parts || !chance(random, PLANNED_SHARE)) continue;
      const { json, margins } = variantFor(parts);
      const id = nextPlanId++;
      // Planned by the build's technician with the customer, when the build was taken.
      const by = build.leadTechnicianId ?? build.createdBy;
      const at = build.createdAt;
      plans.powerPlans.push({ id, buildId: build.id!, locationId: build.locationId, name: build.number, input: json, version: 1, createdBy: by, createdAt: at, updatedAt: at, updatedBy: by });
      plans.powerPlanRevisions.push({ planId: id, version: 1, input: json, savedAt: at, savedBy: by!, note: '' });
      const { dropBand, loadBand, dischargeBand } = margins;
      plans.planMargins.push({ buildId: build.id!, dropBand, loadBand, dischargeBand });
      if (dropBand === 4 || loadBand === 4) plans.tightBuilds.add(build.id!);
    }
    return plans;
  };
}
