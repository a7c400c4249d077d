import { checkNumber } from './checks.ts';

export interface Load {
  name: string;
  watts: number;
  hoursPerDay: number;
  /** Share of the running hours the load actually draws (a fridge's compressor); 1 when absent. */
  dutyCycle?: number;
  /** Runs on 230/120 V AC through the inverter. */
  ac?: boolean;
}

export interface EnergyOptions {
  systemV: number;
  /** Inverter efficiency (0–1] applied to AC loads. */
  inverterEfficiency: number;
}

export interface DailyEnergy {
  wattHours: number;
  ampHours: number;
}

/** Energy one load takes from the battery in a day, Wh: watts × hours × duty cycle, AC loads divided by the inverter efficiency. */
export function loadWattHours(load: Load, inverterEfficiency: number, field = 'load'): number {
  checkNumber(`${field}.watts`, load.watts, { above: 0 });
  checkNumber(`${field}.hoursPerDay`, load.hoursPerDay, { min: 0, max: 24 });
  checkNumber(`${field}.dutyCycle`, load.dutyCycle ?? 1, { above: 0, max: 1 });
  const wattHours = load.watts * load.hoursPerDay * (load.dutyCycle ?? 1);
  return load.ac ? wattHours / inverterEfficiency : wattHours;
}

/** Daily energy of the loads in Wh and in Ah at the system voltage (energy balance; AC loads through the inverter efficiency). */
export function dailyEnergy(loads: readonly Load[], { systemV, inverterEfficiency }: EnergyOptions): DailyEnergy {
  checkNumber('systemV', systemV, { above: 0 });
  checkNumber('inverterEfficiency', inverterEfficiency, { above: 0, max: 1 });
  const wattHours = loads.reduce((sum, load, i) => sum + loadWattHours(load, inverterEfficiency, `loads[${i}]`), 0);
  return { wattHours, ampHours: wattHours / systemV };
}

export interface InverterInput {
  acW: number;
  batteryV: number;
  efficiency: number;
}

/** DC current an inverter draws from the battery: I = P / (V × efficiency) (power balance). */
export function inverterInputA({ acW, batteryV, efficiency }: InverterInput): number {
  checkNumber('acW', acW, { min: 0 });
  checkNumber('batteryV', batteryV, { above: 0 });
  checkNumber('efficiency', efficiency, { above: 0, max: 1 });
  return acW / (batteryV * efficiency);
}

export interface DcdcInput {
  outputA: number;
  /** The charger's output voltage (the house bank's charging voltage), V. */
  outputV: number;
  /** The voltage at the charger's input, V; the lowest it runs at gives the largest current. */
  inputV: number;
  efficiency: number;
}

/** Current a DC-DC charger draws from the starter side: I_in = V_out × I_out / (η × V_in) (power balance). */
export function dcdcInputA({ outputA, outputV, inputV, efficiency }: DcdcInput): number {
  checkNumber('outputA', outputA, { min: 0 });
  checkNumber('outputV', outputV, { above: 0 });
  checkNumber('inputV', inputV, { above: 0 });
  checkNumber('efficiency', efficiency, { above: 0, max: 1 });
  return (outputV * outputA) / (efficiency * inputV);
}
