import type { SurvivalPoint } from '@busbar/shared';
import type { LineSeriesOption } from 'echarts/charts';
import type { GridComponentOption, TooltipComponentOption } from 'echarts/components';
import type { ComposeOption } from 'echarts/core';
import type { ChartColors } from './chartColors.ts';
import { percent } from './reliabilityFormat.ts';

export type SurvivalChartOption = ComposeOption<LineSeriesOption | GridComponentOption | TooltipComponentOption>;

/** The curve starts at every unit working, at month 0. */
const START: SurvivalPoint = { months: 0, atRisk: 0, failures: 0, survival: 1, lower: 1, upper: 1 };

/** The tenth at or below the band's lowest point (90 % at most), so a small drop shows instead of a flat line near the top. */
export function survivalFloor(points: SurvivalPoint[]): number {
  const lowest = Math.min(0.9, ...points.map((p) => p.lower));
  return Math.max(0, Math.floor(lowest * 10) / 10);
}

/** "12.5 months: 96 % still working (95–97 %), 240 in service" for one step of the curve. */
export function survivalLabel(p: SurvivalPoint): string {
  const months = p.months.toLocaleString('en-US', { maximumFractionDigits: 1 });
  return `${months} months: ${percent(p.survival, 1)} still working (${percent(p.lower, 1)}–${percent(p.upper, 1)}), ${p.atRisk.toLocaleString('en-US')} in service, ${p.failures} failed`;
}

/**
 * Kaplan–Meier survival as a step line (it falls at each failure time and stays flat between),
 * its 95 % band shaded: the lower limit as an invisible line, the band's height stacked on it.
 */
export function survivalChartOption(points: SurvivalPoint[], colors: ChartColors, animate = true): SurvivalChartOption {
  const steps = [START, ...points];
  const step = 'end' as const;
  const floor = survivalFloor(points);
  return {
    animation: animate,
    textStyle: { fontFamily: colors.font, color: colors.text },
    grid: { left: 56, right: 16, top: 16, bottom: 48 },
    tooltip: {
      trigger: 'axis',
      formatter: (params) => {
        const index = (Array.isArray(params) ? params[0] : params)?.dataIndex ?? 0;
        const point = steps[index];
        return point && index > 0 ? survivalLabel(point) : 'Installed: every unit working';
      },
    },
    xAxis: { type: 'value', min: 0, name: 'Months in service', nameLocation: 'middle', nameGap: 30 },
    yAxis: {
      type: 'value',
      min: floor,
      max: 1,
      // Ticks on round percentages: every 5 % over a short range, every 10 % over a long one.
      interval: 1 - floor < 0.35 ? 0.05 : 0.1,
      name: 'Still working',
      nameLocation: 'middle',
      nameGap: 42,
      axisLabel: { formatter: (share: number) => `${Math.round(share * 100)} %` },
    },
    series: [
      { type: 'line', name: 'Lower limit', stack: 'band', step, showSymbol: false, silent: true, lineStyle: { opacity: 0 }, data: steps.map((p) => [p.months, p.lower]) },
      {
        type: 'line',
        name: '95 % band',
        stack: 'band',
        step,
        showSymbol: false,
        silent: true,
        lineStyle: { opacity: 0 },
        areaStyle: { color: colors.accent, opacity: 0.18 },
        data: steps.map((p) => [p.months, p.upper - p.lower]),
      },
      {
        type: 'line',
        name: 'Still working',
        step,
        showSymbol: false,
        lineStyle: { width: 2.5, color: colors.accent },
        itemStyle: { color: colors.accent },
        data: steps.map((p) => [p.months, p.survival]),
      },
    ],
  };
}
