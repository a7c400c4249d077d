import type { HourState, PlanResult } from '@busbar/calc';
import type { LineSeriesOption } from 'echarts/charts';
import type { GridComponentOption, MarkAreaComponentOption, MarkLineComponentOption, TooltipComponentOption } from 'echarts/components';
import type { ComposeOption } from 'echarts/core';
import { tripMoment } from './planFormat.ts';

export type SocChartOption = ComposeOption<LineSeriesOption | GridComponentOption | TooltipComponentOption | MarkAreaComponentOption | MarkLineComponentOption>;

const css = (name: string) => getComputedStyle(document.documentElement).getPropertyValue(name).trim();
const KIND_LABELS = { parked: 'Parked', driving: 'Driving' } as const;

/** The trip's parked and driving stretches as hour ranges, for shading. */
function stretches(hourly: HourState[]) {
  const list: { kind: HourState['kind']; from: number; to: number }[] = [];
  hourly.forEach((state, i) => {
    const last = list.at(-1);
    if (last && last.kind === state.kind) last.to = i + 1;
    else list.push({ kind: state.kind, from: i, to: i + 1 });
  });
  return list;
}

/** The state of charge hour by hour from a full battery, parked days and driving days shaded and named, the floor drawn. */
export function socChartOption(result: PlanResult, animate: boolean): SocChartOption {
  const { hourly, bank } = result;
  const totalHours = hourly.length;
  const shade = { parked: css('--bb-tone-info-background'), driving: css('--bb-tone-warning-background') };
  const text = css('--bb-text');
  return {
    animation: animate,
    textStyle: { fontFamily: css('--bb-font'), color: text },
    grid: { left: 64, right: 24, top: 28, bottom: 48 },
    tooltip: {
      trigger: 'axis',
      valueFormatter: (value) => `${Number(value).toFixed(0)} %`,
      axisPointer: { label: { formatter: ({ value }) => hourLabel(hourly, Number(value)) } },
    },
    xAxis: {
      type: 'value',
      min: 0,
      max: totalHours,
      interval: 24,
      name: 'Trip, day by day',
      nameLocation: 'middle',
      nameGap: 30,
      axisLabel: { formatter: (hours: number) => (hours < totalHours ? `Day ${hours / 24 + 1}` : 'End') },
    },
    yAxis: {
      type: 'value',
      min: 0,
      max: 100,
      name: 'State of charge (%)',
      nameLocation: 'middle',
      nameGap: 44,
      axisLabel: { formatter: '{value} %' },
    },
    series: [
      {
        type: 'line',
        name: 'State of charge',
        showSymbol: false,
        lineStyle: { width: 2.5, color: css('--bb-copper') },
        itemStyle: { color: css('--bb-copper') },
        data: [[0, 100], ...hourly.map((state, i) => [i + 1, Number(state.stateOfChargePercent.toFixed(1))])],
        markArea: {
          silent: true,
          label: { color: text, position: 'insideTop' },
          data: stretches(hourly).map((s) => [
            { xAxis: s.from, name: KIND_LABELS[s.kind], itemStyle: { color: shade[s.kind] } },
            { xAxis: s.to },
          ]),
        },
        markLine: {
          silent: true,
          symbol: 'none',
          lineStyle: { type: 'dashed', color: css('--bb-tone-danger-text') },
          label: { formatter: `Floor ${bank.floorPercent.toFixed(0)} %`, position: 'insideEndTop', color: css('--bb-tone-danger-text') },
          data: [{ yAxis: bank.floorPercent }],
        },
      },
    ],
  };
}

/** "day 2, 14:00 (parked)" for the point at the end of hour `hours` of the trip. */
export function hourLabel(hourly: HourState[], hours: number): string {
  const state = hourly[Math.max(0, Math.round(hours) - 1)];
  if (!state || hours <= 0) return 'Start, full';
  const end = state.hour + 1;
  return `${tripMoment(end === 24 ? state.day + 1 : state.day, end % 24)} (${state.kind})`;
}
