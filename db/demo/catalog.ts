import type { Category } from '@busbar/shared';
import type { VendorCode } from './vendors.ts';

/** Categories whose every unit carries a serial number; wire, fuse holders, trays and fittings do not. */
export const SERIALIZED_CATEGORIES: ReadonlySet<Category> = new Set<Category>([
  'house_battery',
  'starter_battery',
  'dc_dc_charger',
  'solar_panel',
  'solar_controller',
  'inverter',
  'battery_monitor',
  'air_compressor',
]);

export interface DemoCatalogItem {
  sku: string;
  vendor: VendorCode;
  category: Category;
  name: string;
  specs: Record<string, unknown>;
  unitCostCents: number;
  unitPriceCents: number;
  warrantyMonths: number;
}

type Row = [sku: string, category: Category, name: string, specs: Record<string, unknown>, cost: number, price: number, months: number];

const lfp = (capacityAh: number) => ({ chemistry: 'lifepo4', capacityAh, nominalV: 12.8 });
const lead = (chemistry: 'agm' | 'flooded', capacityAh: number) => ({ chemistry, capacityAh, nominalV: 12 });

/** Today's catalog; prices and costs in cents. */
const ROWS: Row[] = [
  ['LKS-LFP100', 'house_battery', 'Larkspur 100 Ah LiFePO4', lfp(100), 42000, 69900, 60],
  ['LKS-LFP200', 'house_battery', 'Larkspur 200 Ah LiFePO4', lfp(200), 78000, 129900, 60],
  ['LKS-LFP300', 'house_battery', 'Larkspur 300 Ah LiFePO4 Slimline', lfp(300), 112000, 184900, 60],
  ['NVB-LFP100H', 'house_battery', 'Northvane 100 Ah LiFePO4 Heated', lfp(100), 39500, 64900, 48],
  ['NVB-LFP200H', 'house_battery', 'Northvane 200 Ah LiFePO4 Heated', lfp(200), 72000, 119900, 48],
  ['NVB-AGM100', 'house_battery', 'Northvane 100 Ah AGM Deep Cycle', lead('agm', 100), 19500, 32900, 24],
  ['NVB-FLD115', 'house_battery', 'Northvane 115 Ah Flooded Deep Cycle', lead('flooded', 115), 12500, 21900, 12],
  ['NVB-ST65', 'starter_battery', 'Northvane Group 65 AGM Starter', { ...lead('agm', 70), coldCrankingA: 850 }, 16500, 27900, 36],
  ['NVB-ST31', 'starter_battery', 'Northvane Group 31 AGM Starter', { ...lead('agm', 100), coldCrankingA: 1000 }, 22000, 36900, 36],
  ['TDW-DC25', 'dc_dc_charger', 'Tidewell Relay 25 A DC-DC Charger', { outputA: 25 }, 17500, 29900, 24],
  ['TDW-DC40', 'dc_dc_charger', 'Tidewell Relay 40 A DC-DC Charger', { outputA: 40 }, 24500, 41900, 24],
  ['TDW-DC50S', 'dc_dc_charger', 'Tidewell Relay 50 A DC-DC Charger with Solar Input', { outputA: 50 }, 34000, 57900, 24],
  ['LKS-DC60', 'dc_dc_charger', 'Larkspur 60 A Alternator Charger', { outputA: 60 }, 38000, 64900, 36],
  ['SNM-100R', 'solar_panel', 'Sunmere 100 W Rigid Panel', { watts: 100 }, 8500, 16900, 120],
  ['SNM-175R', 'solar_panel', 'Sunmere 175 W Rigid Panel', { watts: 175 }, 13500, 24900, 120],
  ['SNM-200R', 'solar_panel', 'Sunmere 200 W Rigid Panel', { watts: 200 }, 15500, 28900, 120],
  ['SNM-115F', 'solar_panel', 'Sunmere 115 W Flexible Panel', { watts: 115 }, 14000, 26900, 24],
  ['SNM-PWM20', 'solar_controller', 'Sunmere 20 A PWM Controller', { maxChargeA: 20, tracking: 'pwm' }, 3500, 7900, 24],
  ['TDW-MPPT30', 'solar_controller', 'Tidewell Harvest 30 A MPPT Controller', { maxChargeA: 30, tracking: 'mppt' }, 12500, 22900, 24],
  ['TDW-MPPT50', 'solar_controller', 'Tidewell Harvest 50 A MPPT Controller', { maxChargeA: 50, tracking: 'mppt' }, 19500, 34900, 24],
  ['TDW-INV1000', 'inverter', 'Tidewell Steadywave 1000 W Pure Sine Inverter', { continuousW: 1000, surgeW: 2000, efficiency: 0.9 }, 24000, 42900, 24],
  ['LKS-INV1500', 'inverter', 'Larkspur 1500 W Pure Sine Inverter', { continuousW: 1500, surgeW: 3000, efficiency: 0.9 }, 31000, 53900, 36],
  ['TDW-INV2000', 'inverter', 'Tidewell Steadywave 2000 W Pure Sine Inverter', { continuousW: 2000, surgeW: 4000, efficiency: 0.91 }, 42000, 72900, 24],
  ['TDW-INV3000C', 'inverter', 'Tidewell Steadywave 3000 W Inverter-Charger', { continuousW: 3000, surgeW: 6000, efficiency: 0.92 }, 98000, 164900, 24],
  ['WXW-FB6', 'fuse_block', 'Wexcombe 6-Circuit Blade Fuse Block', { circuits: 6, maxA: 100 }, 1800, 4200, 12],
  ['WXW-FB12', 'fuse_block', 'Wexcombe 12-Circuit Blade Fuse Block with Negative Bus', { circuits: 12, maxA: 100 }, 2900, 6500, 12],
  ['WXW-TF300', 'fuse_block', 'Wexcombe Battery Terminal Fuse Mount, 300 A', { circuits: 1, maxA: 300 }, 2400, 5400, 12],
  ['WXW-MF400', 'fuse_block', 'Wexcombe 400 A Main Fuse and Holder', { circuits: 1, maxA: 400 }, 3800, 8900, 12],
  ['WXW-SW4', 'switch_panel', 'Wexcombe 4-Switch Rocker Panel', { switches: 4 }, 4500, 9900, 12],
  ['WXW-SW6', 'switch_panel', 'Wexcombe 6-Switch Rocker Panel with Voltmeter', { switches: 6 }, 6500, 13900, 12],
  ['WXW-SW8D', 'switch_panel', 'Wexcombe 8-Circuit Digital Switch Module', { switches: 8 }, 28000, 47900, 24],
  ['LKS-BM500', 'battery_monitor', 'Larkspur Gauge 500 A Battery Monitor', { shuntA: 500 }, 9500, 17900, 36],
  ['TDW-BM300', 'battery_monitor', 'Tidewell Sense 300 A Shunt Monitor', { shuntA: 300 }, 7000, 13900, 24],
  ['GRA-ZC100', 'air_compressor', 'Gale Ridge Zephyr Compact Compressor', { drawA: 30, dutyCyclePercent: 33 }, 13500, 23900, 24],
  ['GRA-TC150', 'air_compressor', 'Gale Ridge Tempest 2.6 cfm Compressor', { drawA: 45, dutyCyclePercent: 50 }, 21000, 36900, 24],
  ['GRA-TT300', 'air_compressor', 'Gale Ridge Tempest Twin 5.5 cfm Compressor', { drawA: 90, dutyCyclePercent: 100 }, 42000, 69900, 24],
  ['WXW-K2-25', 'cable_terminals', 'Wexcombe 2 AWG Battery Cable Kit, 25 ft', {}, 5500, 11900, 12],
  ['WXW-K10-25', 'cable_terminals', 'Wexcombe 1/0 AWG Battery Cable Kit, 25 ft', {}, 9500, 19900, 12],
  ['WXW-D10-50', 'cable_terminals', 'Wexcombe 10 AWG Duplex Wire, 50 ft', {}, 3200, 6900, 12],
  ['WXW-LUG10', 'cable_terminals', 'Wexcombe Tinned Copper Lugs, 10 pack', {}, 800, 2400, 12],
  ['WXW-LOOM', 'cable_terminals', 'Wexcombe Split Loom and Grommet Kit', {}, 1500, 3900, 12],
  ['WXW-HS', 'cable_terminals', 'Wexcombe Adhesive Heat-Shrink Assortment', {}, 900, 2500, 12],
  ['WXW-TR31', 'tray_mount', 'Wexcombe Group 31 Battery Tray', {}, 3500, 7900, 12],
  ['WXW-BOX200', 'tray_mount', 'Wexcombe Lithium Battery Box, 200 Ah', {}, 6500, 13900, 12],
  ['SNM-BRK4', 'tray_mount', 'Sunmere Roof Rack Panel Brackets, set of 4', {}, 4200, 8900, 12],
  ['GRA-MNT', 'tray_mount', 'Gale Ridge Under-Hood Compressor Bracket', {}, 2800, 6900, 24],
  ['GRA-TANK25', 'other', 'Gale Ridge 2.5 gal Air Tank and Hose Kit', {}, 6500, 12900, 24],
  ['GRA-RQC', 'other', 'Gale Ridge Rear Bumper Air Coupler Kit', {}, 2200, 5400, 24],
  ['WXW-SHORE30', 'other', 'Wexcombe 30 A Shore Power Inlet', {}, 5500, 10900, 12],
  ['WXW-DISC', 'other', 'Wexcombe Battery Disconnect Switch', {}, 4800, 9900, 12],
];

export const DEMO_CATALOG: DemoCatalogItem[] = ROWS.map(([sku, category, name, specs, unitCostCents, unitPriceCents, warrantyMonths]) => ({
  sku,
  vendor: sku.split('-')[0] as VendorCode,
  category,
  name,
  specs,
  unitCostCents,
  unitPriceCents,
  warrantyMonths,
}));
