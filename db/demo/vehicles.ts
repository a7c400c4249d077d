import type { BODY_STYLES } from '@busbar/shared';
import { weighted, type Random } from './draw.ts';

type BodyStyle = (typeof BODY_STYLES)[number];

/** Invented makes and models; how often each turns up in a 12-volt shop. */
const MODELS: readonly (readonly [{ make: string; model: string; bodyStyle: BodyStyle }, number])[] = [
  [{ make: 'Corvane', model: 'Tallgrass 1500', bodyStyle: 'pickup' }, 9],
  [{ make: 'Corvane', model: 'Tallgrass 2500 HD', bodyStyle: 'pickup' }, 6],
  [{ make: 'Corvane', model: 'Tallgrass 3500 Chassis', bodyStyle: 'chassis_cab' }, 2],
  [{ make: 'Halvard', model: 'Longbay 144', bodyStyle: 'van' }, 6],
  [{ make: 'Halvard', model: 'Longbay 170 High Roof', bodyStyle: 'van' }, 7],
  [{ make: 'Halvard', model: 'Stowe 16 Box', bodyStyle: 'box_truck' }, 1],
  [{ make: 'Tessaro', model: 'Marrin', bodyStyle: 'suv' }, 6],
  [{ make: 'Tessaro', model: 'Quarryman 2500', bodyStyle: 'pickup' }, 4],
  [{ make: 'Brunmark', model: 'Fjelder', bodyStyle: 'suv' }, 5],
  [{ make: 'Brunmark', model: 'Oxbeck', bodyStyle: 'pickup' }, 5],
  [{ make: 'Quillon', model: 'Carrack 136', bodyStyle: 'van' }, 4],
  [{ make: 'Quillon', model: 'Carrack 159 Extended', bodyStyle: 'van' }, 4],
  [{ make: 'Orvella', model: 'Saltmarsh', bodyStyle: 'suv' }, 3],
  [{ make: 'Orvella', model: 'Cinderpass', bodyStyle: 'pickup' }, 3],
  [{ make: 'Dunstead', model: 'Workline 4500', bodyStyle: 'chassis_cab' }, 2],
  [{ make: 'Dunstead', model: 'Hauler 14 Box', bodyStyle: 'box_truck' }, 1],
  [{ make: 'Ledgewick', model: 'Scarp', bodyStyle: 'pickup' }, 3],
  [{ make: 'Ledgewick', model: 'Kestle Camper Base', bodyStyle: 'other' }, 1],
];

export interface DemoVehicle {
  year: number;
  bodyStyle: BodyStyle;
  make: string;
  model: string;
}

/** A customer's vehicle, mostly a few years old; the next model year is already on the road. */
export function newVehicle(random: Random, currentYear: number): DemoVehicle {
  const age = Math.floor(random() ** 1.6 * 18);
  return { year: currentYear + 1 - age, ...weighted(random, MODELS) };
}
