import type { FunnelLimit, FunnelPoint, SurvivalPoint } from '@busbar/shared';
import { describe, expect, it } from 'vitest';
import type { ChartColors } from '../../apps/web/src/views/reliability/chartColors.ts';
import { funnelChartOption, funnelPointLabel, funnelRateTop, roundUp } from '../../apps/web/src/views/reliability/funnelChartOption.ts';
import { survivalChartOption, survivalFloor, survivalLabel } from '../../apps/web/src/views/reliability/survivalChartOption.ts';

const colors: ChartColors = {
  font: 'Noto Sans',
  text: '#222',
  muted: '#666',
  accent: '#a45',
  signal: { above_998: 'red', above_95: 'orange', within: 'grey', below_95: 'blue', below_998: 'green' },
};

const survival: SurvivalPoint[] = [
  { months: 2, atRisk: 100, failures: 3, survival: 0.97, lower: 0.91, upper: 0.99 },
  { months: 7.5, atRisk: 60, failures: 6, survival: 0.873, lower: 0.78, upper: 0.93 },
];

type XY = [number, number];
const seriesData = (option: ReturnType<typeof survivalChartOption> | ReturnType<typeof funnelChartOption>, name: string) => {
  const series = (option.series as { name: string; data: unknown[] }[]).find((s) => s.name === name);
  return series?.data;
};

describe('survival chart', () => {
  it('starts at every unit working and steps down to each point, the band stacked from its lower limit', () => {
    const option = survivalChartOption(survival, colors, false);
    expect(seriesData(option, 'Still working')).toEqual([[0, 1], [2, 0.97], [7.5, 0.873]]);
    expect(seriesData(option, 'Lower limit')).toEqual([[0, 1], [2, 0.91], [7.5, 0.78]]);
    const band = seriesData(option, '95 % band') as XY[];
    expect(band.map(([x, height]) => [x, Number(height.toFixed(6))])).toEqual([[0, 0], [2, 0.08], [7.5, 0.15]]);
    for (const s of option.series as { step?: string; name: string }[]) expect(s.step, s.name).toBe('end');
  });

  it('shows the share axis from the tenth at or below the lowest limit (90 % at most), in percent', () => {
    expect(survivalFloor(survival)).toBe(0.7);
    expect(survivalFloor([{ ...survival[0]!, lower: 0.9 }])).toBe(0.9);
    expect(survivalFloor([{ ...survival[0]!, lower: 0.97 }])).toBe(0.9);
    expect(survivalFloor([])).toBe(0.9);
    expect(survivalFloor([{ ...survival[0]!, lower: 0.02 }])).toBe(0);
    const option = survivalChartOption(survival, colors);
    const y = option.yAxis as { min: number; max: number; interval: number; axisLabel: { formatter: (n: number) => string } };
    expect([y.min, y.max, y.interval, y.axisLabel.formatter(0.85)]).toEqual([0.7, 1, 0.05, '85 %']);
    expect((survivalChartOption([{ ...survival[0]!, lower: 0.35 }], colors).yAxis as { interval: number }).interval).toBe(0.1);
  });

  it('tells a step in words', () => {
    expect(survivalLabel(survival[1]!)).toBe('7.5 months: 87.3 % still working (78.0 %–93.0 %), 60 in service, 6 failed');
  });
});

const point = (over: Partial<FunnelPoint>): FunnelPoint => ({
  locationId: 1,
  code: 'AUS',
  name: 'Austin',
  unitMonths: 2_000,
  failures: 12,
  rate: 6,
  signal: 'above_998',
  claims: 14,
  workmanshipClaims: 9,
  ...over,
});
const limits: FunnelLimit[] = [
  { unitMonths: 4_000, lower998: 0.4, lower95: 0.9, upper95: 3.2, upper998: 4.1 },
  { unitMonths: 500, lower998: -1, lower95: 0, upper95: 6.5, upper998: 9 },
];

describe('funnel chart', () => {
  const points = [point({}), point({ locationId: null, code: null, name: null, unitMonths: 3_000, failures: 5, rate: 1.667, signal: 'within' })];

  it('draws each limit by exposure, never below zero, and the network rate across the widest exposure', () => {
    const option = funnelChartOption(points, limits, 2, colors, false);
    const lines = (option.series as { type: string; name: string; data: XY[] }[]).filter((s) => s.type === 'line');
    expect(lines.map((s) => s.name)).toEqual(['99.8 % limits', '99.8 % limits', '95 % limits', '95 % limits', 'Network rate']);
    expect(lines[0]!.data).toEqual([[500, 9], [4_000, 4.1]]);
    expect(lines[1]!.data).toEqual([[500, 0], [4_000, 0.4]]);
    expect(lines[4]!.data).toEqual([[0, 2], [4_000, 2]]);
  });

  it('puts the shops in one series per signal, named by code or as another shop, each with its own shape', () => {
    const option = funnelChartOption(points, limits, 2, colors);
    const scatter = (option.series as { type: string; name: string; symbol: string; data: { name: string; value: XY }[] }[]).filter((s) => s.type === 'scatter');
    expect(scatter.map((s) => [s.name, s.symbol, s.data])).toEqual([
      ['Above the 99.8 % limit', 'triangle', [{ name: 'AUS', value: [2_000, 6] }]],
      ['Within the limits', 'circle', [{ name: 'Another shop', value: [3_000, 1.667] }]],
    ]);
  });

  it('keeps every point on the rate axis, with room above the highest, ending on a round figure', () => {
    expect(funnelRateTop(points, 2)).toBe(10);
    expect(funnelRateTop([point({ rate: 1 })], 2)).toBe(5);
    expect(funnelRateTop([point({ rate: 11.3 })], 4.9)).toBe(20);
    expect(funnelRateTop([point({ rate: 0.2 })], 0.1)).toBe(0.25);
    expect(funnelRateTop([], 0)).toBe(1);
    expect([roundUp(1), roundUp(2.2), roundUp(4.5), roundUp(7), roundUp(0.031)]).toEqual([1, 2.5, 5, 10, 0.05]);
  });

  it('tells a shop in words', () => {
    expect(funnelPointLabel(point({ unitMonths: 2_310.4, failures: 9, rate: 3.9 }))).toBe(
      'AUS: 3.9 per 1,000 unit-months over 2,310 unit-months (9 failures). Above the 99.8 % limit',
    );
    expect(funnelPointLabel(point({ code: null, failures: 1, rate: 0.5, signal: 'within' }))).toBe(
      'Another shop: 0.50 per 1,000 unit-months over 2,000 unit-months (1 failure). Within the limits',
    );
  });
});
