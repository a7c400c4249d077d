import { describe, expect, it } from 'vitest';
import { palette, themeConfig, tones } from '../../apps/web/src/theme.ts';
import { contrastRatio } from '../support/contrast.ts';

// WCAG 2.1 SC 1.4.3 Contrast (Minimum): text needs 4.5:1 against its background; the ratio is
// WCAG's own (relative luminance, checked against published values in tests/external/contrast.test.ts).
const AA = 4.5;
const token = themeConfig.token!;

/** Every text colour of the theme on each background it is drawn on. */
const pairs: [what: string, text: string, background: string][] = [
  ...(['surface', 'page', 'tableHeader', 'copperSoft'] as const).flatMap((bg) => [
    [`text on ${bg}`, palette.text, palette[bg]] as [string, string, string],
    [`heading on ${bg}`, palette.heading, palette[bg]] as [string, string, string],
    [`muted text (empty notes, hints) on ${bg}`, palette.textMuted, palette[bg]] as [string, string, string],
    [`link on ${bg}`, palette.copper, palette[bg]] as [string, string, string],
  ]),
  ['placeholder in a field', palette.textPlaceholder, palette.surface],
  ['placeholder in a field on the page', palette.textPlaceholder, palette.page],
  ['kit placeholder token in a field', String(token.colorTextPlaceholder), palette.surface],
  ['kit tertiary text (descriptions, icons) on white', String(token.colorTextTertiary), palette.surface],
  ['kit secondary text on white', String(token.colorTextSecondary), palette.surface],
  ['menu text on graphite', palette.textOnDark, palette.graphite],
  ['menu text on the raised graphite', palette.textOnDark, palette.graphiteRaised],
  ['copper on graphite', palette.copperOnDark, palette.graphite],
  ['white on a primary button', '#FFFFFF', palette.copper],
  ['white on a hovered primary button', '#FFFFFF', palette.copperHover],
  ['white on a pressed primary button', '#FFFFFF', palette.copperActive],
  ['error message on white', String(token.colorError), palette.surface],
  ['warning text on white', String(token.colorWarning), palette.surface],
  ['success text on white', String(token.colorSuccess), palette.surface],
  ...Object.entries(tones).map(([tone, c]) => [`${tone} tag text on its own background`, c.text, c.background] as [string, string, string]),
];

describe('theme colours meet WCAG 2.1 AA contrast (SC 1.4.3)', () => {
  it.each(pairs)('%s: %s on %s is at least 4.5:1', (_what, text, background) => {
    expect(text).toMatch(/^#[0-9A-F]{6}$/i);
    expect(contrastRatio(text, background)).toBeGreaterThanOrEqual(AA);
  });

  it('keeps placeholders lighter than entered text, so a hint never reads as a value', () => {
    expect(contrastRatio(palette.textPlaceholder, palette.surface)).toBeLessThan(contrastRatio(palette.text, palette.surface) - 3);
  });
});
