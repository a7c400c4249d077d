import { combinedLossFraction, PVWATTS_V5_LOSS_FRACTION, PVWATTS_V5_LOSSES, solarDailyWh } from '@busbar/calc';
import { describe, expect, it } from 'vitest';

// Source: Dobos (2014), PVWatts Version 5 Manual, NREL/TP-6A20-62641 (CHECKS.md [P]): default
// losses in %, combined as 1 − Π(1 − Lᵢ) = 14.08 %.
const PUBLISHED_PERCENT = {
  soiling: 2,
  shading: 3,
  snow: 0,
  mismatch: 2,
  wiring: 2,
  connections: 0.5,
  lightInducedDegradation: 1.5,
  nameplateRating: 1,
  age: 0,
  availability: 3,
};

describe('PVWatts v5 system losses (NREL/TP-6A20-62641)', () => {
  it('lists the ten published default losses', () => {
    const asPercent = Object.fromEntries(Object.entries(PVWATTS_V5_LOSSES).map(([name, loss]) => [name, Math.round(loss * 1000) / 10]));
    expect(asPercent).toEqual(PUBLISHED_PERCENT);
  });

  it('combines them to 14.08 %', () => {
    expect(PVWATTS_V5_LOSS_FRACTION * 100).toBeCloseTo(14.08, 2);
    expect(combinedLossFraction(Object.values(PUBLISHED_PERCENT).map((p) => p / 100)) * 100).toBeCloseTo(14.08, 2);
  });

  it('applies them by default to an array’s daily energy', () => {
    expect(solarDailyWh({ arrayW: 400, peakSunHours: 5 })).toBeCloseTo(400 * 5 * (1 - 0.1408), 0);
  });
});

// Source: PVEducation, "Average Solar Radiation" (CHECKS.md [P]): peak sun hours are the hours at
// 1 kW/m² giving the same daily energy, numerically the insolation in kWh/m²/day.
describe('peak sun hours (PVEducation)', () => {
  it('has a 1 kW array (rated at 1 kW/m²) under 5.5 kWh/m²/day make 5.5 kWh before losses', () => {
    expect(solarDailyWh({ arrayW: 1000, peakSunHours: 5.5, lossFraction: 0 })).toBeCloseTo(5500, 9);
  });
});
