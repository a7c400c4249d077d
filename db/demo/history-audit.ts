import type { Insertable } from 'kysely';
import type { Database } from '../schema/index.ts';
import type { SimBuild } from './shop-history.ts';

type Line = { sku: string; quantity: number; serialNumber: string | null; unitPriceCents: number; unitCostCents: number };

/**
 * The audit trail the API would have written for a simulated build: its creation, each line added
 * by the lead that day, and each change of status by whoever made it.
 */
export function auditRows(build: SimBuild, buildId: number, number: string, lines: readonly Line[]): Insertable<Database['auditLog']>[] {
  const { shop, events } = build;
  const created = new Date(build.createdAt).toISOString();
  const entry = (at: string, actorId: number, action: string, before: unknown, after: unknown) => ({
    at,
    actorId,
    action,
    entity: 'build',
    entityId: buildId,
    before: before === null ? null : JSON.stringify(before),
    after: JSON.stringify(after),
  });
  return [
    entry(created, shop.leadId, 'build.create', null, { number, notes: build.job.notes }),
    ...lines.map(({ sku, quantity, unitPriceCents, unitCostCents }) =>
      entry(created, shop.leadId, 'build.item.add', null, { sku, quantity, serialNumber: null, unitPriceCents, unitCostCents }),
    ),
    ...events
      .filter((e) => e.from !== null)
      .map((e) =>
        entry(new Date(e.at).toISOString(), e.by === 'lead' ? shop.leadId : build.leadTechnicianId, 'build.status', { status: e.from }, { status: e.to, note: e.note }),
      ),
  ];
}
