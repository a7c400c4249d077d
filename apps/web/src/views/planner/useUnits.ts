import { awgAreaMm2, conductorLabel, feetToMeters, metersToFeet, type ConductorSize, type Gauge } from '@busbar/calc';
import { computed, ref, watch } from 'vue';

export type UnitSystem = 'metric' | 'imperial';

const STORAGE_KEY = 'busbar.planner.units';

function remembered(): UnitSystem {
  try {
    return localStorage.getItem(STORAGE_KEY) === 'metric' ? 'metric' : 'imperial';
  } catch {
    return 'imperial';
  }
}

// One choice for the whole app, kept in this browser: the network's shops mostly work in feet and AWG.
const system = ref<UnitSystem>(remembered());
watch(system, (value) => {
  try {
    localStorage.setItem(STORAGE_KEY, value);
  } catch {
    // A browser that keeps nothing still shows the chosen units until the page is left.
  }
});

const round = (value: number, digits: number) => Number(value.toFixed(digits));
const MM_PER_INCH = 25.4;

/**
 * The person's units: lengths in metres or feet, fuse distances in millimetres or inches,
 * temperatures in °C or °F and conductors in mm² or AWG. Plans store SI (°C);
 * only what is shown and typed changes.
 */
export function useUnits() {
  const imperial = computed(() => system.value === 'imperial');
  const lengthUnit = computed(() => (imperial.value ? 'ft' : 'm'));
  const gauge = computed<Gauge>(() => (imperial.value ? 'awg' : 'mm2'));

  /** A length in metres as shown: two decimals in the person's unit. */
  const shownLength = (meters: number | undefined) => (typeof meters === 'number' ? round(imperial.value ? metersToFeet(meters) : meters, 2) : undefined);
  const storedLength = (shown: number | undefined) => (typeof shown === 'number' ? (imperial.value ? feetToMeters(shown) : shown) : undefined);
  const formatLength = (meters: number) => `${shownLength(meters)} ${lengthUnit.value}`;

  /** Short distances (a fuse from its battery) in millimetres or inches. */
  const distanceUnit = computed(() => (imperial.value ? 'in' : 'mm'));
  const shownDistance = (mm: number | undefined) => (typeof mm === 'number' ? round(imperial.value ? mm / MM_PER_INCH : mm, imperial.value ? 1 : 0) : undefined);
  const storedDistance = (shown: number | undefined) => (typeof shown === 'number' ? (imperial.value ? shown * MM_PER_INCH : shown) : undefined);
  const formatDistance = (mm: number) => `${(shownDistance(mm) ?? 0).toLocaleString('en-US')} ${distanceUnit.value}`;

  /** Temperatures in °C or °F; plans store °C. */
  const temperatureUnit = computed(() => (imperial.value ? '°F' : '°C'));
  const shownTemperature = (c: number | undefined) => (typeof c === 'number' ? round(imperial.value ? (c * 9) / 5 + 32 : c, 1) : undefined);
  const storedTemperature = (shown: number | undefined) => (typeof shown === 'number' ? (imperial.value ? round(((shown - 32) * 5) / 9, 2) : shown) : undefined);
  const formatTemperature = (c: number) => `${shownTemperature(c)} ${temperatureUnit.value}`;

  /** A message's quantities ("at most 5,000 mm", "at least -50 °C") in the units the person types in. */
  const inShownUnits = (message: string) =>
    imperial.value
      ? message.replace(/(-?\d[\d,]*(?:\.\d+)?) (mm|m|°C)(?![\w²])/g, (_, figure: string, unit: string) => {
          const value = Number(figure.replace(/,/g, ''));
          return unit === 'mm' ? formatDistance(value) : unit === 'm' ? formatLength(value) : formatTemperature(value);
        })
      : message;

  /** A conductor in its own sizes, with the cross-section beside an AWG size for metric readers. */
  const sizeLabel = (size: ConductorSize) =>
    'awg' in size && !imperial.value ? `${conductorLabel(size)} (${round(awgAreaMm2(size.awg), 1)} mm²)` : conductorLabel(size);

  return {
    system,
    imperial,
    lengthUnit,
    gauge,
    shownLength,
    storedLength,
    formatLength,
    distanceUnit,
    shownDistance,
    storedDistance,
    formatDistance,
    temperatureUnit,
    shownTemperature,
    storedTemperature,
    formatTemperature,
    inShownUnits,
    sizeLabel,
  };
}
