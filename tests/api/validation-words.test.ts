import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addCustomerWithVehicle } from '../support/build-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

/** Zod's stock wording, which never reaches a person. */
const STOCK = /expected|invalid input|invalid option|>=|<=|too small|too big|unrecognized key/i;
const CONTROL = 'Take out the invisible control characters (such as NUL) pasted into this text';

let h: Harness;
let lead: Agent;
let owner: Agent;
let den: number;
let customerId: number;
let vehicleId: number;

beforeAll(async () => {
  h = await startHarness();
  lead = await h.signedIn(SIGN_INS.lead);
  owner = await h.signedIn(SIGN_INS.owner);
  den = (await demoIds(h.db)).location('DEN');
  ({ customer: { id: customerId }, vehicle: { id: vehicleId } } = await addCustomerWithVehicle(h.db, den));
});
afterAll(() => h.close());

type Send = (change: Record<string, unknown>) => Promise<{ status: number; body: { error?: { fields?: Record<string, string> } } }>;
const as = (who: () => Agent, path: string, valid: () => Record<string, unknown>): Send => (change) => who().post(path).send({ ...valid(), ...change });

const customer = as(() => lead, '/api/customers', () => ({ locationId: den, name: 'Orla Fenwick' }));
const vehicle = as(() => lead, '/api/vehicles', () => ({ customerId, year: 2020, bodyStyle: 'van', make: 'Alder', model: 'Trekker' }));
const build = as(() => lead, '/api/builds', () => ({ locationId: den, customerId, vehicleId }));
const vendor = as(() => owner, '/api/vendors', () => ({ name: 'Words Test Vendor', rmaEmail: 'rma@words.test' }));
const invite = as(() => lead, '/api/staff/invites', () => ({ email: 'words.tech@demo.busbar.test', name: 'Words Tech', role: 'technician', locationId: den }));

/** Each kind of bad value, sent to a real route: the field's message in plain words. */
const CASES: [string, Send, Record<string, unknown>, string, string][] = [
  ['a missing text field', customer, { name: undefined }, 'name', 'Fill this in'],
  ['blank text', customer, { name: '   ' }, 'name', 'Enter a name'],
  ['a number for text', customer, { name: 42 }, 'name', 'Enter text'],
  ['text that is too long', customer, { name: 'n'.repeat(121) }, 'name', 'Use at most 120 characters'],
  ['NUL in a name', customer, { name: 'Orla\u0000Fenwick' }, 'name', CONTROL],
  ['a C1 control in notes', customer, { notes: 'call \u0085 first' }, 'notes', CONTROL],
  ['a line break in an address line', customer, { addressLine1: '12 Elm St\nFlat 3' }, 'addressLine1', 'Keep this to one line'],
  ['an e-mail address without a domain', customer, { email: 'orla' }, 'email', 'Enter a valid e-mail address'],
  ['a field the form has not', customer, { createdBy: 1 }, 'createdBy', 'Unknown field'],
  ['text for a whole number', customer, { locationId: 'DEN' }, 'locationId', 'Enter a whole number'],
  ['blank make', vehicle, { make: ' ' }, 'make', 'Enter the make'],
  ['an escape in a model', vehicle, { model: 'Trek\u001bker' }, 'model', CONTROL],
  ['a body style not on the list', vehicle, { bodyStyle: 'boat' }, 'bodyStyle', 'Choose a body style'],
  ['a year as a fraction', vehicle, { year: 2020.5 }, 'year', 'Enter a year'],
  ['a date that does not exist', build, { bookedFor: '2026-13-01' }, 'bookedFor', 'Use a date like 2026-03-31'],
  ['text for hours', build, { laborHours: 'six' }, 'laborHours', 'Enter hours'],
  ['an id of zero', build, { leadTechnicianId: 0 }, 'leadTechnicianId', 'Use more than 0'],
  ['notes that are too long', build, { notes: 'n'.repeat(4001) }, 'notes', 'Use at most 4000 characters'],
  ['DEL in notes', build, { notes: 'rush\u007f job' }, 'notes', CONTROL],
  ['text for yes or no', vendor, { active: 'yes' }, 'active', 'Choose yes or no'],
  ['a negative whole number', vendor, { defaultWarrantyMonths: -1 }, 'defaultWarrantyMonths', 'Use 0 or more'],
  ['a whole number too large', vendor, { defaultWarrantyMonths: 241 }, 'defaultWarrantyMonths', 'Use 240 or less'],
  ['NUL in a vendor name', vendor, { name: '\u0000' }, 'name', CONTROL],
  ['a role not on the list', invite, { role: 'boss' }, 'role', 'Choose a role'],
  ['a tab in a person’s name', invite, { name: 'Words\tTech' }, 'name', 'Take out the tab characters'],
];

describe('field messages in people’s words', () => {
  it.each(CASES)('names %s', async (_kind, send, change, field, message) => {
    const res = await send(change);
    expect(res.status).toBe(400);
    const fields = res.body.error?.fields ?? {};
    expect(fields[field]).toBe(message);
    for (const words of Object.values(fields)) expect(words).not.toMatch(STOCK);
  });

  it.each([
    ['a page number in words', '/api/builds?page=first', 'page', 'Enter a whole number'],
    ['a status not on the list', '/api/builds?status=finished', 'status', 'Pick one of: draft, quoted, booked, in_bay, quality_check, delivered, cancelled'],
    ['NUL in a search', '/api/builds?q=a%00b', 'q', CONTROL],
    ['an unknown filter', '/api/customers?colour=red', 'colour', 'Unknown field'],
  ])('names %s in a list’s query', async (_kind, path, field, message) => {
    const res = await lead.get(path);
    expect(res.status).toBe(400);
    expect(res.body.error.fields[field]).toBe(message);
    for (const words of Object.values(res.body.error.fields as Record<string, string>)) expect(words).not.toMatch(STOCK);
  });

  it('keeps line breaks in notes and stores text trimmed', async () => {
    const res = await customer({ name: '  Orla Fenwick ', notes: 'Gate code 4411\r\n\tcall first' });
    expect(res.status).toBe(201);
    const row = await h.db.selectFrom('customers').select(['name', 'notes']).where('id', '=', (res.body as { id: number }).id).executeTakeFirstOrThrow();
    expect(row).toEqual({ name: 'Orla Fenwick', notes: 'Gate code 4411\r\n\tcall first' });
  });
});
