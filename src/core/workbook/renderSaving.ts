// "What it saves" on the Quantities and cost sheet: per case the hours from the Tariff sheet, the
// kvarh charged before and after, the kvar above the free demand and the kWh of losses saved,
// from P and Q at the point of connection on the Buses sheet; then the yearly reactive charge
// before and after, the losses saved, the annual saving and the simple payback of the total
// above. The same arithmetic as src/core/quote/saving.ts, as plain formulas.
import { TARIFF_LABELS, TARIFF_SHEET, hoursLabel } from '../quote/index.ts';
import { planBusColumns } from './busColumns.ts';
import type { CellContent } from './document.ts';
import { SHEETS } from './layout.ts';
import {
  QC,
  QUANT_COLUMNS,
  SAVING_HEADINGS,
  SAVING_LABELS,
  UNPRICED_TEXT,
  savingCaseRow,
  savingRowOf,
  summaryRowOf,
} from './quantitiesLayout.ts';
import { cell, cellOn, rangeOn, sheetPrefix, textLiteral } from './refs.ts';
import { textContent } from '../text/cellText.ts';

const WIDTH = QUANT_COLUMNS.length;

/** A Tariff setting by its Setting text; 0 when absent or not a number ≥ 0 (as readTariff reads it). */
function tariffValue(label: string, hasTariff: boolean): string {
  if (!hasTariff) return '0';
  const look = `VLOOKUP(${textLiteral(label)},${sheetPrefix(TARIFF_SHEET)}$A:$B,2,FALSE)`;
  return `IFERROR(IF(AND(ISNUMBER(${look}),${look}>=0),${look},0),0)`;
}

/**
 * Where the saving reads P and Q after compensation at the point of connection, per case: the
 * Buses sheet's (the chosen design), or a design option's own roll-up. `origin`: the row of the
 * first bus line of the blocks above (quantitiesLayout.ts).
 */
export interface SavingPlace {
  readonly origin: number;
  readonly after: (k: number) => readonly [p: string, q: string];
}

/** The saving block's rows for n buses and the cases given (appended below the note). */
export function savingRows(
  n: number,
  cases: readonly string[],
  hasTariff: boolean,
  place?: SavingPlace,
): CellContent[][] {
  const busCols = planBusColumns(cases);
  const root = (col: number) => cellOn(SHEETS.buses, 1, col, true);
  const origin = place?.origin ?? 1;
  const t = (key: keyof typeof TARIFF_LABELS) => tariffValue(TARIFF_LABELS[key], hasTariff);
  const head = new Array<CellContent>(WIDTH).fill(null);
  for (const [c, text] of Object.entries(SAVING_HEADINGS)) head[Number(c)] = text ?? null;
  const rows: CellContent[][] = [new Array<CellContent>(WIDTH).fill(null), head];
  const excess = (p: string, q: string, tan: string) => `MAX(0,${q}-${tan}*ABS(${p}))`;
  cases.forEach((c, k) => {
    const r = savingCaseRow(n, k, origin);
    const out = new Array<CellContent>(WIDTH).fill(null);
    const [P, Q] = [root(busCols.p[k] as number), root(busCols.q[k] as number)];
    const [PA, QA] = place?.after(k) ?? [
      root(busCols.pAfter[k] as number),
      root(busCols.qAfter[k] as number),
    ];
    const hours = cell(r, QC.count);
    out[QC.bus] = textContent(c);
    out[QC.count] = `=${tariffValue(hoursLabel(c), hasTariff)}`;
    out[QC.quantity] = `=${excess(P, Q, t('kvarh_free_tan'))}*${hours}`;
    out[QC.unit] = `=${excess(PA, QA, t('kvarh_free_tan'))}*${hours}`;
    out[QC.amps] = `=IF(${hours}>0,${excess(P, Q, t('demand_free_tan'))},0)`;
    out[QC.rate] = `=IF(${hours}>0,${excess(PA, QA, t('demand_free_tan'))},0)`;
    out[QC.cost] = `=(${P}-${PA})*${hours}`;
    rows.push(out);
  });
  const first = savingCaseRow(n, 0, origin);
  const last = savingCaseRow(n, cases.length - 1, origin);
  const col = (c: number) => rangeOn(undefined, first, c, last, c);
  const at = (line: (typeof SAVING_LABELS)[number]) =>
    cell(savingRowOf(n, cases.length, line, origin), QC.cost);
  const charge = (kvarh: number, excessCol: number) =>
    `=${t('kvarh_price')}*SUM(${col(kvarh)})+${t('demand_price')}*${t('periods_per_year')}*MAX(0,${col(excessCol)})`;
  const total = cell(summaryRowOf(n, 'Total', origin), QC.cost);
  const saving = at('Annual saving');
  const formulas: Record<(typeof SAVING_LABELS)[number], string> = {
    'Reactive charge before': charge(QC.quantity, QC.amps),
    'Reactive charge after': charge(QC.unit, QC.rate),
    'Losses saved': `=${t('energy_price')}*SUM(${col(QC.cost)})`,
    'Annual saving': `=${at('Reactive charge before')}-${at('Reactive charge after')}+${at('Losses saved')}`,
    'Simple payback (years)': `=IF(NOT(ISNUMBER(${total})),"${UNPRICED_TEXT.total}",IF(${saving}>0,IFERROR(${total}/${saving},"no saving"),"no saving"))`,
  };
  for (const label of SAVING_LABELS) {
    const out = new Array<CellContent>(WIDTH).fill(null);
    out[QC.bus] = label;
    out[QC.cost] = formulas[label];
    rows.push(out);
  }
  return rows;
}
