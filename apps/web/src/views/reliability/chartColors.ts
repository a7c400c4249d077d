import type { FunnelSignal } from '@busbar/shared';

/** The theme's colours a chart draws with (theme.ts publishes them as CSS variables). */
export interface ChartColors {
  font: string;
  text: string;
  muted: string;
  accent: string;
  signal: Record<FunnelSignal, string>;
}

const css = (name: string) => getComputedStyle(document.documentElement).getPropertyValue(name).trim();

/** Read once per drawing, so a chart always uses the live theme. */
export function readChartColors(): ChartColors {
  return {
    font: css('--bb-font'),
    text: css('--bb-text'),
    muted: css('--bb-text-muted'),
    accent: css('--bb-copper'),
    signal: {
      above_998: css('--bb-tone-danger-text'),
      above_95: css('--bb-tone-warning-text'),
      within: css('--bb-tone-neutral-text'),
      below_95: css('--bb-tone-info-text'),
      below_998: css('--bb-tone-success-text'),
    },
  };
}
