import { describe, expect, it } from 'vitest';
import { foundByVehicle } from '../../apps/web/src/views/builds/buildFilters.ts';

const van = { vehicleVin: '1M8GDM9AXKP042788', vehiclePlate: 'WRN 42' };

describe('why a searched build was found, when its vehicle says so', () => {
  it('names the VIN a piece of it was searched for, whatever the letter case', () => {
    expect(foundByVehicle(van, 'kp0427')).toBe('VIN 1M8GDM9AXKP042788');
    expect(foundByVehicle(van, '  1M8GDM9AXKP042788 ')).toBe('VIN 1M8GDM9AXKP042788');
  });

  it('names the plate, spaces and all', () => {
    expect(foundByVehicle(van, 'wrn 4')).toBe('Plate WRN 42');
  });

  it('says nothing without a search, for a text found elsewhere, or for a vehicle without VIN or plate', () => {
    expect(foundByVehicle(van, undefined)).toBeNull();
    expect(foundByVehicle(van, '   ')).toBeNull();
    expect(foundByVehicle(van, 'Calloway')).toBeNull();
    expect(foundByVehicle({ vehicleVin: null, vehiclePlate: null }, 'WRN')).toBeNull();
  });
});
