import { call, type Person } from './client.ts';
import { latency, type Latency } from './stats.ts';

export interface ContentionFigures {
  importRows: number;
  importMs: number;
  importStatus: number;
  ownerRequests: number;
  leadDetail: Latency;
  /** A lead's new customers meanwhile, one every 250 ms: a save waits for the import's write lock. */
  leadWrites: Latency;
}

/** A CSV of `rows` delivered builds at the lead's shop, with parts of the demo catalog. */
function importCsv(rows: number): string {
  const header = 'customer_name,customer_email,vehicle_year,vehicle_body_style,vehicle_make,vehicle_model,status,booked_for,delivered_on,lead_technician_email,labor_hours,items';
  const lines = Array.from(
    { length: rows },
    (_, i) => `Imported Customer ${i},imported.${i}@example.test,2021,van,Halvard,Longbay 144,delivered,2025-03-01,2025-03-04,,4.5,"WXW-FB6 x2; WXW-LUG10 x1"`,
  );
  return [header, ...lines].join('\r\n');
}

/**
 * The lead opens a build again and again, and adds a customer now and then, while the owner imports
 * `rows` builds and, meanwhile and for at least five seconds, reads the network's biggest lists
 * (text search, deep pages, the audit log, a category's reliability).
 */
export async function detailDuringOwnerWork(owner: Person, lead: Person, shop: { locationId: number; buildId: number }, rows: number): Promise<ContentionFigures> {
  let busy = true;
  let ownerRequests = 0;
  const started = performance.now();
  const importing = call(owner, 'POST', '/api/imports/builds', { locationId: shop.locationId, csv: importCsv(rows), dryRun: false }).then((answer) => {
    return { ...answer, ms: performance.now() - started };
  });
  const ownerLists = (async () => {
    const paths = [
      '/api/builds?q=Holloway',
      '/api/builds?page=200',
      '/api/audit?entity=build&page=150',
      '/api/customers?q=ar',
      '/api/builds?status=delivered&sort=totalCents&order=asc',
      '/api/reliability/category/house_battery',
    ];
    for (let i = 0; busy; i++) {
      await call(owner, 'GET', paths[i % paths.length]!);
      ownerRequests++;
    }
  })();
  const times: number[] = [];
  const leadLoop = (async () => {
    while (busy) times.push((await call(lead, 'GET', `/api/builds/${shop.buildId}`)).ms);
  })();
  const writeTimes: number[] = [];
  const writeLoop = (async () => {
    for (let i = 0; busy; i++) {
      const answer = await call(lead, 'POST', '/api/customers', { locationId: shop.locationId, name: `Meanwhile Customer ${i}`, email: `meanwhile.${i}.${Date.now()}@example.test` });
      if (answer.status !== 201) throw new Error(`a save during the import answered ${answer.status}: ${answer.body.slice(0, 200)}`);
      writeTimes.push(answer.ms);
      await new Promise((r) => setTimeout(r, 250));
    }
  })();
  const imported = await importing;
  // The owner keeps reading for at least five seconds, so a quick import still gives enough samples.
  while (performance.now() - started < 5000) await new Promise((r) => setTimeout(r, 50));
  busy = false;
  await Promise.all([ownerLists, leadLoop, writeLoop]);
  return { importRows: rows, importMs: imported.ms, importStatus: imported.status, ownerRequests, leadDetail: latency(times), leadWrites: latency(writeTimes) };
}
