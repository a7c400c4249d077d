import { vinCheckDigit, vinProblem } from '@busbar/calc';
import { describe, expect, it } from 'vitest';

/** A VIN with its check digit (position 9) blanked, as the worked examples print them. */
const blanked = (vin: string) => `${vin.slice(0, 8)}0${vin.slice(9)}`;

describe('VIN check digit (49 CFR 565.15(c))', () => {
  it('gives 4 for the regulation\'s own sample 1G4AH59H_5G118341, sum 411 (49 CFR 565.15(c), table "Calculation of a Check Digit")', () => {
    expect(vinCheckDigit(blanked('1G4AH59H45G118341'))).toBe('4');
  });

  it('gives 6 for NHTSA\'s worked example 1J9RP1A3_A1644345, sum 314 (NHTSA, "Outline for New Manufacturer Information")', () => {
    expect(vinCheckDigit(blanked('1J9RP1A36A1644345'))).toBe('6');
  });

  it('gives X for 1M8GDM9A_KP042788, sum 351, remainder 10 (autocalculator.org, "VIN Check digit"; also Wikipedia, "Vehicle identification number")', () => {
    expect(vinCheckDigit(blanked('1M8GDM9AXKP042788'))).toBe('X');
  });

  it('gives 7 for 1FAPP64R_LH123456, sum 403 (tbirdregistry.com, "Check Digit Calculation")', () => {
    expect(vinCheckDigit(blanked('1FAPP64R7LH123456'))).toBe('7');
  });

  it('accepts LJCPCBLCX11000237, sum 186 ≡ 10 (scientificgems.wordpress.com, "Mathematics in action: vehicle identification numbers", 2018)', () => {
    expect(vinProblem('LJCPCBLCX11000237')).toBeNull();
  });

  it('accepts seventeen ones: weights sum to 89, remainder 1 (from memory; follows from the weights of 49 CFR 565.15(c))', () => {
    expect(vinProblem('11111111111111111')).toBeNull();
  });
});

describe('VIN form (49 CFR 565.15(a)-(b); ISO 3779)', () => {
  it('refuses a wrong check digit, a wrong length and the letters I, O and Q', () => {
    expect(vinProblem('1M8GDM9A1KP042788')).toBe('check_digit');
    expect(vinProblem('1M8GDM9AXKP04278')).toBe('length');
    expect(vinProblem('1M8GDM9AXKP0427888')).toBe('length');
    for (const letter of ['I', 'O', 'Q']) expect(vinProblem(`1M8GDM9AXKP04278${letter}`)).toBe('characters');
    expect(() => vinCheckDigit('1M8GDM9AXKP04278O')).toThrow(RangeError);
  });
});
