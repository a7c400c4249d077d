import { FUNNEL_SIGNALS, FUNNEL_SIGNAL_LABELS, type FunnelLimit, type FunnelPoint, type FunnelSignal } from '@busbar/shared';
import type { LineSeriesOption, ScatterSeriesOption } from 'echarts/charts';
import type { GridComponentOption, TooltipComponentOption } from 'echarts/components';
import type { ComposeOption } from 'echarts/core';
import type { ChartColors } from './chartColors.ts';
import { count, rate } from './reliabilityFormat.ts';

export type FunnelChartOption = ComposeOption<LineSeriesOption | ScatterSeriesOption | GridComponentOption | TooltipComponentOption>;

/** A shape per signal, so a point's place against the limits reads without colour too. */
export const SIGNAL_SYMBOLS: Record<FunnelSignal, 'triangle' | 'circle' | 'diamond'> = {
  above_998: 'triangle',
  above_95: 'triangle',
  within: 'circle',
  below_95: 'diamond',
  below_998: 'diamond',
};

/** A shop's name on the chart; shops the person may not see stay unnamed. */
export const pointName = (p: FunnelPoint) => p.code ?? 'Another shop';

/** "AUS: 4.1 per 1,000 unit-months over 2,310 unit-months (9 failures). Above the 99.8 % limit" */
export function funnelPointLabel(p: FunnelPoint): string {
  return `${pointName(p)}: ${rate(p.rate)} per 1,000 unit-months over ${count(p.unitMonths)} unit-months (${count(p.failures)} ${p.failures === 1 ? 'failure' : 'failures'}). ${FUNNEL_SIGNAL_LABELS[p.signal]}`;
}

/** The smallest of 1, 2, 2.5, 5 and 10 times a power of ten at or above `value`, so the axis ends on a round figure. */
export function roundUp(value: number): number {
  const power = 10 ** Math.floor(Math.log10(value));
  return [1, 2, 2.5, 5, 10].map((step) => step * power).find((top) => top >= value * (1 - 1e-12))!;
}

/**
 * The top of the rate axis: every point and the network's rate with room to spare. The limits
 * near zero exposure run off the top; drawing them all would flatten the points.
 */
export function funnelRateTop(points: FunnelPoint[], networkRate: number): number {
  const highest = Math.max(networkRate * 2, ...points.map((p) => p.rate));
  return highest > 0 ? roundUp(highest * 1.1) : 1;
}

const compact = new Intl.NumberFormat('en-US', { notation: 'compact', maximumFractionDigits: 1 });

const LIMITS = [
  { key: 'upper998', name: '99.8 % limits', dashed: true },
  { key: 'lower998', name: '99.8 % limits', dashed: true },
  { key: 'upper95', name: '95 % limits', dashed: false },
  { key: 'lower95', name: '95 % limits', dashed: false },
] as const;

/**
 * A funnel: each shop's failure rate against its unit-months in service, the network's rate
 * across, and the 95 % and 99.8 % limits a shop's rate stays within by chance alone at that exposure.
 */
export function funnelChartOption(points: FunnelPoint[], limits: FunnelLimit[], networkRate: number, colors: ChartColors, animate = true): FunnelChartOption {
  const top = funnelRateTop(points, networkRate);
  const exposures = [...limits].sort((a, b) => a.unitMonths - b.unitMonths);
  const widest = Math.max(0, ...exposures.map((l) => l.unitMonths), ...points.map((p) => p.unitMonths));
  const limitSeries: LineSeriesOption[] = LIMITS.map((limit) => ({
    type: 'line',
    name: limit.name,
    showSymbol: false,
    silent: true,
    lineStyle: { width: 1.5, color: colors.muted, type: limit.dashed ? 'dashed' : 'solid' },
    data: exposures.map((l) => [l.unitMonths, Math.max(0, l[limit.key])]),
  }));
  const pointSeries: ScatterSeriesOption[] = FUNNEL_SIGNALS.filter((signal) => points.some((p) => p.signal === signal)).map((signal) => ({
    type: 'scatter',
    name: FUNNEL_SIGNAL_LABELS[signal],
    symbol: SIGNAL_SYMBOLS[signal],
    symbolSize: signal === 'within' ? 9 : 13,
    itemStyle: { color: colors.signal[signal], borderColor: '#fff', borderWidth: 1 },
    label: { show: true, position: 'right', color: colors.text, fontSize: 11, formatter: (p) => (p.name === 'Another shop' ? '' : p.name) },
    tooltip: { formatter: (p) => funnelPointLabel(points.filter((q) => q.signal === signal)[p.dataIndex]!) },
    data: points.filter((p) => p.signal === signal).map((p) => ({ name: pointName(p), value: [p.unitMonths, Math.min(p.rate, top)] })),
  }));
  return {
    animation: animate,
    textStyle: { fontFamily: colors.font, color: colors.text },
    grid: { left: 56, right: 40, top: 16, bottom: 48 },
    tooltip: { trigger: 'item' },
    xAxis: { type: 'value', min: 0, name: 'Unit-months in service', nameLocation: 'middle', nameGap: 30, axisLabel: { formatter: (n: number) => compact.format(n), hideOverlap: true } },
    yAxis: { type: 'value', min: 0, max: top, name: 'Failures per 1,000 unit-months', nameLocation: 'middle', nameGap: 40, axisLabel: { formatter: (n: number) => compact.format(n) } },
    series: [
      ...limitSeries,
      {
        type: 'line',
        name: 'Network rate',
        showSymbol: false,
        silent: true,
        lineStyle: { width: 2, color: colors.accent },
        data: [[0, networkRate], [widest, networkRate]],
      },
      ...pointSeries,
    ],
  };
}
