// The priced schedule as the page's "Quantities and cost" sheet shows it and as the core counts
// and prices it (src/core/quote, what `kvar-ledger quote` prints) for the same workbook.
import type { WorkbookSession } from '../../../src/ui/model/session.ts';
import { siteFromWorkbook } from '../../../src/core/workbook/readSite.ts';
import {
  annualSaving,
  priceSchedule,
  rateRowsOf,
  readRateTable,
  readTariff,
  siteSchedule,
  tariffRowsOf,
  type Quote,
  type Saving,
} from '../../../src/core/quote/index.ts';
import { compensate } from '../../../src/core/site/compensate.ts';
import {
  QC,
  QUANTITIES_SHEET,
  SLOTS,
  SAVING_LABELS,
  busLineRow,
  savingCaseRow,
  savingRowOf,
  slotRow,
  summaryRowOf,
} from '../../../src/core/workbook/quantitiesLayout.ts';

export interface QuoteLine {
  readonly code: string;
  readonly count: number | null;
  readonly quantity: number | null;
  readonly cost: number | null;
}
export interface QuoteFace {
  /** Buses with a bank or reactor, in bus order. */
  readonly buses: ReadonlyArray<{ bus: string; lines: readonly QuoteLine[]; subtotal: number | null }>;
  readonly equipment: number | null;
  readonly total: number | null;
}

const numOrNull = (v: unknown) => (typeof v === 'number' ? v : null);

/** What the page's engine shows on the sheet, for the buses of the Compensation sheet. */
export function pageQuote(s: WorkbookSession, busCount: number): QuoteFace {
  const id = s.engine.getSheetId(QUANTITIES_SHEET);
  if (id === undefined) throw new Error(`no sheet ${QUANTITIES_SHEET}`);
  const v = (row: number, col: number) => s.engine.getCellValue({ sheet: id, row, col });
  const buses: QuoteFace['buses'][number][] = [];
  for (let i = 0; i < busCount; i++) {
    const r = busLineRow(i);
    const chosen = (numOrNull(v(r, QC.total)) ?? 0) + (numOrNull(v(r, QC.reactor)) ?? 0) > 0;
    if (!chosen) continue;
    const lines: QuoteLine[] = [];
    for (const slot of SLOTS) {
      const row = slotRow(i, slot);
      const code = v(row, QC.item);
      if (code === '' || code === null) continue;
      lines.push({
        code: String(code),
        count: numOrNull(v(row, QC.count)),
        quantity: numOrNull(v(row, QC.quantity)),
        cost: numOrNull(v(row, QC.cost)),
      });
    }
    buses.push({ bus: String(v(r, QC.bus)), lines, subtotal: numOrNull(v(r, QC.subtotal)) });
  }
  return {
    buses,
    equipment: numOrNull(v(summaryRowOf(busCount, 'Equipment'), QC.cost)),
    total: numOrNull(v(summaryRowOf(busCount, 'Total'), QC.cost)),
  };
}

/** The core's schedule and cost for the workbook as saved, with the rates of its Rates sheet. */
export function coreQuote(s: WorkbookSession): { quote: Quote; face: QuoteFace; busCount: number } {
  const doc = s.toDoc();
  const read = siteFromWorkbook(doc);
  const { table } = readRateTable(rateRowsOf(doc) ?? []);
  const quote = priceSchedule(siteSchedule(read.site, read.banks), table);
  const busCount = countBuses(s);
  // The core leaves out a bus whose voltage is unknown only as one unpriced line without a code.
  const face: QuoteFace = {
    buses: quote.buses.map((b) => ({
      bus: b.bus,
      lines: b.lines
        .filter((l) => l.item.code !== '')
        .map((l) => ({ code: l.item.code, count: l.item.count, quantity: l.item.quantity, cost: l.cost })),
      subtotal: b.subtotal,
    })),
    equipment: quote.equipment,
    total: quote.total,
  };
  return { quote, face, busCount };
}

/** Buses on the Compensation sheet: the rows above its first blank bus cell. */
function countBuses(s: WorkbookSession): number {
  const id = s.engine.getSheetId('Compensation') as number;
  let n = 0;
  while (s.engine.getCellValue({ sheet: id, row: n + 1, col: 0 }) !== null) n++;
  return n;
}

/** The saving block as the page shows it: per case [hours, kvarh before, after, losses kWh], then the yearly figures. */
export function pageSaving(s: WorkbookSession, busCount: number, cases: number) {
  const id = s.engine.getSheetId(QUANTITIES_SHEET) as number;
  const v = (row: number, col: number) => s.engine.getCellValue({ sheet: id, row, col });
  const perCase = Array.from({ length: cases }, (_, k) => {
    const r = savingCaseRow(busCount, k);
    return [QC.count, QC.quantity, QC.unit, QC.amps, QC.rate, QC.cost].map((c) => numOrNull(v(r, c)));
  });
  const yearly = Object.fromEntries(
    SAVING_LABELS.map((l) => [l, v(savingRowOf(busCount, cases, l), QC.cost)]),
  ) as Record<(typeof SAVING_LABELS)[number], unknown>;
  return { perCase, yearly };
}

/** The core's saving for the workbook as saved: its Tariff sheet, P and Q at the point of connection. */
export function coreSaving(s: WorkbookSession, total: number | null): Saving {
  const doc = s.toDoc();
  const read = siteFromWorkbook(doc);
  const flows = compensate(read.site, read.banks).map((c) => ({
    case: c.case,
    p_kw: c.before.root.p_kw,
    q_kvar: c.before.root.q_kvar,
    p_after_kw: c.after.root.p_kw,
    q_after_kvar: c.after.root.q_kvar,
  }));
  const { tariff } = readTariff(tariffRowsOf(doc) ?? [], read.site.settings.cases);
  return annualSaving(flows, tariff, total);
}
