export { buildTotals, type BuildTotals, type PricedLine } from './build-totals.ts';
export { addMonthsIso, addWorkdays, DAY_MS, dayOfIso, isoDay, localDay, localMoment, monthOf, weekday } from './local-time.ts';
export { ampacityAwgForMm2, conductorAmpacityA, INSULATION_RATINGS_C, type AmpacityInput, type InsulationRatingC } from './ampacity.ts';
export {
  bankNominalV,
  BATTERY_CHEMISTRIES,
  CHEMISTRIES,
  coldCapacityFactor,
  DEFAULT_RATED_HOURS,
  hoursToRefill,
  peukertDrawAh,
  peukertRuntimeH,
  type Chemistry,
  type ChemistryData,
  type PeukertInput,
  type RefillInput,
} from './batteries.ts';
export { conductorResistanceOhmsPerM, copperResistanceAt, voltageDrop, type ConductorCondition, type VoltageDrop, type VoltageDropInput } from './conductors.ts';
export { designMargins, MARGIN_BAND_BOUNDS, marginBand, type DesignMargins, type MarginBand } from './design-margins.ts';
export { dailyEnergy, dcdcInputA, inverterInputA, type DailyEnergy, type DcdcInput, type EnergyOptions, type InverterInput, type Load } from './energy.ts';
export { FUSE_MAX_OF_AMPACITY, FUSE_MIN_OF_LOAD, fuseForLoadA, selectFuseA, STANDARD_FUSE_RATINGS_A, type FuseRequest } from './fuses.ts';
export { evaluatePlan, planVerdict, type EvaluateOptions } from './plan.ts';
export { STARTER_SPARE_FRACTION } from './plan-bank.ts';
export { MAX_DROP_PERCENT } from './plan-circuits.ts';
export * from './plan-defaults.ts';
export { MAX_PROTECTION_DISTANCE_MM } from './plan-protection.ts';
export { COMMON_BANK_AH, COMMON_CHARGER_A } from './sized.ts';
export type {
  BankRecommendation,
  BatteryName,
  CheckedConductor,
  CircuitLink,
  CircuitResult,
  DayKind,
  Finding,
  FindingCode,
  HourState,
  PlanBank,
  PlanCircuit,
  PlanInput,
  PlanLoad,
  PlanResult,
  PlanStock,
  PlanTrip,
  ProtectionPoint,
  SimulatedBank,
  SizedChoice,
  Verdict,
} from './plan-types.ts';
export { SAFETY_CAUTION } from './safety.ts';
export { MIN_RECOMMENDED_SIZE, selectConductor, type ConductorChoice, type ConductorRequest } from './select-conductor.ts';
export { AWG_SIZES, conductorLabel, conductorSizes, MM2_SIZES, type Awg, type ConductorSize, type Gauge, type Mm2 } from './sizes.ts';
export {
  combinedLossFraction,
  controllerHarvest,
  MODULE_POWER_COEFFICIENT_PER_C,
  MODULE_RISE_C,
  moduleTemperatureFactor,
  MPPT_HARVEST,
  PVWATTS_V5_LOSS_FRACTION,
  PVWATTS_V5_LOSSES,
  solarDailyWh,
  type HarvestInput,
  type SolarController,
  type SolarInput,
} from './solar.ts';
export { awgAreaMm2, awgCircularMils, circularMilsToMm2, feetToMeters, metersToFeet, mm2ToCircularMils } from './units.ts';
export { funnelLimits, funnelSide } from './funnel.ts';
export { median, MODIFIED_Z_LIMIT, modifiedZScores } from './robust-outliers.ts';
export { kaplanMeier, type SurvivalRow } from './kaplan-meier.ts';
export { poissonRateInterval, type RateInterval } from './poisson-rate.ts';
export { binomialUpperTail, chiSquareQuantile, poissonCdf, poissonQuantile, standardNormalQuantile } from './quantiles.ts';
export type { SurvivalObservation } from './survival-data.ts';
export { WEIBULL_MIN_FAILURE_TIMES, weibullFit, type WeibullFit } from './weibull-fit.ts';
export { wilsonInterval, type ProportionInterval, type WilsonOptions } from './wilson.ts';
export { benjaminiHochberg } from './false-discovery.ts';
export { excessChance, type RateStratum } from './rate-comparison.ts';
export { weibullAgeTrend, type AgeTrend } from './weibull-trend.ts';
export { VIN_PATTERN, vinCheckDigit, vinProblem, type VinProblem } from './vin.ts';
