import { CATEGORY_LABELS, CLAIM_STATUS_LABELS, type LocationClose } from '@busbar/shared';
import type { Column, Sheet } from './columns.ts';
import { buildLines, countBuildLines, countDeliveredBuilds, countLoggedClaims, deliveredBuilds, loggedClaims, type BuildLine, type DeliveredBuild, type ExportRange, type LoggedClaim } from './records.ts';

/** A location's month as the month close has it (final as closed, else as it stands), with the shop's code and name. */
export type ClosedMonth = LocationClose & { month: string; shop: string; shopName: string };

const money = <R>(key: string, header: string, value: (row: R) => number | null, more: Partial<Column<R>> = {}): Column<R> => ({ key, header, kind: 'money', width: 14, value, summed: true, ...more });
const shopColumns = <R extends { shop: string }>(): Column<R>[] => [{ key: 'shop', header: 'Shop', kind: 'text', width: 8, value: (r) => r.shop }];
const closeState = (c: ClosedMonth) => (c.status === 'final' ? 'Final' : 'Open');

const SUMMARY: Column<ClosedMonth>[] = [
  { key: 'month', header: 'Month', kind: 'month', width: 10, value: (c) => c.month },
  ...shopColumns<ClosedMonth>(),
  { key: 'shopName', header: 'Location', kind: 'text', width: 22, value: (c) => c.shopName },
  { key: 'status', header: 'Close', kind: 'text', width: 8, value: closeState },
  { key: 'builds', header: 'Builds delivered', kind: 'count', width: 10, value: (c) => c.buildsDelivered, summed: true },
  money('parts', 'Parts revenue', (c) => c.partsRevenueCents),
  money('labor', 'Labor revenue', (c) => c.laborRevenueCents),
  money('revenue', 'Revenue', (c) => c.revenueCents),
  money('cost', 'Parts cost', (c) => c.partsCostCents),
  money('margin', 'Gross margin', (c) => c.grossMarginCents),
  money('salesTax', 'Sales tax', (c) => c.salesTaxCents),
  { key: 'claims', header: 'Claims logged', kind: 'count', width: 10, value: (c) => c.claimsLogged, summed: true },
  money('requested', 'Credit asked', (c) => c.creditRequestedCents),
  money('received', 'Credit received', (c) => c.creditReceivedCents),
  money('outstanding', 'Credit outstanding', (c) => c.creditOutstandingCents),
  money('base', 'Royalty base', (c) => c.royaltyBaseCents),
  money('royalty', 'Royalty due', (c) => c.royaltyDueCents),
  money('marketing', 'Marketing fund due', (c) => c.marketingDueCents),
];

/** The royalty statement of each location and month: base × rate, to the cent, and the adjustments for earlier final months it takes up. */
const ROYALTY: Column<ClosedMonth>[] = [
  ...SUMMARY.slice(0, 4),
  money('base', 'Royalty base (parts and labor)', (c) => c.royaltyBaseCents),
  { key: 'royaltyRate', header: 'Royalty rate', kind: 'rate', width: 10, value: (c) => c.royaltyBasisPoints },
  money('royalty', 'Royalty due', (c) => c.royaltyDueCents, { formula: (cell) => `ROUND(${cell('base')}*${cell('royaltyRate')},2)` }),
  { key: 'marketingRate', header: 'Marketing fund rate', kind: 'rate', width: 10, value: (c) => c.marketingBasisPoints },
  money('marketing', 'Marketing fund due', (c) => c.marketingDueCents, { formula: (cell) => `ROUND(${cell('base')}*${cell('marketingRate')},2)` }),
  { key: 'adjusted', header: 'Adjusts final months', kind: 'text', width: 16, value: (c) => c.adjustments?.months.join(', ') ?? '' },
  money('royaltyAdjustment', 'Royalty adjustment', (c) => c.adjustments?.royaltyDueCents ?? 0),
  money('marketingAdjustment', 'Marketing fund adjustment', (c) => c.adjustments?.marketingDueCents ?? 0),
  money('due', 'Total due', (c) => c.royaltyDueCents + c.marketingDueCents + (c.adjustments?.royaltyDueCents ?? 0) + (c.adjustments?.marketingDueCents ?? 0), {
    formula: (cell) => `${cell('royalty')}+${cell('marketing')}+${cell('royaltyAdjustment')}+${cell('marketingAdjustment')}`,
  }),
];

const BUILDS: Column<DeliveredBuild>[] = [
  { key: 'number', header: 'Build', kind: 'text', width: 16, value: (b) => b.number },
  ...shopColumns<DeliveredBuild>(),
  { key: 'deliveredOn', header: 'Delivered on', kind: 'day', width: 12, value: (b) => b.deliveredOn },
  { key: 'customer', header: 'Customer', kind: 'text', width: 22, value: (b) => b.customer, reads: ['Customer', 'name'] },
  { key: 'hours', header: 'Labor hours', kind: 'hours', width: 10, value: (b) => b.laborHours, summed: true },
  money('labor', 'Labor revenue', (b) => b.laborCents, { reads: ['Build', 'laborCents'] }),
  money('parts', 'Parts revenue', (b) => b.partsPriceCents, { reads: ['Build', 'partsPriceCents'] }),
  money('revenue', 'Revenue', (b) => b.totalCents, { reads: ['Build', 'totalCents'] }),
  money('cost', 'Parts cost', (b) => b.partsCostCents, { reads: ['Build', 'partsCostCents'] }),
  money('margin', 'Gross margin', (b) => b.totalCents - b.partsCostCents, { reads: ['Build', 'partsCostCents'], formula: (cell) => `${cell('revenue')}-${cell('cost')}` }),
];

