export interface PricedLine {
  quantity: number;
  unitPriceCents: number;
  unitCostCents: number;
}

export interface BuildTotals {
  partsPriceCents: number;
  partsCostCents: number;
  laborCents: number;
  totalCents: number;
  /** Parts price less parts cost; labor cost is not known per build. */
  marginCents: number;
}

/**
 * Money of one build in integer cents: parts at the prices captured on each line, labor as hours
 * × the location's rate rounded half away from zero to the cent (common practice, no source).
 */
export function buildTotals(lines: readonly PricedLine[], laborHours: number, laborRateCents: number): BuildTotals {
  let partsPriceCents = 0;
  let partsCostCents = 0;
  for (const line of lines) {
    partsPriceCents += line.quantity * line.unitPriceCents;
    partsCostCents += line.quantity * line.unitCostCents;
  }
  // Hours are entered to the hundredth: work in hundredths so 0.1 h × rate does not drift.
  const laborCents = Math.round((Math.round(laborHours * 100) * laborRateCents) / 100);
  return {
    partsPriceCents,
    partsCostCents,
    laborCents,
    totalCents: partsPriceCents + laborCents,
    marginCents: partsPriceCents - partsCostCents,
  };
}
