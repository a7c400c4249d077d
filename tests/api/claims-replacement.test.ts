import type { BuildDetail, ClaimDetail } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addDeliveredUnit } from '../support/claim-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
let clerk: Agent;
let unit: Awaited<ReturnType<typeof addDeliveredUnit>>;
let claim: ClaimDetail;

beforeAll(async () => {
  h = await startHarness();
  clerk = await h.signedIn(SIGN_INS.warranty);
  unit = await addDeliveredUnit(h.db, (await demoIds(h.db)).location('DEN'));
  claim = (await clerk.post('/api/claims').send({ buildItemId: unit.buildItemId, failedOn: '2026-06-05', failureMode: 'cell_or_bms_fault', coverage: 'vendor_defect', symptoms: 'One cell at 2.1 V' })).body;
});
afterAll(() => h.close());

const replace = (body: Record<string, unknown>) => clerk.post(`/api/claims/${claim.id}/replacement`).send({ version: claim.version, ...body });

describe('replacing a failed unit', () => {
  it('refuses a date before the failure and a serial number already recorded', async () => {
    expect((await replace({ serialNumber: 'NEW-1', replacedOn: '2026-06-01' })).body.error.fields).toHaveProperty('replacedOn');
    expect((await replace({ serialNumber: unit.serialNumber, replacedOn: '2026-06-08' })).status).toBe(409);
  });

  it('adds the replacement as a new line installed that day, removes the failed unit that day, and says so on the build', async () => {
    const res = await replace({ serialNumber: 'NEW-0042', replacedOn: '2026-06-08' });
    expect(res.status).toBe(200);
    claim = res.body;
    expect(claim).toMatchObject({ replacementSerialNumber: 'NEW-0042', replacementItemId: expect.any(Number) });
    const build = (await (await h.signedIn(SIGN_INS.lead)).get(`/api/builds/${unit.buildId}`)).body as BuildDetail;
    const [failed, replacement] = build.items;
    expect(failed).toMatchObject({ id: unit.buildItemId, removedOn: '2026-06-08' });
    expect(replacement).toMatchObject({ id: claim.replacementItemId, sku: unit.item.sku, serialNumber: 'NEW-0042', removedOn: null, unitPriceCents: 0 });
    const line = await h.db.selectFrom('buildItems').select('createdAt').where('id', '=', claim.replacementItemId!).executeTakeFirstOrThrow();
    expect(line.createdAt.slice(0, 10)).toBe('2026-06-08');
    expect(build.totalCents).toBe(unit.item.unitPriceCents);
    expect(build.events.at(-1)).toMatchObject({ kind: 'correction', note: expect.stringContaining('replaced by') });
  });

  it('lets the replacement be claimed only from the day it went in', async () => {
    const on = (failedOn: string) =>
      clerk.post('/api/claims').send({ buildItemId: claim.replacementItemId, failedOn, failureMode: 'cell_or_bms_fault', coverage: 'vendor_defect', symptoms: 'Dead again' });
    expect((await on('2026-06-07')).body.error.fields).toEqual({ failedOn: 'The unit was put in on 2026-06-08: it cannot have failed before' });
    expect((await on('2026-06-09')).status).toBe(201);
  });

  it('takes one replacement per claim, and none from someone who does not work claims', async () => {
    expect((await replace({ serialNumber: 'NEW-0043', replacedOn: '2026-06-09' })).status).toBe(409);
    const accountant = await h.signedIn(SIGN_INS.accountant);
    expect((await accountant.post(`/api/claims/${claim.id}/replacement`).send({ version: claim.version, serialNumber: 'NEW-9', replacedOn: '2026-06-09' })).status).toBe(403);
  });
});
