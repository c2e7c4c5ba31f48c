// What the one-page summary shows, read from the engine's values of the workbook's own sheets
// (Site, Buses, Compensation, Quantities and cost, Rates, Tariff), by header text or by the
// layout the sheets are written with: every figure is a cell the sheets show, never worked out
// again here. A cell that holds an error or text stays that text, so the page never shows a
// number the workbook does not have.
import { RATES_SHEET, TARIFF_SHEET } from '../../core/quote/index.ts';
import { COMP_HEADERS, BANK_INPUTS } from '../../core/workbook/compensationColumns.ts';
import { BUS_HEADERS, SHEETS } from '../../core/workbook/layout.ts';
import {
  QC,
  SAVING_LABELS,
  SLOTS,
  SUMMARY_LABELS,
  busLineRow,
  savingRowOf,
  slotRow,
  summaryRowOf,
} from '../../core/workbook/quantitiesLayout.ts';
import { SETTING_ROWS, VALUE_COL } from '../../core/workbook/settingsLayout.ts';
import { formatNumber } from '../format/numberFormat.ts';
import { casesOf, cellError, readChartData, type BusBar, type Grid } from '../charts/chartData.ts';

/** A cell as the summary shows it: a number, a text (including an error's code and message), or nothing. */
export type Figure = number | string | undefined;

export interface CaseAtConnection {
  readonly name: string;
  readonly p: Figure;
  readonly qBefore: Figure;
  readonly cosBefore: Figure;
  readonly tanBefore: Figure;
  readonly sense: Figure;
  readonly pAfter: Figure;
  readonly qAfter: Figure;
  readonly cosAfter: Figure;
  readonly tanAfter: Figure;
  readonly within: Figure;
}

export interface BankLine {
  readonly bus: string;
  readonly u: Figure;
  readonly fixed: Figure;
  readonly step: Figure;
  readonly steps: Figure;
  /** The stages' series (blank: equal) and the smallest steps the controller switches. */
  readonly series: Figure;
  readonly controllerSteps: Figure;
  readonly detuning: Figure;
  /** The capacitors' rated voltage the quote prices: as typed, else the design's (uRatedByDesign). */
  readonly uRated: Figure;
  readonly uRatedByDesign: boolean;
  readonly reactor: Figure;
  readonly total: Figure;
  readonly tuning: Figure;
  readonly check: Figure;
}

/** One countable item of the schedule: a line of a bus's block on the Quantities and cost sheet. */
export interface ItemLine {
  readonly item: Figure;
  readonly what: Figure;
  readonly count: Figure;
  readonly quantity: Figure;
  readonly unit: Figure;
  readonly cost: Figure;
}

export interface BusItems {
  readonly bus: string;
  readonly items: readonly ItemLine[];
  readonly subtotal: Figure;
}

export interface Money {
  readonly currency: string;
  /** Per bus with items, in the sheet's order: its item lines (lines without an item left out) and subtotal. */
  readonly schedule: readonly BusItems[];
  readonly equipment: Figure;
  readonly total: Figure;
  /** Why the total is unpriced: one line per item without a usable rate ("bus: item — reason"). */
  readonly unpriced: readonly string[];
  readonly saving: Figure;
  readonly payback: Figure;
}

export interface Requirement {
  /** The Site sheet's requirement text (cos φ, cos φ lagging only, tan φ). */
  readonly kind: Figure;
  readonly cosTarget: Figure;
  readonly tanLag: Figure;
  readonly tanLead: Figure;
}

export interface SummaryData {
  readonly site: string;
  readonly requirement: Requirement;
  readonly connection: string | undefined;
  readonly cases: readonly CaseAtConnection[];
  /** Buses whose Compensation row holds a bank or a reactor. */
  readonly banks: readonly BankLine[];
  /** Undefined when the workbook has no Quantities and cost sheet. */
  readonly money: Money | undefined;
  readonly bars: ReadonlyMap<string, readonly BusBar[]>;
  /** The Rates or Tariff sheet still holds values marked INVENTED. */
  readonly demoValues: boolean;
}

/** The engine's values of the sheets the summary reads, by sheet name. */
export type SheetValues = (name: string) => Grid | undefined;

