import type { ReliabilityGroup, ReliabilityRow } from '@busbar/shared';
import type { TableColumnsType } from 'ant-design-vue';
import { GROUP_LABELS } from './reliabilityFilters.ts';

type Figure = (row: ReliabilityRow) => number | null | undefined;
/** Sorts by a figure; rows without one sort below every figure. */
const by = (figure: Figure) => (a: ReliabilityRow, b: ReliabilityRow) => (figure(a) ?? -1) - (figure(b) ?? -1);

/**
 * The reliability list's columns, each sortable in the browser (the API answers every row at once).
 * A phone gets one column that stacks the figures under the name, sorted by rate.
 */
export function reliabilityColumns(groupBy: ReliabilityGroup, show: { narrow: boolean; network: boolean }): TableColumnsType<ReliabilityRow> {
  if (show.narrow) return [{ key: 'summary', title: `${GROUP_LABELS[groupBy]} and failures per 1,000 unit-months`, sorter: by((r) => r.rate?.estimate) }];
  const columns: TableColumnsType<ReliabilityRow> = [
    { key: 'label', title: GROUP_LABELS[groupBy], width: 260, sorter: (a, b) => a.label.localeCompare(b.label) },
    { key: 'units', title: 'Units', align: 'right', width: 70, sorter: by((r) => r.units) },
    { key: 'unitMonths', title: 'Unit-months', align: 'right', width: 100, sorter: by((r) => r.unitMonths) },
    { key: 'failures', title: 'Failures', align: 'right', width: 80, sorter: by((r) => r.failures) },
    { key: 'rate', title: 'Failures per 1,000 unit-months', align: 'right', width: 150, sorter: by((r) => r.rate?.estimate) },
    { key: 'warranty', title: 'Failed within warranty', align: 'right', width: 160, sorter: by((r) => r.warranty?.estimate) },
  ];
  if (show.network) columns.splice(5, 0, { key: 'networkRate', title: 'Network, per 1,000 unit-months', align: 'right', width: 150, sorter: by((r) => r.networkRate?.estimate) });
  return columns;
}

/** True when some row's rate is not the network's own, i.e. the person sees or chose part of the network. */
export const differsFromNetwork = (rows: ReliabilityRow[]) =>
  rows.some((r) => r.units > 0 && (r.rate?.estimate !== r.networkRate?.estimate || r.rate?.upper !== r.networkRate?.upper));
