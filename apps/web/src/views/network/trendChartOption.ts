import type { Rollups } from '@busbar/shared';
import type { BarSeriesOption, LineSeriesOption } from 'echarts/charts';
import type { GridComponentOption, LegendComponentOption, TooltipComponentOption } from 'echarts/components';
import type { ComposeOption } from 'echarts/core';
import type { ChartColors } from '../reliability/chartColors.ts';
import { monthName } from './comparedMonths.ts';

export type TrendChartOption = ComposeOption<BarSeriesOption | LineSeriesOption | GridComponentOption | TooltipComponentOption | LegendComponentOption>;

/** One month of the person's locations together, and the network's claims rate beside. */
export interface TrendMonth {
  month: string;
  delivered: number;
  claimsPer100: number | null;
  networkClaimsPer100: number | null;
}

const per100 = (claims: number, delivered: number) => (delivered > 0 ? (claims * 100) / delivered : null);

/** The asked months of a monthly roll-up, the person's locations summed. */
export function trendMonths(rollups: Rollups): TrendMonth[] {
  return rollups.periods.map(({ period }) => {
    const mine = rollups.scope.find((s) => s.period === period);
    const [delivered, claims] = [mine?.buildsDelivered ?? 0, mine?.claimsOpened ?? 0];
    const network = rollups.network.find((n) => n.period === period);
    return { month: period, delivered, claimsPer100: per100(claims, delivered), networkClaimsPer100: network ? per100(network.claimsOpened, network.buildsDelivered) : null };
  });
}

const round1 = (value: number | null) => (value === null ? null : Math.round(value * 10) / 10);

/**
 * Builds delivered each month as bars; claims per 100 builds, theirs and the network's (when the
 * locations are not the whole network), as lines on a second axis. A phone goes without the legend:
 * the words above the chart say the same.
 */
export function trendChartOption(months: TrendMonth[], colors: ChartColors, narrow: boolean, animate = true): TrendChartOption {
  const wholeNetwork = months.every((m) => m.claimsPer100 === m.networkClaimsPer100);
  return {
    animation: animate,
    textStyle: { fontFamily: colors.font, color: colors.text },
    grid: { left: 40, right: 40, top: 16, bottom: narrow ? 32 : 64 },
    tooltip: { trigger: 'axis' },
    legend: { show: !narrow, bottom: 0, textStyle: { color: colors.text } },
    xAxis: { type: 'category', data: months.map((m) => monthName(m.month)), axisLabel: { hideOverlap: true } },
    yAxis: [
      { type: 'value', min: 0 },
      { type: 'value', min: 0, splitLine: { show: false } },
    ],
    series: [
      { type: 'bar', name: 'Builds delivered', itemStyle: { color: colors.muted }, data: months.map((m) => m.delivered) },
      { type: 'line', name: 'Claims per 100 builds', yAxisIndex: 1, symbol: 'circle', symbolSize: 7, lineStyle: { width: 2, color: colors.accent }, itemStyle: { color: colors.accent }, data: months.map((m) => round1(m.claimsPer100)) },
      ...(wholeNetwork ? [] : [{ type: 'line' as const, name: 'Network', yAxisIndex: 1, symbol: 'triangle', symbolSize: 7, lineStyle: { width: 1.5, type: 'dashed' as const, color: colors.text }, itemStyle: { color: colors.text }, data: months.map((m) => round1(m.networkClaimsPer100)) }]),
    ],
  };
}
