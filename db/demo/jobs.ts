import { between, chance, weighted, type Random } from './draw.ts';
import type { JobKind } from './profiles.ts';
import { pick } from './random.ts';

/** What goes into each kind of job: the parts (by SKU), the labor and a line for the build's notes. */
export interface JobLine {
  sku: string;
  quantity: number;
}

export interface Job {
  lines: JobLine[];
  /** The network's usual hours for this job, before the shop's own factor. */
  laborHours: number;
  notes: string;
}

const line = (sku: string, quantity = 1): JobLine => ({ sku, quantity });
const maybe = (random: Random, p: number, sku: string, quantity = 1): JobLine[] => (chance(random, p) ? [line(sku, quantity)] : []);

/** A house battery from the shop's usual vendor, sized for the job. */
function houseBattery(random: Random, northvaneShare: number, large: boolean): JobLine {
  if (chance(random, northvaneShare)) {
    return large
      ? line('NVB-LFP200H', weighted(random, [[1, 3], [2, 1]]))
      : weighted(random, [[line('NVB-LFP100H'), 4], [line('NVB-LFP200H'), 3], [line('NVB-AGM100', 2), 2], [line('NVB-FLD115'), 1]]);
  }
  return large
    ? weighted(random, [[line('LKS-LFP300'), 2], [line('LKS-LFP200', 2), 1], [line('LKS-LFP200'), 2]])
    : weighted(random, [[line('LKS-LFP100'), 4], [line('LKS-LFP200'), 4], [line('LKS-LFP300'), 1]]);
}

const wiringKit = (random: Random, heavy: boolean): JobLine[] => [
  line(heavy ? 'WXW-K10-25' : 'WXW-K2-25', heavy && chance(random, 0.5) ? 2 : 1),
  line('WXW-D10-50'),
  line('WXW-LUG10', between(random, 1, 3)),
  line('WXW-LOOM'),
  line('WXW-HS'),
];

function batteryCharging(random: Random, northvaneShare: number): JobLine[] {
  const battery = houseBattery(random, northvaneShare, false);
  const lithium = !/AGM|FLD/.test(battery.sku);
  return [
    battery,
    line(weighted(random, [['TDW-DC25', 3], ['TDW-DC40', 4], ['LKS-DC60', 1]])),
    line(lithium ? 'WXW-BOX200' : 'WXW-TR31'),
    line(chance(random, 0.6) ? 'WXW-FB6' : 'WXW-FB12'),
    line('WXW-MF400'),
    ...maybe(random, 0.5, chance(random, 0.5) ? 'LKS-BM500' : 'TDW-BM300'),
    ...maybe(random, 0.35, chance(random, 0.6) ? 'WXW-SW4' : 'WXW-SW6'),
    ...maybe(random, 0.12, 'NVB-ST65'),
    ...wiringKit(random, false),
  ];
}

function solarInverter(random: Random, northvaneShare: number): JobLine[] {
  const panel = weighted(random, [['SNM-175R', 3], ['SNM-200R', 4], ['SNM-115F', 2], ['SNM-100R', 1]]);
  const panels = between(random, 2, 4);
  const inverter = weighted(random, [['TDW-INV1000', 3], ['LKS-INV1500', 2], ['TDW-INV2000', 4], ['TDW-INV3000C', 2]]);
  const charger = weighted(random, [['TDW-DC40', 3], ['TDW-DC50S', 2], ['LKS-DC60', 2]]);
  const controller = charger === 'TDW-DC50S' ? [] : [line(panels > 2 ? 'TDW-MPPT50' : 'TDW-MPPT30')];
  return [
    houseBattery(random, northvaneShare, true),
    line(charger),
    line(panel, panels),
    ...controller,
    line(inverter),
    ...(inverter === 'TDW-INV3000C' ? [line('WXW-SHORE30')] : []),
    line(chance(random, 0.5) ? 'LKS-BM500' : 'TDW-BM300'),
    line('WXW-FB12'),
    line('WXW-MF400'),
    line(chance(random, 0.3) ? 'WXW-SW8D' : 'WXW-SW6'),
    line('WXW-BOX200'),
    line('SNM-BRK4', panels),
    ...wiringKit(random, true),
  ];
}

function compressor(random: Random): JobLine[] {
  const unit = weighted(random, [['GRA-ZC100', 3], ['GRA-TC150', 5], ['GRA-TT300', 2]]);
  return [
    line(unit),
    line('WXW-TF300'),
    ...maybe(random, 0.6, 'GRA-MNT'),
    ...maybe(random, unit === 'GRA-TT300' ? 0.8 : 0.3, 'GRA-TANK25'),
    ...maybe(random, 0.5, 'GRA-RQC'),
    ...maybe(random, 0.3, 'WXW-SW4'),
    line('WXW-K2-25'),
    line('WXW-LUG10'),
    line('WXW-LOOM'),
  ];
}

function wiringRepair(random: Random): JobLine[] {
  return [
    line('WXW-LUG10', between(random, 1, 3)),
    line('WXW-HS'),
    ...maybe(random, 0.5, 'WXW-D10-50'),
    ...maybe(random, 0.4, 'WXW-LOOM'),
    ...maybe(random, 0.3, 'WXW-FB6'),
    ...maybe(random, 0.2, 'WXW-MF400'),
    ...maybe(random, 0.15, 'WXW-DISC'),
    ...maybe(random, 0.2, chance(random, 0.6) ? 'NVB-ST65' : 'NVB-ST31'),
  ];
}

/** Parts, the usual range of hours, and the line a lead writes in the notes, for each kind of job. */
const DESIGNS: Record<JobKind, { parts: (random: Random, northvaneShare: number) => JobLine[]; hours: [number, number]; notes: string[] }> = {
  battery_charging: {
    parts: batteryCharging,
    hours: [5, 9],
    notes: ['House battery with DC-DC charging', 'Second battery for the fridge and lights', 'Battery upgrade and charger'],
  },
  solar_inverter: {
    parts: solarInverter,
    hours: [12, 24],
    notes: ['Full solar and inverter build', 'Roof solar, lithium bank and inverter', 'Off-grid power for a camper build'],
  },
  compressor: {
    parts: compressor,
    hours: [2.5, 6],
    notes: ['Onboard air for tire inflation', 'Compressor install with rear air port', 'Onboard air for lockers and tires'],
  },
  wiring_repair: {
    parts: wiringRepair,
    hours: [1, 4.5],
    notes: ['Repair of chafed auxiliary wiring', 'Trace and fix a parasitic drain', "Rewire a previous owner's install"],
  },
};

/** A job of the given kind with parts chosen as a technician would for a typical customer. */
export function designJob(random: Random, kind: JobKind, northvaneShare: number): Job {
  const design = DESIGNS[kind];
  const lines = design.parts(random, northvaneShare);
  return { lines, laborHours: between(random, ...design.hours, 0.25), notes: pick(random, design.notes) };
}
