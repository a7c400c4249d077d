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

/**
 * The person's units: lengths in metres or feet and conductors in mm² or AWG. Plans store SI;
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

  /** A conductor in its own sizes, with the cross-section beside an AWG size for metric readers. */
  const sizeLabel = (size: ConductorSize) =>
    'awg' in size && !imperial.value ? `${conductorLabel(size)} (${round(awgAreaMm2(size.awg), 1)} mm²)` : conductorLabel(size);

  return { system, imperial, lengthUnit, gauge, shownLength, storedLength, formatLength, sizeLabel };
}