const LINES: Column<BuildLine>[] = [
  { key: 'build', header: 'Build', kind: 'text', width: 16, value: (l) => l.buildNumber },
  ...shopColumns<BuildLine>(),
  { key: 'deliveredOn', header: 'Delivered on', kind: 'day', width: 12, value: (l) => l.deliveredOn },
  { key: 'sku', header: 'SKU', kind: 'text', width: 14, value: (l) => l.sku },
  { key: 'item', header: 'Item', kind: 'text', width: 28, value: (l) => l.item },
  { key: 'category', header: 'Category', kind: 'text', width: 16, value: (l) => CATEGORY_LABELS[l.category] },
  { key: 'serial', header: 'Serial number', kind: 'text', width: 16, value: (l) => l.serialNumber ?? '' },
  { key: 'quantity', header: 'Quantity', kind: 'count', width: 9, value: (l) => l.quantity, summed: true },
  money('unitPrice', 'Unit price', (l) => l.unitPriceCents, { summed: false, reads: ['Build', 'unitPriceCents'] }),
  money('unitCost', 'Unit cost', (l) => l.unitCostCents, { summed: false, reads: ['Build', 'unitCostCents'] }),
  money('price', 'Line price', (l) => l.quantity * l.unitPriceCents, { reads: ['Build', 'unitPriceCents'], formula: (cell) => `${cell('quantity')}*${cell('unitPrice')}` }),
  money('cost', 'Line cost', (l) => l.quantity * l.unitCostCents, { reads: ['Build', 'unitCostCents'], formula: (cell) => `${cell('quantity')}*${cell('unitCost')}` }),
  { key: 'removedOn', header: 'Taken out on', kind: 'day', width: 12, value: (l) => l.removedOn },
];

/** What the vendor still owes: asked, not received, not denied (as the month close counts it). */
const outstanding = (c: LoggedClaim) => (c.status !== 'denied' && c.creditReceivedCents === null ? c.creditRequestedCents : 0);

const CLAIMS: Column<LoggedClaim>[] = [
  { key: 'number', header: 'Claim', kind: 'text', width: 16, value: (c) => c.number },
  ...shopColumns<LoggedClaim>(),
  { key: 'loggedOn', header: 'Logged on', kind: 'day', width: 12, value: (c) => c.loggedOn },
  { key: 'build', header: 'Build', kind: 'text', width: 16, value: (c) => c.buildNumber },
  { key: 'sku', header: 'SKU', kind: 'text', width: 14, value: (c) => c.sku },
  { key: 'item', header: 'Item', kind: 'text', width: 28, value: (c) => c.item },
  { key: 'vendor', header: 'Vendor', kind: 'text', width: 20, value: (c) => c.vendor },
  { key: 'status', header: 'Status', kind: 'text', width: 14, value: (c) => CLAIM_STATUS_LABELS[c.status] },
  money('requested', 'Credit asked', (c) => c.creditRequestedCents),
  money('received', 'Credit received', (c) => c.creditReceivedCents ?? 0),
  money('outstanding', 'Credit outstanding', outstanding),
];

/** The sheets of a month-close export, in the workbook's order. */
export function monthCloseSheets(range: ExportRange, closes: ClosedMonth[]): Sheet<never>[] {
  const ofCloses = async function* () {
    yield closes;
  };
  const sheets = [
    { key: 'summary', columns: SUMMARY, count: async () => closes.length, batches: ofCloses } satisfies Sheet<ClosedMonth>,
    { key: 'builds', columns: BUILDS, count: () => countDeliveredBuilds(range), batches: () => deliveredBuilds(range) } satisfies Sheet<DeliveredBuild>,
    { key: 'lines', columns: LINES, count: () => countBuildLines(range), batches: () => buildLines(range) } satisfies Sheet<BuildLine>,
    { key: 'claims', columns: CLAIMS, count: () => countLoggedClaims(range), batches: () => loggedClaims(range) } satisfies Sheet<LoggedClaim>,
    { key: 'royalty', columns: ROYALTY, count: async () => closes.length, batches: ofCloses } satisfies Sheet<ClosedMonth>,
  ];
  return sheets as unknown as Sheet<never>[];
}

/** Every field an export's columns read, as 'Subject.field', to check against a person's rules. */
export const EXPORTED_FIELDS = [...new Set([SUMMARY, ROYALTY, BUILDS, LINES, CLAIMS].flatMap((columns: Column<never>[]) => columns.flatMap((c) => (c.reads ? [c.reads.join('.')] : []))))];
