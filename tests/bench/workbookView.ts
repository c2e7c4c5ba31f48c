// Where the bench reads and writes in a built workbook: the point of connection's P and Q on
// the Buses sheet (its first data row), and the motors' load cells on the Motors sheet. Edits
// are logged so the same edits can be applied to the site and checked against the floor.
import type { HyperFormula } from 'hyperformula';
import type { Site } from '../../src/core/site/model.ts';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { HEADERS, SHEETS } from '../../src/core/workbook/layout.ts';
import { planBusColumns } from '../../src/core/workbook/busColumns.ts';

/** P and Q of the point of connection, one entry per case. */
export interface RootTotals {
  readonly bus: string;
  readonly p: readonly number[];
  readonly q: readonly number[];
}

export interface BusesView {
  readonly sheet: number;
  readonly pCols: readonly number[];
  readonly qCols: readonly number[];
}

function sheetDoc(doc: WorkbookDoc, name: string) {
  const s = doc.sheets.find((x) => x.name === name);
  if (!s)
    throw new Error(
      `the workbook has no sheet "${name}"; sheets: ${doc.sheets.map((x) => x.name).join(', ')}`,
    );
  return s;
}

export function busesView(hf: HyperFormula, cases: readonly string[]): BusesView {
  const sheet = hf.getSheetId(SHEETS.buses);
  if (sheet === undefined) throw new Error(`the engine has no sheet "${SHEETS.buses}"`);
  const cols = planBusColumns(cases);
  return { sheet, pCols: cols.p, qCols: cols.q };
}

const num = (v: unknown): number => (typeof v === 'number' ? v : Number.NaN);

/** Root P of the first case only: what an edit needs to have recomputed. */
export function readRootP(hf: HyperFormula, v: BusesView): number {
  return num(hf.getCellValue({ sheet: v.sheet, row: 1, col: v.pCols[0] as number }));
}

export function readRoot(hf: HyperFormula, v: BusesView): RootTotals {
  const at = (col: number) => num(hf.getCellValue({ sheet: v.sheet, row: 1, col }));
  return {
    bus: String(hf.getCellValue({ sheet: v.sheet, row: 1, col: 0 })),
    p: v.pCols.map(at),
    q: v.qCols.map(at),
  };
}

/** The Motors sheet's load cells of the first case, and a log of the values written there (by motor tag). */
export class MotorEdits {
  readonly sheetName = SHEETS.motors;
  readonly col: number;
  /** Data rows of the sheet (cells rows 1 … count). */
  readonly count: number;
  /** Tag of each data row (index 0 = cells row 1): the builder may order rows its own way. */
  private readonly tags: readonly string[];
  private readonly log = new Map<string, number>();
  private readonly copies: string[] = [];

  constructor(
    doc: WorkbookDoc,
    private readonly site: Site,
  ) {
    const sheet = sheetDoc(doc, SHEETS.motors);
    const header = sheet.cells[0] ?? [];
    const caseName = site.settings.cases[0] as string;
    this.col = header.indexOf(HEADERS.loadCase(caseName));
    if (this.col < 0) throw new Error(`the Motors sheet has no column "${HEADERS.loadCase(caseName)}"`);
    const tagCol = header.indexOf('Tag');
    if (tagCol < 0) throw new Error('the Motors sheet has no column "Tag"');
    this.tags = sheet.cells.slice(1).map((r) => String(r[tagCol] ?? ''));
    this.count = this.tags.length;
    const motors = new Set(site.equipment.filter((r) => r.kind === 'motor').map((r) => r.tag));
    if (this.count !== motors.size || this.count === 0 || !this.tags.every((t) => motors.has(t))) {
      throw new Error(`the Motors sheet's ${this.count} rows are not the site's ${motors.size} motors`);
    }
  }

  /** The k-th edit of a run: a spread of rows and load factors in 0.30 … 0.89. */
  row(k: number): number {
    return 1 + ((k * 7919) % this.count);
  }
  value(k: number): number {
    return 0.3 + ((k * 37) % 60) / 100;
  }

  write(hf: HyperFormula, sheet: number, k: number): void {
    const row = this.row(k);
    const value = this.value(k);
    hf.setCellContents({ sheet, row, col: this.col }, value);
    this.record(row, value);
  }

  /** Log an edit made elsewhere (in the page): data row `row` (1-based) now holds `value`. */
  record(row: number, value: number): void {
    const tag = this.tags[row - 1];
    if (tag === undefined) throw new Error(`the Motors sheet has no data row ${row}`);
    this.log.set(tag, value);
  }

  /** Log a copy of data row `row`'s motor put into a row inserted below it (Fill down). */
  duplicate(row: number): void {
    const tag = this.tags[row - 1];
    if (tag === undefined) throw new Error(`the Motors sheet has no data row ${row}`);
    this.copies.push(tag);
  }

  /** The site with every logged edit applied (the first case's load factor of those motors), copies added. */
  editedSite(): Site {
    const caseName = this.site.settings.cases[0] as string;
    const edited = (r: Site['equipment'][number]) => {
      const v = r.kind === 'motor' ? this.log.get(r.tag) : undefined;
      return v === undefined ? r : { ...r, loads: { ...r.loads, [caseName]: v } };
    };
    const equipment = this.site.equipment.map(edited);
    const copies = this.copies.map((tag) => equipment.find((r) => r.kind === 'motor' && r.tag === tag));
    return { ...this.site, equipment: [...equipment, ...copies.filter((r) => r !== undefined)] };
  }
}
