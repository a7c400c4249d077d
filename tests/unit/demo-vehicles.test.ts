import { vinProblem } from '@busbar/calc';
import { vehicleBody } from '@busbar/shared';
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../db/demo/random.ts';
import { DEMO_MODELS, newVehicle, vehicleIdentity } from '../../db/demo/vehicles.ts';
import { realNamesIn } from '../support/real-vehicle-names.ts';

describe('demo vehicles', () => {
  it('use no real make, model, trim or model number', () => {
    const names = DEMO_MODELS.map(([m]) => `${m.make} ${m.model} ${m.trim}`);
    expect(names.flatMap((name) => realNamesIn(name).map((word) => `${name}: ${word}`))).toEqual([]);
  });

  it('catch the names the demo used to carry', () => {
    expect(realNamesIn('Tallgrass 2500 HD')).toEqual(['hd', '2500']);
    expect(realNamesIn('Longbay 170 High Roof')).toEqual(['170']);
    expect(realNamesIn('Halvard Sprinter')).toEqual(['sprinter']);
  });

  it('carry a valid VIN of an invented manufacturer, a plate and miles the API accepts', () => {
    const random = seededRandom(7);
    const vins = new Set<string>();
    for (let id = 1; id <= 500; id++) {
      const vehicle = newVehicle(random, 2026);
      const identity = vehicleIdentity(id, vehicle, '2026-05-04');
      expect(vinProblem(identity.vin), identity.vin).toBeNull();
      expect(identity.vin[0]).toBe('0');
      vins.add(identity.vin);
      const { mileageReadOn, ...fields } = identity;
      const parsed = vehicleBody.safeParse({ customerId: 1, notes: '', ...vehicle, ...fields });
      expect(parsed.success, JSON.stringify(parsed.error?.issues)).toBe(true);
      expect(parsed.data).toMatchObject(fields);
    }
    expect(vins.size).toBe(500);
  });

  it('give the same vehicle the same VIN, plate and miles on every run', () => {
    const vehicle = { year: 2021, bodyStyle: 'van' as const, make: 'Halvard', model: 'Longbay Wren' };
    expect(vehicleIdentity(42, vehicle, '2026-05-04')).toEqual(vehicleIdentity(42, vehicle, '2026-05-04'));
    expect(vehicleIdentity(42, vehicle, '2026-05-04').vin).not.toBe(vehicleIdentity(43, vehicle, '2026-05-04').vin);
  });
});
