import { vinCheckDigit } from '@busbar/calc';
import type { BODY_STYLES } from '@busbar/shared';
import { weighted, type Random } from './draw.ts';
import { seededRandom } from './random.ts';

type BodyStyle = (typeof BODY_STYLES)[number];

export interface DemoModel {
  make: string;
  model: string;
  trim: string;
  bodyStyle: BodyStyle;
}

/** Invented makes, models and trims (no real names or numbers); how often each turns up in a 12-volt shop. */
export const DEMO_MODELS: readonly (readonly [DemoModel, number])[] = [
  [{ make: 'Corvane', model: 'Tallgrass', trim: 'Fieldline', bodyStyle: 'pickup' }, 9],
  [{ make: 'Corvane', model: 'Tallgrass', trim: 'Bullwheel', bodyStyle: 'pickup' }, 6],
  [{ make: 'Corvane', model: 'Tallgrass', trim: 'Flatdeck Cab', bodyStyle: 'chassis_cab' }, 2],
  [{ make: 'Halvard', model: 'Longbay', trim: 'Wren', bodyStyle: 'van' }, 6],
  [{ make: 'Halvard', model: 'Longbay', trim: 'Heron Tallback', bodyStyle: 'van' }, 7],
  [{ make: 'Halvard', model: 'Stowe', trim: 'Cubeline', bodyStyle: 'box_truck' }, 1],
  [{ make: 'Tessaro', model: 'Marrin', trim: 'Strand', bodyStyle: 'suv' }, 6],
  [{ make: 'Tessaro', model: 'Quarryman', trim: 'Brace', bodyStyle: 'pickup' }, 4],
  [{ make: 'Brunmark', model: 'Fjelder', trim: 'Hollin', bodyStyle: 'suv' }, 5],
  [{ make: 'Brunmark', model: 'Oxbeck', trim: 'Tarn', bodyStyle: 'pickup' }, 5],
  [{ make: 'Quillon', model: 'Carrack', trim: 'Petrel', bodyStyle: 'van' }, 4],
  [{ make: 'Quillon', model: 'Carrack', trim: 'Skua Longframe', bodyStyle: 'van' }, 4],
  [{ make: 'Orvella', model: 'Saltmarsh', trim: 'Larchwood', bodyStyle: 'suv' }, 3],
  [{ make: 'Orvella', model: 'Cinderpass', trim: 'Flint', bodyStyle: 'pickup' }, 3],
  [{ make: 'Dunstead', model: 'Workline', trim: 'Anvil Cab', bodyStyle: 'chassis_cab' }, 2],
  [{ make: 'Dunstead', model: 'Cartwright', trim: 'Boxbody', bodyStyle: 'box_truck' }, 1],
  [{ make: 'Ledgewick', model: 'Scarp', trim: 'Talus', bodyStyle: 'pickup' }, 3],
  [{ make: 'Ledgewick', model: 'Kestle', trim: 'Campframe', bodyStyle: 'other' }, 1],
];

/**
 * A world manufacturer identifier per invented make. They start with 0, a first character no
 * region is given under ISO 3780 as far as we know (from memory, not checked against SAE's register).
 */
const WMI: Record<string, string> = {
  Corvane: '0CV', Halvard: '0HL', Tessaro: '0TS', Brunmark: '0BM', Quillon: '0KL', Orvella: '0RV', Dunstead: '0DS', Ledgewick: '0LW',
};

/** Model year codes of VIN position 10 from 2001 (49 CFR 565.15(b)): digits 1-9, then letters without I, O, Q, U, Z, 0. */
const YEAR_CODES = '123456789ABCDEFGHJKLMNPRSTVWXY';
const VIN_CHARACTERS = 'ABCDEFGHJKLMNPRSTUVWXYZ0123456789';
const PLATE_LETTERS = 'ABCDEFGHJKLMNPRSTUVWXYZ';

export interface DemoVehicle {
  year: number;
  bodyStyle: BodyStyle;
  make: string;
  model: string;
}

/** A customer's vehicle, mostly a few years old; the next model year is already on the road. */
export function newVehicle(random: Random, currentYear: number): DemoVehicle {
  const age = Math.floor(random() ** 1.6 * 18);
  const { make, model, trim, bodyStyle } = weighted(random, DEMO_MODELS);
  return { year: currentYear + 1 - age, bodyStyle, make, model: `${model} ${trim}` };
}

export interface DemoIdentity {
  vin: string;
  plate: string;
  mileage: number;
  mileageReadOn: string;
}

/**
 * VIN, plate and miles of a demo vehicle, from a generator of its own seeded by the vehicle's id,
 * so adding them changes no other draw of the demo network. About 12,000 miles a year on the road.
 */
export function vehicleIdentity(id: number, vehicle: DemoVehicle, readOn: string): DemoIdentity {
  const random = seededRandom(0x5eed_0000 + id);
  const char = (from: string) => from[Math.floor(random() * from.length)]!;
  const chars = (from: string, n: number) => Array.from({ length: n }, () => char(from)).join('');
  const yearCode = YEAR_CODES[(((vehicle.year - 2001) % 30) + 30) % 30]!;
  const serial = String(Math.floor(random() * 1_000_000)).padStart(6, '0');
  const blank = `${WMI[vehicle.make] ?? '0ZZ'}${chars(VIN_CHARACTERS, 5)}0${yearCode}${char(PLATE_LETTERS)}${serial}`;
  const vin = `${blank.slice(0, 8)}${vinCheckDigit(blank)}${blank.slice(9)}`;
  const plate = `${chars(PLATE_LETTERS, 3)}-${String(Math.floor(random() * 10_000)).padStart(4, '0')}`;
  const yearsOnRoad = Math.max(0.2, Number(readOn.slice(0, 4)) - vehicle.year + 0.5);
  const mileage = Math.round(yearsOnRoad * 12_000 * (0.5 + random()));
  return { vin, plate, mileage, mileageReadOn: readOn };
}
