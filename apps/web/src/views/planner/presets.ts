import type { PlanLoad } from '@busbar/calc';

const span = (from: number, to: number) => Array.from({ length: (to - from + 24) % 24 }, (_, i) => (from + i) % 24);

/** Parts of the day a load may run in; a load's energy is spread over its hours. */
export const DAY_WINDOWS = [
  { key: 'all', label: 'All day', hours: undefined },
  { key: 'morning', label: 'Morning (6–9)', hours: span(6, 9) },
  { key: 'daytime', label: 'Daytime (8–17)', hours: span(8, 17) },
  { key: 'waking', label: 'Waking hours (7–22)', hours: span(7, 22) },
  { key: 'evening', label: 'Evening (17–23)', hours: span(17, 23) },
  { key: 'night', label: 'Night (22–7)', hours: span(22, 7) },
] as const;

export type DayWindowKey = (typeof DAY_WINDOWS)[number]['key'];

/** The window a load's hours match, or null for hours no window names. */
export function windowOf(hours: readonly number[] | undefined): DayWindowKey | null {
  const key = (list: readonly number[] | undefined) => (list ? [...list].sort((a, b) => a - b).join(',') : 'all');
  return DAY_WINDOWS.find((w) => key(w.hours) === key(hours))?.key ?? null;
}

export function hoursOf(window: DayWindowKey): number[] | undefined {
  const hours = DAY_WINDOWS.find((w) => w.key === window)?.hours;
  return hours ? [...hours] : undefined;
}

interface LoadPreset {
  key: string;
  label: string;
  load: PlanLoad;
}

// Busbar's own typical figures for common loads: a starting point to edit with the customer,
// not any maker's ratings. Each is checked against the real unit when it is chosen.
export const LOAD_PRESETS: LoadPreset[] = [
  { key: 'fridge', label: '12 V compressor fridge', load: { name: 'Compressor fridge', watts: 45, hoursPerDay: 24, dutyCycle: 0.4 } },
  {
    key: 'satellite',
    label: 'Satellite internet terminal',
    load: { name: 'Satellite internet terminal', watts: 50, hoursPerDay: 8, activeHours: hoursOf('waking') },
  },
  { key: 'laptop', label: 'Laptop charging', load: { name: 'Laptop charging', watts: 65, hoursPerDay: 3, activeHours: hoursOf('daytime') } },
  { key: 'phone', label: 'Phone charging', load: { name: 'Phone charging', watts: 10, hoursPerDay: 3 } },
  { key: 'lights', label: 'LED lights', load: { name: 'LED lights', watts: 20, hoursPerDay: 4, activeHours: hoursOf('evening') } },
  { key: 'pump', label: 'Water pump', load: { name: 'Water pump', watts: 60, hoursPerDay: 0.3, activeHours: hoursOf('waking') } },
  { key: 'fan', label: 'Roof fan', load: { name: 'Roof fan', watts: 25, hoursPerDay: 6 } },
  { key: 'heater', label: 'Diesel heater fan', load: { name: 'Diesel heater fan', watts: 30, hoursPerDay: 8, activeHours: hoursOf('night') } },
  { key: 'cpap', label: 'CPAP', load: { name: 'CPAP', watts: 40, hoursPerDay: 8, activeHours: hoursOf('night') } },
  {
    key: 'induction',
    label: 'Induction cooktop (through the inverter)',
    load: { name: 'Induction cooktop', watts: 1800, hoursPerDay: 0.5, ac: true, activeHours: hoursOf('evening') },
  },
];

/** A fresh copy of a preset's load, or an empty load to fill in. */
export function presetLoad(key: string | undefined): PlanLoad {
  const preset = LOAD_PRESETS.find((p) => p.key === key);
  return preset ? structuredClone(preset.load) : { name: '', watts: 10, hoursPerDay: 1 };
}
