import type { BuildDetail } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { createBuild } from '../support/build-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

const base = {
  systemV: 12,
  gauge: 'awg',
  loads: [
    { name: 'Fridge', watts: 45, hoursPerDay: 24, dutyCycle: 0.4 },
    { name: 'Lights', watts: 20, hoursPerDay: 5, activeHours: [18, 19, 20, 21, 22] },
  ],
  bank: { chemistry: 'lifepo4', capacityAh: 200 },
  starterBattery: { capacityAh: 70 },
  dcdcCharger: { outputA: 40 },
  solar: { arrayW: 200, peakSunHours: 5, controller: 'mppt' },
  trip: { daysParked: 3, daysDriving: 1, driveHoursPerDay: 4 },
  circuits: [{ from: 'House bank', to: 'Fuse block', oneWayLengthM: 2, currentA: 30, critical: true, insulationC: 105 }],
};

/** The base plan with one value replaced, named by its path (`loads.0.watts`). */
function variant(path: string, value: unknown): Record<string, unknown> {
  const copy = structuredClone(base) as Record<string, unknown>;
  const keys = path.split('.');
  const parent = keys.slice(0, -1).reduce<Record<string, unknown>>((node, key) => node[key] as Record<string, unknown>, copy);
  parent[keys.at(-1)!] = value;
  return copy;
}

let h: Harness;
let lead: Agent;
let build: BuildDetail;
let denver: number;
beforeAll(async () => {
  h = await startHarness();
  const ids = await demoIds(h.db);
  denver = ids.location('DEN');
  lead = await h.signedIn(SIGN_INS.lead);
  build = await createBuild(h.db, lead, denver);
});
afterAll(() => h.close());

const save = (input: unknown) => lead.put(`/api/builds/${build.id}/plan`).send({ version: 0, input });
const planCount = async () => Number((await h.db.selectFrom('powerPlans').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n);

describe('a plan the schema rejects, naming the field', () => {
  it.each([
    ['a negative load', 'loads.0.watts', -5, 'input.loads.0.watts', 'Power must be more than 0 W'],
    ['a load of no watts', 'loads.0.watts', 0, 'input.loads.0.watts', 'Power must be more than 0 W'],
    ['a load of 250 kW', 'loads.0.watts', 250_000, 'input.loads.0.watts', 'Power must be at most 10,000 W'],
    ['hours given as a word', 'loads.1.hoursPerDay', 'five', 'input.loads.1.hoursPerDay', 'Hours a day must be a number'],
    ['a current left empty (null)', 'circuits.0.currentA', null, 'input.circuits.0.currentA', 'Current must be a number'],
    ['a starter battery of 0 Ah', 'starterBattery.capacityAh', 0, 'input.starterBattery.capacityAh', 'Starter battery capacity must be more than 0 Ah'],
    ['a bank of a million Ah', 'bank.capacityAh', 1_000_000, 'input.bank.capacityAh', 'Capacity must be at most 5,000 Ah'],
    ['an unknown chemistry', 'bank.chemistry', 'nicad', 'input.bank.chemistry', 'Choose LiFePO4, AGM or flooded'],
    ['a run of no length', 'circuits.0.oneWayLengthM', 0, 'input.circuits.0.oneWayLengthM', 'Length must be more than 0 m'],
    ['a run of 5 km', 'circuits.0.oneWayLengthM', 5000, 'input.circuits.0.oneWayLengthM', 'Length must be at most 100 m'],
    ['a 5000 A charger', 'dcdcCharger.outputA', 5000, 'input.dcdcCharger.outputA', 'Charger output must be at most 1,000 A'],
    ['13 peak sun hours', 'solar.peakSunHours', 13, 'input.solar.peakSunHours', 'Peak sun hours must be at most 12 h'],
    ['half a day parked', 'trip.daysParked', 2.5, 'input.trip.daysParked', 'Days parked must be a whole number'],
    ['61 days parked', 'trip.daysParked', 61, 'input.trip.daysParked', 'Days parked must be at most 60'],
    ['an unknown gauge', 'gauge', 'swg', 'input.gauge', 'Choose AWG or mm² for the conductors'],
    ['a 48 V system', 'systemV', 48, 'input.systemV', 'Choose a 12 V or a 24 V system'],
    ['an AWG size that does not exist', 'circuits.0.size', { awg: '5' }, 'input.circuits.0.size', 'Choose an AWG size from 18 to 4/0 or a metric size from 1.5 to 95 mm²'],
    ['a metric size that does not exist', 'circuits.0.size', { mm2: 3 }, 'input.circuits.0.size', 'Choose an AWG size from 18 to 4/0 or a metric size from 1.5 to 95 mm²'],
    ['an insulation rating without a column', 'circuits.0.insulationC', 100, 'input.circuits.0.insulationC', 'Choose an insulation rating: 60, 75, 80, 90, 105, 125, 200 °C'],
    ['an hour listed twice', 'loads.1.activeHours', [18, 18], 'input.loads.1.activeHours', 'Each hour can be listed only once'],
    ['hour 24', 'loads.1.activeHours', [23, 24], 'input.loads.1.activeHours.1', 'Hour must be at most 23'],
    ['an unknown field on a load', 'loads.0.colour', 'red', 'input.loads.0.colour', 'Unknown field'],
    ['an inverter of 30 % efficiency', 'inverter', { ratedW: 300, efficiency: 0.3 }, 'input.inverter.efficiency', 'Inverter efficiency must be at least 0.5'],
  ])('refuses %s', async (_what, path, value, field, message) => {
    const res = await save(variant(path, value));
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ [field]: message });
  });

  it('refuses a number too large to be finite', async () => {
    const raw = JSON.stringify({ version: 0, input: base }).replace('"watts":45', '"watts":1e400');
    const res = await lead.put(`/api/builds/${build.id}/plan`).set('content-type', 'application/json').send(raw);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['input.loads.0.watts']);
  });

  it('refuses more than 60 loads or 40 circuits', async () => {
    const loads = Array.from({ length: 61 }, (_, i) => ({ name: `Load ${i + 1}`, watts: 5, hoursPerDay: 1 }));
    const circuits = Array.from({ length: 41 }, () => base.circuits[0]);
    expect((await save({ ...base, loads })).body.error.fields).toEqual({ 'input.loads': 'At most 60 loads' });
    expect((await save({ ...base, circuits })).body.error.fields).toEqual({ 'input.circuits': 'At most 40 circuits' });
  });

  it('refuses a negative version and an empty correction note', async () => {
    const res = await lead.put(`/api/builds/${build.id}/plan`).send({ version: -1, input: base, correctionNote: '  ' });
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['correctionNote', 'version']);
  });
});

