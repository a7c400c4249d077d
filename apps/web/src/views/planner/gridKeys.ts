const FOCUSABLE = 'input:not([type="hidden"]), button, [tabindex]:not([tabindex="-1"])';

/**
 * Enter in a table's text or number field moves to the same column of the next row, as in a
 * spreadsheet; Tab keeps its usual order. Selects keep Enter for choosing.
 */
export function onGridEnter(event: KeyboardEvent): void {
  const target = event.target as HTMLElement | null;
  if (event.key !== 'Enter' || !(target instanceof HTMLInputElement) || target.getAttribute('role') === 'combobox') return;
  const cell = target.closest('td');
  const nextRow = cell?.parentElement?.nextElementSibling;
  if (!cell || !nextRow) return;
  event.preventDefault();
  const below = nextRow.children[cell.cellIndex]?.querySelector<HTMLElement>(FOCUSABLE);
  below?.focus();
}
