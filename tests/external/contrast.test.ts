import { describe, expect, it } from 'vitest';
import { contrastRatio } from '../support/contrast.ts';

// Source: WCAG 2.1, definitions of "contrast ratio" and "relative luminance"
// (https://www.w3.org/TR/WCAG21/#dfn-contrast-ratio), the measure of success criterion 1.4.3
// Contrast (Minimum): 4.5:1 for body text. Published values: WebAIM's contrast checker
// (https://webaim.org/resources/contrastchecker/) gives #767676 on white 4.54:1, the lightest
// grey commonly cited as passing AA, and pure blue on white 8.59:1.
describe('WCAG 2.1 contrast ratio', () => {
  it('is 21:1 for black on white, the largest there is, and 1:1 for a colour on itself (WCAG 2.1)', () => {
    expect(contrastRatio('#000000', '#FFFFFF')).toBeCloseTo(21, 9);
    expect(contrastRatio('#A4532A', '#A4532A')).toBe(1);
  });

  it('is 4.54:1 for #767676 on white, and #777777 falls just short of the 4.5:1 of SC 1.4.3 (WebAIM)', () => {
    expect(contrastRatio('#767676', '#FFFFFF')).toBeCloseTo(4.54, 2);
    expect(contrastRatio('#777777', '#FFFFFF')).toBeLessThan(4.5);
  });

  it('is 8.59:1 for blue on white, whichever colour comes first (WebAIM)', () => {
    expect(contrastRatio('#0000FF', '#FFFFFF')).toBeCloseTo(8.59, 2);
    expect(contrastRatio('#FFFFFF', '#0000FF')).toBe(contrastRatio('#0000FF', '#FFFFFF'));
  });
});