/** A cell's value as a Figure: errors become their code and message. */
export function figure(v: unknown): Figure {
  if (typeof v === 'number') return Number.isFinite(v) ? v : undefined;
  if (typeof v === 'string') return v.trim() === '' ? undefined : v;
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  const e = cellError(v);
  return e ? `${e.code} ${e.message}` : undefined;
}

function columnsOf(grid: Grid | undefined): (header: string) => number | undefined {
  const m = new Map<string, number>();
  (grid?.[0] ?? []).forEach((h, i) => {
    if (typeof h === 'string') m.set(h.trim().toLowerCase(), i);
  });
  return (header) => m.get(header.toLowerCase());
}

const at = (row: ReadonlyArray<unknown> | undefined, col: number | undefined): Figure =>
  col === undefined ? undefined : figure(row?.[col]);

function connectionCases(buses: Grid | undefined, comp: Grid | undefined): CaseAtConnection[] {
  const b = columnsOf(buses);
  const c = columnsOf(comp);
  const root = buses?.[1];
  const rootName = typeof root?.[0] === 'string' ? root[0].toLowerCase() : undefined;
  const compRow = (comp ?? [])
    .slice(1)
    .find((r) => typeof r[0] === 'string' && r[0].toLowerCase() === rootName);
  // Only a case has a Sense column: "Q absorbed after day (kvar)" names no case "after day".
  const cases = casesOf(buses).filter((name) => b(BUS_HEADERS.sense(name)) !== undefined);
  return cases.map((name) => ({
    name,
    p: at(root, b(BUS_HEADERS.p(name))),
    qBefore: at(root, b(BUS_HEADERS.q(name))),
    cosBefore: at(root, b(BUS_HEADERS.cos(name))),
    tanBefore: at(root, b(BUS_HEADERS.tan(name))),
    sense: at(root, b(BUS_HEADERS.sense(name))),
    pAfter: at(root, b(BUS_HEADERS.pAfter(name))),
    qAfter: at(root, b(BUS_HEADERS.qAfter(name))),
    cosAfter: at(root, b(BUS_HEADERS.cosAfter(name))),
    tanAfter: at(root, b(BUS_HEADERS.tanAfter(name))),
    within: at(compRow, c(COMP_HEADERS.within(name))),
  }));
}

/** Per bus name, the capacitor rating its Quantities block prices (typed, else the design's). */
function pricedRatings(q: Grid | undefined): Map<string, Figure> {
  const out = new Map<string, Figure>();
  if (!q) return out;
  const n = blockCount(q);
  for (let i = 0; i < n; i++) {
    const line = q[busLineRow(i)];
    out.set(String(line?.[QC.bus]), figure(line?.[QC.uRated]));
  }
  return out;
}

function bankLines(comp: Grid | undefined, quantities: Grid | undefined): BankLine[] {
  const c = columnsOf(comp);
  const priced = pricedRatings(quantities);
  const input = (key: (typeof BANK_INPUTS)[number]['key']) =>
    c(BANK_INPUTS.find((b) => b.key === key)?.header ?? '');
  const out: BankLine[] = [];
  for (const row of (comp ?? []).slice(1)) {
    const bus = row[0];
    if (typeof bus !== 'string' || bus.trim() === '' || bus === COMP_HEADERS.allBanks) break;
    const total = at(row, c(COMP_HEADERS.total));
    const reactor = at(row, input('reactor_kvar'));
    const chosen = (typeof total === 'number' && total > 0) || (typeof reactor === 'number' && reactor > 0);
    if (!chosen && typeof total !== 'string') continue;
    const typedRating = at(row, input('u_rated_kv'));
    const byDesign = typedRating === undefined && typeof priced.get(bus) === 'number';
    out.push({
      bus,
      u: at(row, c(COMP_HEADERS.u)),
      fixed: at(row, input('fixed_kvar')),
      step: at(row, input('step_kvar')),
      steps: at(row, input('steps')),
      series: at(row, input('series')),
      controllerSteps: at(row, c(COMP_HEADERS.controllerSteps)),
      detuning: at(row, input('p_pct')),
      uRated: byDesign ? priced.get(bus) : typedRating,
      uRatedByDesign: byDesign,
      reactor,
      total,
      tuning: at(row, c(COMP_HEADERS.tune)),
      check: at(row, c(COMP_HEADERS.check)),
    });
  }
  return out;
}