describe('a plan the computation rejects, naming the field', () => {
  it.each([
    ['an AC load without an inverter', 'loads.0.ac', true, 'input.inverter', 'Must be given when a load runs on AC'],
    ['more running hours than active hours', 'loads.1.hoursPerDay', 6, 'input.loads.1.hoursPerDay', 'Must fit in its 5 active hours; got 6'],
    ['a trip of no days', 'trip', { daysParked: 0, daysDriving: 0, driveHoursPerDay: 4 }, 'input.trip', 'Must last 1 to 90 days; got 0'],
    ['a drive past midnight', 'trip', { daysParked: 3, daysDriving: 1, driveHoursPerDay: 4, driveStartHour: 22 }, 'input.trip.driveHoursPerDay', 'Must be a number at least 0 and at most 2; got 4'],
  ])('refuses %s', async (_what, path, value, field, message) => {
    const res = await save(variant(path, value));
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'invalid', fields: { [field]: message } });
    expect(Object.keys(res.body.error.fields)).toEqual([field]);
  });

  it('answers the same for a quick plan', async () => {
    const res = await lead.post('/api/plans').send({ locationId: denver, name: 'Van consult', input: variant('loads.0.ac', true) });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ 'input.inverter': 'Must be given when a load runs on AC' });
  });
});

describe('the quick plan bodies', () => {
  it('names a missing name, location and version', async () => {
    const created = await lead.post('/api/plans').send({ locationId: 'DEN', name: ' ', input: base });
    expect(Object.keys(created.body.error.fields).sort()).toEqual(['locationId', 'name']);
    const updated = await lead.put('/api/plans/1').send({ name: 'Van consult', input: base });
    expect(Object.keys(updated.body.error.fields)).toEqual(['version']);
    const attached = await lead.post('/api/plans/1/attach').send({ buildId: 'DEN-00001', version: 1 });
    expect(Object.keys(attached.body.error.fields)).toEqual(['buildId']);
  });

  it('wrote nothing for any refused plan', async () => {
    expect(await planCount()).toBe(0);
    expect((await save(base)).status).toBe(200);
    expect(await planCount()).toBe(1);
  });
});
