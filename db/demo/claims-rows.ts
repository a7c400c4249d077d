import { isoDay } from '@busbar/calc';
import { CLAIM_DUE_DAYS, type Category } from '@busbar/shared';
import type { Insertable } from 'kysely';
import type { Database } from '../schema/index.ts';
import { drawClaim, failureAt, type ClaimDraft, type ClaimShop } from './claims-draw.ts';
import { demoEvidenceKinds } from './claims-evidence.ts';
import { holdEveryStatus } from './claims-hold.ts';
import { badBatchPrefixes, BAD_BATCH } from './claims-rates.ts';
import type { Random } from './draw.ts';
import type { HistoryRows } from './history-rows.ts';

type Rows<T extends keyof Database> = Insertable<Database[T]>[];
type Line = Insertable<Database['buildItems']>;
export interface ClaimRows {
  warrantyClaims: Rows<'warrantyClaims'>;
  claimEvents: Rows<'claimEvents'>;
  /** Replacement units, new lines of the failed unit's build. */
  buildItems: Rows<'buildItems'>;
  /** The build's timeline entry of each replacement. */
  buildEvents: Rows<'buildEvents'>;
  /** Failed units taken out, by build line id; their lines are marked too, for a caller that has not written them yet. */
  removed: { id: number; removedOn: string }[];
}

/** What the claims read of the catalog, by catalog item id. */
export interface ClaimCatalogEntry {
  sku: string;
  category: Category;
  warrantyMonths: number;
  serialPrefix: string;
  rmaEmail: string;
}

export interface ClaimContext {
  shops: ReadonlyMap<number, ClaimShop>;
  catalog: ReadonlyMap<number, ClaimCatalogEntry>;
  firstId: { buildItem: number; claim: number };
  nowMs: number;
  /** Make sure every status holds a claim at the clock (the small demo; see claims-hold.ts). */
  everyStatus?: boolean;
}

const iso = (ms: number) => new Date(ms).toISOString();
const pad = (n: number, width: number) => String(n).padStart(width, '0');

/**
 * Warranty claims that follow the history, batch after batch. `add` gives a batch's build lines
 * their ids (so claims can name them) and draws the failures of its delivered units; `flush`
 * numbers the claims logged before a moment, per location in the order they were logged, with
 * their events, replacement lines and the failed units to mark removed.
 */
