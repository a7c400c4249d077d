import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { addMonthsIso, isoDay, localDay } from '@busbar/calc';
import { CLAIM_STATUSES, findClaimTransition } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDemoEvidence } from '../../apps/api/src/demo-evidence.ts';
import { detectEvidenceType } from '../../apps/api/src/evidence/file-type.ts';
import { dueOnFor } from '../../apps/api/src/queries/claims.ts';
import { startHarness, type Harness } from '../support/api-harness.ts';

let h: Harness;
let storedFiles: number;

beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  const started = performance.now();
  storedFiles = await addDemoEvidence(h.db, h.dataDir);
  console.log(`Demo evidence: ${storedFiles} files in ${Math.round(performance.now() - started)} ms`);
}, 60_000);
afterAll(() => h.close());

const claims = () =>
  h.db
    .selectFrom('warrantyClaims as w')
    .innerJoin('locations as l', 'l.id', 'w.locationId')
    .innerJoin('buildItems as i', 'i.id', 'w.buildItemId')
    .innerJoin('catalogItems as c', 'c.id', 'i.catalogItemId')
    .innerJoin('builds as b', 'b.id', 'w.buildId')
    .selectAll('w')
    .select(['l.code', 'l.timeZone', 'l.regionId', 'l.claimApprovalLimitCents', 'i.sku', 'i.serialNumber', 'i.buildId as lineBuildId', 'i.removedOn', 'c.category', 'c.warrantyMonths', 'b.deliveredAt', 'b.status as buildStatus'])
    .orderBy('w.id')
    .execute();
type Claim = Awaited<ReturnType<typeof claims>>[number];

const roleOf = async (userId: number | null, claim: Claim) => {
  const roles = await h.db.selectFrom('roleAssignments').select(['role', 'locationId', 'regionId']).where('userId', '=', userId).execute();
  return roles.find((r) => r.locationId === claim.locationId || (r.role === 'regional_manager' && r.regionId === claim.regionId))?.role;
};

function groupBy<T, K>(rows: T[], key: (row: T) => K): Map<K, T[]> {
  const groups = new Map<K, T[]>();
  for (const row of rows) groups.set(key(row), [...(groups.get(key(row)) ?? []), row]);
  return groups;
}
const clocks = new Map<string, Intl.DateTimeFormat>();
/** Minutes after local midnight at `zone`. */
function localMinute(zone: string, iso: string): number {
  if (!clocks.has(zone)) clocks.set(zone, new Intl.DateTimeFormat('en-GB', { timeZone: zone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }));
  const [hours, minutes] = clocks.get(zone)!.format(new Date(iso)).split(':').map(Number);
  return hours! * 60 + minutes!;
}
const share = <T>(rows: T[], test: (row: T) => boolean) => rows.filter(test).length / rows.length;

