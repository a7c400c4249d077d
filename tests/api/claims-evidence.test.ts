import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import type { ClaimDetail } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addDeliveredUnit, SMALL_PNG, uploadEvidence } from '../support/claim-fixtures.ts';
import { signInEveryone, type SignIn } from '../support/staff-fixtures.ts';

let h: Harness;
let agents: Record<SignIn, Agent>;
let claim: ClaimDetail;
let dataDir: string;

const stored = () => {
  try {
    return readdirSync(join(dataDir, 'evidence')).length;
  } catch {
    return 0;
  }
};
const rows = async () => Number((await h.db.selectFrom('claimEvidence').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n);

beforeAll(async () => {
  h = await startHarness();
  dataDir = h.dataDir;
  agents = await signInEveryone(h);
  const unit = await addDeliveredUnit(h.db, (await demoIds(h.db)).location('DEN'));
  claim = (await agents.warranty.post('/api/claims').send({ buildItemId: unit.buildItemId, failedOn: '2026-06-01', failureMode: 'water_ingress', coverage: 'vendor_defect', symptoms: 'Water in the case' })).body;
});
afterAll(() => h.close());

describe('uploading evidence', () => {
  it('keeps a photo under a generated name with a thumbnail, and lists it on the claim', async () => {
    const res = await uploadEvidence(agents.warranty, claim.id, SMALL_PNG, '../../etc/swollen case.png');
    expect(res.status).toBe(201);
    const [evidence] = (res.body as ClaimDetail).evidence;
    expect(evidence).toMatchObject({ fileName: 'swollen case.png', contentType: 'image/png', sizeBytes: SMALL_PNG.length, hasThumbnail: true, uploadedByName: expect.any(String), deletedAt: null });
    const row = await h.db.selectFrom('claimEvidence').selectAll().where('id', '=', evidence!.id).executeTakeFirstOrThrow();
    expect(row.storedName).toMatch(/^[0-9a-f-]{36}\.png$/);
  });

  it('serves the file and its thumbnail only to people who may read the claim, with nosniff and a safe name', async () => {
    const id = (await agents.warranty.get(`/api/claims/${claim.id}`)).body.evidence[0].id;
    const file = await agents.accountant.get(`/api/claims/${claim.id}/evidence/${id}`).buffer(true);
    expect(file.status).toBe(200);
    expect(Buffer.compare(file.body as Buffer, SMALL_PNG)).toBe(0);
    expect(file.headers).toMatchObject({ 'content-type': 'image/png', 'x-content-type-options': 'nosniff' });
    expect(file.headers['content-disposition']).toBe("inline; filename*=UTF-8''swollen%20case.png");
    const thumb = await agents.lead.get(`/api/claims/${claim.id}/evidence/${id}?thumbnail=true`).buffer(true);
    expect(thumb.headers['content-type']).toBe('image/jpeg');
    expect([...(thumb.body as Buffer).subarray(0, 3)]).toEqual([0xff, 0xd8, 0xff]);
    expect((await agents.lead2.get(`/api/claims/${claim.id}/evidence/${id}`)).status).toBe(404);
    expect((await agents.tech.get(`/api/claims/${claim.id}/evidence/${id}`)).status).toBe(404);
  });

  it('refuses a wrong type, a renamed executable, an oversized file and an empty request, storing nothing', async () => {
    const [filesBefore, rowsBefore] = [stored(), await rows()];
    const elf = Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1]), Buffer.alloc(200)]);
    const cases = [
      await uploadEvidence(agents.warranty, claim.id, elf, 'photo.jpg'),
      await uploadEvidence(agents.warranty, claim.id, Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"/>'), 'diagram.png'),
      await uploadEvidence(agents.warranty, claim.id, Buffer.concat([SMALL_PNG, Buffer.alloc(16 * 2 ** 20)]), 'huge.png'),
      await agents.warranty.post(`/api/claims/${claim.id}/evidence`).field('note', 'no file'),
    ];
    for (const res of cases) {
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toHaveProperty('file');
    }
    expect(cases[0]!.body.error.fields.file).toBe('Upload a JPEG, PNG, WebP or HEIC photo, or a PDF');
    expect(cases[2]!.body.error.fields.file).toContain('larger than 15 MB');
    expect([stored(), await rows()]).toEqual([filesBefore, rowsBefore]);
  });

  it('takes PDFs and HEIC photos by their bytes, without a thumbnail for HEIC', async () => {
    const pdf = await uploadEvidence(agents.warranty, claim.id, Buffer.from('%PDF-1.7\n%âãÏÓ\n1 0 obj\n<<>>\nendobj\ntrailer\n<<>>\n%%EOF\n', 'latin1'), 'invoice.pdf');
    expect(pdf.body.evidence.at(-1)).toMatchObject({ contentType: 'application/pdf', hasThumbnail: false });
    const heic = Buffer.concat([Buffer.from([0, 0, 0, 0x18]), Buffer.from('ftypheic', 'latin1'), Buffer.alloc(64)]);
    const photo = await uploadEvidence(agents.warranty, claim.id, heic, 'IMG_0042.HEIC');
    expect(photo.body.evidence.at(-1)).toMatchObject({ contentType: 'image/heic', hasThumbnail: false, fileName: 'IMG_0042.HEIC' });
  });

  it('lets only those who work the claim upload: not the accountant, a technician or another location', async () => {
    expect((await uploadEvidence(agents.accountant, claim.id)).status).toBe(403);
    expect((await uploadEvidence(agents.tech, claim.id)).status).toBe(404);
    expect((await uploadEvidence(agents.lead2, claim.id)).status).toBe(404);
  });
});

describe('deleting evidence', () => {
  it('is recorded with who and why, removes the file, and keeps the entry', async () => {
    const before = (await agents.warranty.get(`/api/claims/${claim.id}`)).body as ClaimDetail;
    const target = before.evidence[0]!;
    expect((await agents.warranty.delete(`/api/claims/${claim.id}/evidence/${target.id}`).send({})).body.error.fields).toHaveProperty('reason');
    const res = await agents.warranty.delete(`/api/claims/${claim.id}/evidence/${target.id}`).send({ reason: 'Wrong unit in the photo' });
    expect(res.status).toBe(200);
    expect((res.body as ClaimDetail).evidence[0]).toMatchObject({ id: target.id, deletedAt: expect.any(String), deleteReason: 'Wrong unit in the photo', deletedByName: expect.any(String) });
    expect((await agents.warranty.get(`/api/claims/${claim.id}/evidence/${target.id}`)).status).toBe(404);
    const audit = await h.db.selectFrom('auditLog').select(['action', 'after']).where('entity', '=', 'claim').where('entityId', '=', claim.id).where('action', '=', 'claim.evidence.delete').execute();
    expect(audit).toEqual([{ action: 'claim.evidence.delete', after: JSON.stringify({ reason: 'Wrong unit in the photo' }) }]);
  });
});