export function claimMaker(random: Random, { shops, catalog, firstId, nowMs, everyStatus = false }: ClaimContext) {
  let nextItemId = firstId.buildItem;
  let nextClaimId = firstId.claim;
  const sequences = new Map<number, number>();
  const replacementSerials = new Map<string, number>();
  const badBatch = [...catalog.values()].find((c) => c.sku === BAD_BATCH.sku);
  const badPrefixes = badBatch ? badBatchPrefixes(badBatch.serialPrefix, nowMs) : [];
  let pending: { draft: ClaimDraft; line: Line }[] = [];

  /** `tightBuilds`: builds whose plan runs a conductor past its limits (plans.ts), whose connections fail more often. */
  function add(rows: HistoryRows, tightBuilds: ReadonlySet<number> = new Set()): void {
    const delivered = new Map(rows.builds.filter((b) => b.deliveredAt).map((b) => [b.id!, { locationId: b.locationId, at: Date.parse(b.deliveredAt!) }]));
    // Fresh objects with every field: adding fields to the generated ones one by one is far slower.
    const lines = rows.buildItems.map((line) => ({ id: nextItemId++, ...line, removedOn: null as string | null }));
    rows.buildItems = lines;
    for (const line of lines) {
      const build = line.serialNumber ? delivered.get(line.buildId) : undefined;
      const item = catalog.get(line.catalogItemId);
      if (!build || !item) continue;
      const shop = shops.get(build.locationId)!;
      const inBadBatch = line.sku === BAD_BATCH.sku && badPrefixes.some((p) => line.serialNumber!.startsWith(p));
      const tightDesign = tightBuilds.has(line.buildId);
      const failure = failureAt(random, { sku: line.sku, category: item.category, deliveredAt: build.at, inBadBatch, tightDesign }, shop);
      if (!failure || failure.at > nowMs) continue;
      const { category, warrantyMonths, rmaEmail } = item;
      const unit = { category, warrantyMonths, rmaEmail, itemId: line.id, buildId: line.buildId, catalogItemId: line.catalogItemId, sku: line.sku, serialNumber: line.serialNumber!, unitCostCents: line.unitCostCents, deliveredAt: build.at };
      const draft = drawClaim(random, unit, shop, failure, nowMs);
      if (draft) pending.push({ draft, line });
    }
  }

  function replacementSerial(draft: ClaimDraft, on: string): string {
    const { sku, catalogItemId } = draft.unit;
    const running = (replacementSerials.get(sku) ?? 0) + 1;
    replacementSerials.set(sku, running);
    // The vendor's warranty stock: a series of its own, so it never meets a serial sold new.
    return `${catalog.get(catalogItemId)!.serialPrefix}${on.slice(2, 4)}${on.slice(5, 7)}-R${pad(running, 5)}`;
  }

  function flush(beforeMs: number): ClaimRows {
    const rows: ClaimRows = { warrantyClaims: [], claimEvents: [], buildItems: [], buildEvents: [], removed: [] };
    const loggedAt = ({ draft }: (typeof pending)[number]) => draft.steps[0]!.at;
    const ready = pending.filter((p) => loggedAt(p) < beforeMs).sort((a, b) => loggedAt(a) - loggedAt(b) || a.draft.unit.itemId - b.draft.unit.itemId);
    pending = pending.filter((p) => loggedAt(p) >= beforeMs);
    if (everyStatus) holdEveryStatus(ready.map((p) => p.draft));
    for (const { draft, line } of ready) {
      const { unit, shop, steps, replacement } = draft;
      const id = nextClaimId++;
      const sequence = (sequences.get(shop.id) ?? 0) + 1;
      sequences.set(shop.id, sequence);
      const number = `${shop.code}-W${pad(sequence, 5)}`;
      const files = demoEvidenceKinds(sequence).length;
      let replacementItemId: number | null = null;
      if (replacement) {
        replacementItemId = nextItemId++;
        const serialNumber = replacementSerial(draft, replacement.on);
        rows.buildItems.push({
          id: replacementItemId, buildId: unit.buildId, catalogItemId: unit.catalogItemId, sku: unit.sku, quantity: 1, serialNumber,
          unitPriceCents: 0, unitCostCents: 0, createdAt: `${replacement.on}T12:00:00.000Z`, removedOn: null,
        });
        const note = `Warranty claim ${number}: ${unit.sku} serial ${unit.serialNumber} replaced by ${unit.sku} serial ${serialNumber} on ${replacement.on}`;
        rows.buildEvents.push({ buildId: unit.buildId, at: iso(replacement.at), actorId: replacement.by, kind: 'correction', fromStatus: null, toStatus: null, note });
        line.removedOn = replacement.on;
        rows.removed.push({ id: unit.itemId, removedOn: replacement.on });
      }
      steps.forEach((step, i) => {
        const note = step.to === 'sent_to_vendor' ? `Return request e-mailed to ${unit.rmaEmail} with ${files} file${files === 1 ? '' : 's'}` : step.note;
        rows.claimEvents.push({ claimId: id, at: iso(step.at), actorId: step.by, fromStatus: i === 0 ? null : steps[i - 1]!.to, toStatus: step.to, note });
      });
      const last = steps[steps.length - 1]!;
      const dueDays = CLAIM_DUE_DAYS[last.to];
      // Each step is a change of the record, as are the vendor's RMA number and the replacement.
      const changes = steps.length + (draft.vendorRmaNumber ? 1 : 0) + (replacement ? 1 : 0);
      rows.warrantyClaims.push({
        id, locationId: shop.id, sequence, number, buildId: unit.buildId, buildItemId: unit.itemId, catalogItemId: unit.catalogItemId,
        failedOn: draft.failedOn, failureMode: draft.failureMode, coverage: draft.coverage, symptoms: draft.symptoms, foundHow: draft.foundHow,
        laborHours: draft.laborHours, outOfWarranty: draft.outOfWarranty ? 1 : 0, status: last.to,
        dueOn: dueDays === null ? null : isoDay(last.day + dueDays),
        vendorRmaNumber: draft.vendorRmaNumber, creditRequestedCents: draft.creditRequestedCents,
        creditApprovedCents: draft.creditApprovedCents, creditReceivedCents: draft.creditReceivedCents, replacementItemId,
        createdBy: steps[0]!.by, createdAt: iso(steps[0]!.at), loggedOn: isoDay(steps[0]!.day), updatedAt: iso(Math.max(last.at, replacement?.at ?? 0)), version: changes,
      });
    }
    return rows;
  }

  return { add, flush };
}