describe('demo warranty claims', () => {
  it('holds claims in every status, numbered per shop without gaps in the order they were logged', async () => {
    const all = await claims();
    expect(all.length).toBeGreaterThan(150);
    expect(new Set(all.map((c) => c.status))).toEqual(new Set(CLAIM_STATUSES));
    const byShop = groupBy(all, (c) => c.code);
    expect(byShop.size).toBeGreaterThanOrEqual(7);
    for (const [code, shopClaims] of byShop) {
      const logged = [...shopClaims].sort((a, b) => a.createdAt.localeCompare(b.createdAt) || a.id - b.id);
      expect(logged.map((c) => [c.sequence, c.number])).toEqual(logged.map((_, i) => [i + 1, `${code}-W${String(i + 1).padStart(5, '0')}`]));
    }
  });

  it('follows each claim from a delivered unit through the workflow, each step in opening hours by someone who may take it, due as the API sets it', async () => {
    const events = groupBy(await h.db.selectFrom('claimEvents').selectAll().orderBy('id').execute(), (e) => e.claimId);
    const now = h.clock.now.toISOString();
    for (const claim of await claims()) {
      const trail = events.get(claim.id)!;
      expect([claim.buildStatus, claim.lineBuildId, claim.serialNumber !== null]).toEqual(['delivered', claim.buildId, true]);
      expect(isoDay(localDay(claim.timeZone, Date.parse(claim.createdAt))) >= claim.failedOn, claim.number).toBe(true);
      expect(trail[0]).toMatchObject({ fromStatus: null, toStatus: 'logged', at: claim.createdAt, actorId: claim.createdBy });
      trail.slice(1).forEach((e, i) => {
        expect(findClaimTransition(trail[i]!.toStatus, e.toStatus), `${claim.number} ${trail[i]!.toStatus} → ${e.toStatus}`).toBeDefined();
        expect([e.fromStatus, e.at > trail[i]!.at]).toEqual([trail[i]!.toStatus, true]);
      });
      const last = trail.at(-1)!;
      expect([last.toStatus, last.at <= now, claim.updatedAt >= last.at]).toEqual([claim.status, true, true]);
      expect(claim.dueOn, claim.number).toBe(dueOnFor(claim.status, claim.timeZone, new Date(last.at)));
      for (const e of trail) {
        const minute = localMinute(claim.timeZone, e.at);
        expect(minute >= 480 && minute <= 1050, `${claim.number} ${e.toStatus} at ${e.at}`).toBe(true);
        const role = await roleOf(e.actorId, claim);
        if (e.toStatus === 'approved') expect(role).toBe(claim.creditApprovedCents! > claim.claimApprovalLimitCents ? 'regional_manager' : 'location_lead');
        else if (e.toStatus === 'denied' || (e.toStatus === 'logged' && claim.outOfWarranty)) expect(role).toBe('location_lead');
        else expect(role, `${claim.number} ${e.toStatus}`).toBe('warranty_clerk');
      }
    }
  });

  it('logs a unit past its warranty only as goodwill, and records credits, RMA numbers and replacements where the status says so', async () => {
    const all = await claims();
    for (const claim of all) {
      const deliveredOn = isoDay(localDay(claim.timeZone, Date.parse(claim.deliveredAt!)));
      expect(claim.failedOn >= deliveredOn).toBe(true);
      expect(claim.outOfWarranty, claim.number).toBe(claim.failedOn > addMonthsIso(deliveredOn, claim.warrantyMonths) ? 1 : 0);
      if (claim.outOfWarranty) expect(claim.coverage).toBe('goodwill');
      const answered = ['approved', 'denied', 'credited', 'closed'].includes(claim.status);
      expect(claim.vendorRmaNumber !== '', claim.number).toBe(answered);
      if (['approved', 'credited'].includes(claim.status)) expect(claim.creditApprovedCents).toBeGreaterThan(0);
      if (['logged', 'evidence_ready', 'sent_to_vendor', 'denied'].includes(claim.status)) expect([claim.creditApprovedCents, claim.creditReceivedCents]).toEqual([null, null]);
      if (claim.status === 'credited') expect(claim.creditReceivedCents).toBeGreaterThan(0);
      if (claim.creditReceivedCents !== null) expect(claim.creditReceivedCents).toBeLessThanOrEqual(claim.creditApprovedCents!);
      expect(claim.removedOn !== null, claim.number).toBe(claim.replacementItemId !== null);
    }
    expect(all.filter((c) => c.outOfWarranty).length).toBeGreaterThan(0);
    const replaced = all.filter((c) => c.replacementItemId !== null);
    expect(replaced.length).toBeGreaterThan(50);
    const lines = await h.db.selectFrom('buildItems').selectAll().where('id', 'in', replaced.map((c) => c.replacementItemId!)).execute();
    const corrections = await h.db.selectFrom('buildEvents').select(['buildId', 'note']).where('kind', '=', 'correction').execute();
    for (const claim of replaced) {
      const line = lines.find((l) => l.id === claim.replacementItemId)!;
      expect([line.buildId, line.sku, line.unitPriceCents, line.createdAt.slice(0, 10), line.removedOn]).toEqual([claim.buildId, claim.sku, 0, claim.removedOn, null]);
      expect(claim.removedOn! >= claim.failedOn).toBe(true);
      expect(corrections.filter((e) => e.buildId === claim.buildId && e.note.includes(`${claim.number}:`) && e.note.includes(line.serialNumber!))).toHaveLength(1);
    }
    const removed = await h.db.selectFrom('buildItems').select('id').where('removedOn', 'is not', null).execute();
    expect(removed).toHaveLength(replaced.length);
  });

  it('gives Austin clearly more workmanship claims than the other shops', async () => {
    const all = await claims();
    const workmanship = (c: Claim) => c.coverage === 'workmanship';
    const austin = all.filter((c) => c.code === 'AUS');
    const others = all.filter((c) => c.code !== 'AUS');
    expect(austin.length).toBeGreaterThan(20);
    expect(share(austin, workmanship)).toBeGreaterThan(0.45);
    expect(share(austin, workmanship)).toBeGreaterThan(2.5 * share(others, workmanship));
    for (const [code, shopClaims] of groupBy(others, (c) => c.code)) {
      if (shopClaims.length >= 25) expect(share(shopClaims, workmanship), code).toBeLessThan(share(austin, workmanship) - 0.2);
    }
    const connections = (c: Claim) => c.failureMode === 'loose_or_burnt_connection';
    expect(share(austin, connections)).toBeGreaterThan(2 * share(others, connections));
  });

  it('makes the TDW-DC40 serials TW2506- to TW2508- a bad batch, and electronics fail younger than compressors', async () => {
    const units = await h.db
      .selectFrom('buildItems as i')
      .innerJoin('builds as b', 'b.id', 'i.buildId')
      .leftJoin('warrantyClaims as w', 'w.buildItemId', 'i.id')
      .select(['i.serialNumber', 'w.id as claimId'])
      .where('i.sku', '=', 'TDW-DC40')
      .where('b.status', '=', 'delivered')
      .where('i.unitPriceCents', '>', 0)
      .execute();
    const inBatch = units.filter((u) => u.serialNumber! >= 'TW2506-' && u.serialNumber! < 'TW2509-');
    const outside = units.filter((u) => !inBatch.includes(u));
    expect(inBatch.length).toBeGreaterThan(40);
    expect(inBatch.filter((u) => u.claimId !== null).length).toBeGreaterThan(10);
    const failed = (u: { claimId: number | null }) => u.claimId !== null;
    expect(share(inBatch, failed)).toBeGreaterThan(3 * share(outside, failed));

    const all = await claims();
    const monthsInService = (c: Claim) => (Date.parse(c.failedOn) - Date.parse(c.deliveredAt!)) / (30.44 * 86_400_000);
    const median = (values: number[]) => values.sort((a, b) => a - b)[Math.floor(values.length / 2)]!;
    const ageOf = (category: string) => median(all.filter((c) => c.category === category && c.coverage === 'vendor_defect' && c.sku !== 'TDW-DC40').map(monthsInService));
    expect(ageOf('dc_dc_charger')).toBeLessThan(ageOf('air_compressor'));
  });

  it('keeps generated evidence on every claim past logged, counted in the request to the vendor and served to the shop only', async () => {
    const all = await claims();
    const evidence = await h.db.selectFrom('claimEvidence').selectAll().orderBy('id').execute();
    expect(evidence).toHaveLength(storedFiles);
    const files = groupBy(evidence, (e) => e.claimId);
    const sent = await h.db.selectFrom('claimEvents').select(['claimId', 'note']).where('toStatus', '=', 'sent_to_vendor').execute();
    for (const claim of all) {
      const own = files.get(claim.id) ?? [];
      expect(own.length > 0, claim.number).toBe(claim.status !== 'logged');
      const note = sent.find((e) => e.claimId === claim.id)?.note;
      if (note) expect(note).toMatch(new RegExp(`with ${own.length} files?$`));
      for (const file of own) {
        const bytes = readFileSync(join(h.dataDir, 'evidence', file.storedName));
        expect([detectEvidenceType(bytes), bytes.length]).toEqual([file.contentType, file.sizeBytes]);
        expect(existsSync(join(h.dataDir, 'evidence', `${file.storedName}.thumb.jpg`))).toBe(file.hasThumbnail === 1);
      }
    }
    expect(new Set(evidence.map((e) => e.contentType))).toEqual(new Set(['image/png', 'application/pdf']));

    const clerk = await h.signedIn('warranty@demo.busbar.test');
    const denver = all.find((c) => c.code === 'DEN' && files.get(c.id)?.some((f) => f.contentType === 'image/png'))!;
    for (const file of files.get(denver.id)!) {
      const res = await clerk.get(`/api/claims/${denver.id}/evidence/${file.id}`).buffer(true);
      expect([res.status, res.headers['content-type'], res.headers['x-content-type-options']]).toEqual([200, file.contentType, 'nosniff']);
      expect(Buffer.compare(res.body as Buffer, readFileSync(join(h.dataDir, 'evidence', file.storedName)))).toBe(0);
    }
    const photo = files.get(denver.id)!.find((f) => f.hasThumbnail === 1)!;
    expect((await clerk.get(`/api/claims/${denver.id}/evidence/${photo.id}?thumbnail=true`)).headers['content-type']).toBe('image/jpeg');
    const austin = all.find((c) => c.code === 'AUS' && files.has(c.id))!;
    expect((await clerk.get(`/api/claims/${austin.id}/evidence/${files.get(austin.id)![0]!.id}`)).status).toBe(404);
    const detail = await clerk.get(`/api/claims/${denver.id}`);
    expect(detail.body.evidence.map((e: { id: number }) => e.id)).toEqual(files.get(denver.id)!.map((f) => f.id));
  });
});