/** The bus blocks of the Quantities sheet end at the first bus line without a bus name. */
function blockCount(q: Grid): number {
  let n = 0;
  for (;;) {
    const name = q[busLineRow(n)]?.[QC.bus];
    if (typeof name !== 'string' || name.trim() === '' || name === SUMMARY_LABELS[0]) return n;
    n++;
  }
}

function money(q: Grid | undefined, caseCount: number): Money | undefined {
  if (!q) return undefined;
  const n = blockCount(q);
  if (n === 0) return undefined;
  const line = (label: (typeof SUMMARY_LABELS)[number]) => q[summaryRowOf(n, label)];
  const saving = (label: (typeof SAVING_LABELS)[number]) => q[savingRowOf(n, caseCount, label)];
  // The layout is the contract; should a sheet not match it, say so rather than read a wrong row.
  if (line('Total')?.[QC.bus] !== 'Total' || saving('Annual saving')?.[QC.bus] !== 'Annual saving')
    return undefined;
  const unpriced: string[] = [];
  const schedule: BusItems[] = [];
  for (let i = 0; i < n; i++) {
    const items: ItemLine[] = [];
    const bus = String(q[busLineRow(i)]?.[QC.bus]);
    const busLine = q[busLineRow(i)];
    if (busLine?.[QC.unpriced] === 1) unpriced.push(`${bus}: ${String(figure(busLine[QC.what]) ?? '')}`);
    for (const slot of SLOTS) {
      const r = q[slotRow(i, slot)];
      const item = figure(r?.[QC.item]);
      if (item !== undefined)
        items.push({
          item,
          what: figure(r?.[QC.what]),
          count: figure(r?.[QC.count]),
          quantity: figure(r?.[QC.quantity]),
          unit: figure(r?.[QC.unit]),
          cost: figure(r?.[QC.cost]),
        });
      if (r?.[QC.unpriced] !== 1) continue;
      unpriced.push(`${bus}: ${String(figure(r[QC.item]) ?? slot)} — ${String(figure(r[QC.cost]) ?? '')}`);
    }
    if (items.length > 0) schedule.push({ bus, items, subtotal: figure(busLine?.[QC.subtotal]) });
  }
  const currency = figure(line('Currency')?.[QC.cost]);
  return {
    currency: typeof currency === 'string' ? currency : '',
    schedule,
    equipment: figure(line('Equipment')?.[QC.cost]),
    total: figure(line('Total')?.[QC.cost]),
    // The fixed part and the steps of a bank are both "capacitor" lines: one reason is enough.
    unpriced: [...new Set(unpriced)],
    saving: figure(saving('Annual saving')?.[QC.cost]),
    payback: figure(saving('Simple payback (years)')?.[QC.cost]),
  };
}

/** A figure as text: a number in the format given, a text as it is, a blank as a dash. */
export function shown(f: Figure, format: string): string {
  if (f === undefined) return '—';
  return typeof f === 'number' ? formatNumber(f, format) : f;
}

const mentionsInvented = (grid: Grid | undefined) =>
  (grid ?? []).some((r) => r.some((v) => typeof v === 'string' && v.includes('INVENTED')));

export function readSummary(values: SheetValues): SummaryData {
  const site = values(SHEETS.settings);
  const buses = values(SHEETS.buses);
  const comp = values(SHEETS.compensation);
  const cases = connectionCases(buses, comp);
  const setting = (key: keyof typeof SETTING_ROWS) => figure(site?.[SETTING_ROWS[key]]?.[VALUE_COL]);
  const name = setting('name');
  const root = buses?.[1]?.[0];
  return {
    site: typeof name === 'string' ? name : '',
    requirement: {
      kind: setting('requirement'),
      cosTarget: setting('cosTarget'),
      tanLag: setting('lagInUse'),
      tanLead: setting('leadInUse'),
    },
    connection: typeof root === 'string' && root.trim() !== '' ? root : undefined,
    cases,
    banks: bankLines(comp, values(SHEETS.quantities)),
    money: money(values(SHEETS.quantities), cases.length),
    bars: new Map([...readChartData(buses, comp).bars].filter(([c]) => cases.some((k) => k.name === c))),
    demoValues: mentionsInvented(values(RATES_SHEET)) || mentionsInvented(values(TARIFF_SHEET)),
  };
}
