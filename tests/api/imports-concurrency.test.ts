import type { BuildDetail } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addParts, createBuild } from '../support/build-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
let lead: Agent;
let lead2: Agent;
let parts: Awaited<ReturnType<typeof addParts>>;
let den: number;
let avlBuild: BuildDetail;

const HEADER = 'customer_name,customer_email,vehicle_year,vehicle_body_style,vehicle_make,vehicle_model,status,booked_for,delivered_on,lead_technician_email,labor_hours,items';

beforeAll(async () => {
  h = await startHarness();
  const ids = await demoIds(h.db);
  den = ids.location('DEN');
  parts = await addParts(h.db);
  lead = await h.signedIn(SIGN_INS.lead);
  lead2 = await h.signedIn(SIGN_INS.lead2);
  avlBuild = await createBuild(h.db, lead2, ids.location('AVL'));
});
afterAll(() => h.close());

describe('an import in progress', () => {
  it("leaves other people's requests answered while it runs", async () => {
    const rows = Array.from(
      { length: 2000 },
      (_, i) => `Customer ${i},c${i}@example.test,2020,van,Alder,Trekker,delivered,2025-03-01,2025-03-04,,2,"${parts.battery.sku} #LOAD-${i}; ${parts.fuse.sku} x2"`,
    );
    let importDoneAt = 0;
    const importing = lead
      .post('/api/imports/builds')
      .send({ locationId: den, csv: [HEADER, ...rows].join('\r\n'), dryRun: false })
      .then((res) => {
        importDoneAt = performance.now();
        return res;
      });
    // Ask once the import has surely started on the server, then again and again while it runs.
    const answered: number[] = [];
    const detailTimesMs: number[] = [];
    await new Promise((resolve) => setTimeout(resolve, 200));
    while (!importDoneAt && answered.length < 200) {
      const started = performance.now();
      const res = await lead2.get(`/api/builds/${avlBuild.id}`);
      expect([res.status, res.body.number]).toEqual([200, avlBuild.number]);
      detailTimesMs.push(performance.now() - started);
      answered.push(performance.now());
    }
    const imported = await importing;
    expect(imported.body).toMatchObject({ ok: true, created: 2000 });
    const duringImport = answered.filter((at) => at < importDoneAt);
    expect(duringImport.length).toBeGreaterThan(3);
    expect(Math.max(...detailTimesMs.slice(0, duringImport.length))).toBeLessThan(1000);
  }, 120_000);
});
