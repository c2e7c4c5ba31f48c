// Column headers: the letter for references, then the unit and number format of the column,
// written as text. Computed columns are marked so users see which cells hold formulas.
import type { ColumnInfo } from '../../core/workbook/document.ts';
import { columnLetters } from '../model/address.ts';
import { headerLabel } from '../format/columnHeader.ts';

export function decorateColumnHeader(
  col: number,
  th: HTMLTableCellElement,
  columns: readonly ColumnInfo[] | undefined,
): void {
  if (col < 0) return;
  const label = headerLabel(columnLetters(col), columns?.[col]);
  const host = th.querySelector('.colHeader') ?? th.firstElementChild ?? th;
  // Headers are drawn again with every render: unchanged text is not written again (no relayout).
  if (host.textContent !== label.letter) host.textContent = label.letter;
  let detail = th.querySelector<HTMLElement>('.kl-colunit');
  if (!detail) {
    detail = document.createElement('span');
    detail.className = 'kl-colunit';
    host.after(detail);
  }
  if (detail.textContent !== label.detail) detail.textContent = label.detail;
  th.classList.toggle('kl-calc-col', label.computed);
  const title = columns?.[col]
    ? `${columns[col]?.header}${label.computed ? ' — computed by formula' : ''}`
    : '';
  if (th.title !== title) th.title = title;
}
