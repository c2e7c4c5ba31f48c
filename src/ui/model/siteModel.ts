// The living model: keeps a site workbook's generated cells in step with what the user types.
// After every user step the session asks it what to write so that, in the same undo step:
// - an equipment row that became an item (typed, pasted, filled, inserted) gets its computed
//   columns, and one that stopped being one loses them;
// - every bus sums exactly its rows (BUS.SUM over the runs of its rows on each sheet);
// - when the buses themselves change (a new bus, a renamed one, another feeder, a voltage stated
//   elsewhere) the Buses, Compensation and Design options sheets are written anew, banks (and
//   their cells' marks) staying with their bus.
// Everything it writes is what render.ts writes for the same inputs, so opening the saved
// workbook gives the same sheets.
import type { HyperFormula } from '../../engine/index.ts';
import type { CellContent } from '../../core/workbook/document.ts';
import { busKey } from '../../core/site/busNames.ts';
import { planBusColumns, type BusColumns } from '../../core/workbook/busColumns.ts';
import { busRowIndex, type BusRowIndex, type Run } from '../../core/workbook/busSums.ts';
import {
  compensationInputCols,
  planCompensationColumns,
  type CompensationColumns,
} from '../../core/workbook/compensationColumns.ts';
import type { EquipmentColumns } from '../../core/workbook/equipmentColumns.ts';
import { ownSumCells, renderBusesSheet } from '../../core/workbook/renderBuses.ts';
import { plainInstalledCell, renderCompensationSheet } from '../../core/workbook/renderCompensation.ts';
import { zoneChargingFormula, zoneMatesOf, zoneTopIndex } from '../../core/workbook/zoneCharging.ts';
import { QUANT_COLUMNS } from '../../core/workbook/quantitiesLayout.ts';
import { renderQuantitiesSheet } from '../../core/workbook/renderQuantities.ts';
import { RATES_SHEET, TARIFF_SHEET } from '../../core/quote/index.ts';
import { readOptionInputs, type OptionInputs } from '../../core/workbook/optionInputs.ts';
import {
  isOptionInput,
  optionRowMoves,
  planOptionColumns,
  type OptionColumns,
} from '../../core/workbook/optionsLayout.ts';
import { optionsLeftOut } from '../../core/workbook/render.ts';
import { renderOptionsSheet } from '../../core/workbook/renderOptions.ts';
import { busLookup, computedCells } from '../../core/workbook/renderEquipment.ts';
import {
  equipmentPlans,
  readRowInfo,
  structureOf,
  type RowInfo,
  type WorkbookStructure,
} from '../../core/workbook/structure.ts';
import type { ContentStore } from './contentStore.ts';
import { settingsGenerated, type SettingsInputs } from '../../core/workbook/renderSettings.ts';
import { moveOverrides, moveRendered, sameBuses, type SiteState } from './siteState.ts';
import { optionsFollowBuses } from './optionsAside.ts';

export interface SheetIds {
  readonly site: number;
  readonly equipment: readonly number[];
  readonly buses: number;
  readonly comp: number;
  readonly quant: number;
  readonly opts: number;
}

export type Role =
  | { readonly kind: 'site' }
  | { readonly kind: 'equipment'; readonly index: number }
  | { readonly kind: 'buses' }
  | { readonly kind: 'compensation' }
  | { readonly kind: 'quantities' }
  | { readonly kind: 'options' }
  | { readonly kind: 'user' };

/** One cell write: where and what. */
export interface Write {
  readonly sheet: number;
  readonly row: number;
  readonly col: number;
  readonly content: CellContent;
}

const isFormula = (v: CellContent): v is string => typeof v === 'string' && v.startsWith('=');

export class SiteModel {
  private plansFor:
    | { cases: readonly string[]; plans: EquipmentColumns[]; bus: BusColumns; comp: CompensationColumns }
    | undefined;

  constructor(
    private readonly hf: HyperFormula,
    private readonly contents: ContentStore,
    readonly ids: SheetIds,
    public state: SiteState,
  ) {}

  plans() {
    const cases = this.state.cases;
    if (this.plansFor?.cases !== cases) {
      this.plansFor = {
        cases,
        plans: equipmentPlans(cases),
        bus: planBusColumns(cases),
        comp: planCompensationColumns(cases),
      };
    }
    return this.plansFor;
  }

  role(sheet: number): Role {
    if (sheet === this.ids.site) return { kind: 'site' };
    if (sheet === this.ids.buses) return { kind: 'buses' };
    if (sheet === this.ids.comp) return { kind: 'compensation' };
    if (sheet === this.ids.quant) return { kind: 'quantities' };
    if (sheet === this.ids.opts) return { kind: 'options' };
    const index = this.ids.equipment.indexOf(sheet);
    return index >= 0 ? { kind: 'equipment', index } : { kind: 'user' };
  }

  /** Is (row, col) a place Kvar Ledger writes (a header, a computed cell, a derived sheet's table)? */
  isGenerated(sheet: number, row: number, col: number): boolean {
    const role = this.role(sheet);
    const { plans, bus, comp } = this.plans();
    switch (role.kind) {
      case 'equipment': {
        const cols = plans[role.index] as EquipmentColumns;
        if (row === 0) return col < cols.columns.length;
        return (
          col >= cols.firstComputed &&
          col < cols.columns.length &&
          (this.state.rows[role.index]?.[row - 1]?.present ?? false)
        );
      }
      case 'buses':
        return row < this.state.extent.buses && col < bus.columns.length;
      case 'compensation': {
        if (row >= this.state.extent.comp || col >= comp.columns.length) return false;
        const n = this.state.rendered.buses.length;
        if (row === 0 || row > n) return row !== n + 1; // header, summary (the blank row between is free)
        return !compensationInputCols(comp).includes(col);
      }
      case 'quantities':
        return row < this.state.extent.quant && col < QUANT_COLUMNS.length;
      case 'options': {
        const cols = this.optionColumns();
        if (row >= this.state.extent.opts || col >= cols.columns.length) return false;
        const s = this.state.rendered;
        return !isOptionInput(cols, s.buses.length, s.cases.length, this.state.optionsCompact, row, col);
      }
      default:
        return false;
    }
  }

  isOverride(sheet: number, row: number, col: number): boolean {
    return this.state.overrides.get(sheet)?.has(`${row},${col}`) ?? false;
  }

  setOverride(sheet: number, row: number, col: number, on: boolean): void {
    const set = new Set(this.state.overrides.get(sheet) ?? []);
    if (on) set.add(`${row},${col}`);
    else set.delete(`${row},${col}`);
    const overrides = new Map(this.state.overrides);
    overrides.set(sheet, set);
    this.state = { ...this.state, overrides };
  }

  /** What Kvar Ledger writes at (row, col) of a built-in sheet now (null where it writes nothing). */
  generatedContent(sheet: number, row: number, col: number, settings: SettingsInputs): CellContent {
    const role = this.role(sheet);
    const { plans, bus, comp } = this.plans();
    const s = this.state.rendered;
    if (role.kind === 'equipment') {
      const cols = plans[role.index] as EquipmentColumns;
      if (row === 0) return cols.columns[col]?.header ?? null;
      const info = this.state.rows[role.index]?.[row - 1];
      if (!info?.present) return null;
      const lookup = busLookup(bus.s, bus.sAfter, (name) => {
        const i = s.busIndex.get(busKey(name));
        return i === undefined ? undefined : i + 1;
      });
      return new Map(computedCells(cols, row, info, s.cases, lookup)).get(col) ?? null;
    }
    const busRows = busRowIndex(s);
    if (role.kind === 'buses')
      return renderBusesSheet({ s, cols: bus, comp, flavour: 'live', busRows })[row]?.[col] ?? null;
    if (role.kind === 'compensation') {
      const grid = renderCompensationSheet({
        s,
        cols: comp,
        busCols: bus,
        flavour: 'live',
        busRows,
        inputs: this.bankInputs(new Map()),
      });
      return grid[row]?.[col] ?? null;
    }
    if (role.kind === 'quantities') return this.quantitiesGrid(s)[row]?.[col] ?? null;
    if (role.kind === 'options') return this.optionsGrid(s).cells[row]?.[col] ?? null;
    if (role.kind === 'site')
      return settingsGenerated(settings).find(([r, c]) => r === row && c === col)?.[2] ?? null;
    return null;
  }

  /** A cell's value as the structure reads it: typed content, or a formula's result. */
  private valueAt(sheet: number, row: number, col: number): CellContent {
    const typed = this.contents.cell(sheet, row, col);
    if (!isFormula(typed)) return typed;
    // The session holds evaluation during a step; a typed formula's result is needed now.
    if (this.hf.isEvaluationSuspended()) {
      this.hf.resumeEvaluation();
      this.hf.suspendEvaluation();
    }
    const v = this.hf.getCellValue({ sheet, row, col });
    return typeof v === 'number' || typeof v === 'string' || typeof v === 'boolean' ? v : null;
  }

  private structure(rows: readonly (readonly RowInfo[])[]): WorkbookStructure {
    return structureOf(this.state.cases, rows);
  }

  /**
   * After cells of equipment sheets were written (already in the engine and the contents): what
   * to write so the rows and the buses follow. `touched`: per sheet index, the cell rows written.
   */
  afterEquipmentWrites(
    touched: ReadonlyMap<number, ReadonlySet<number>>,
    renamed: ReadonlyMap<string, string> = new Map(),
  ): Write[] {
    const { plans } = this.plans();
    const rows = this.state.rows.map((r) => [...r]);
    const changedRows: Array<{ index: number; row: number; before: RowInfo; after: RowInfo }> = [];
    for (const [index, set] of touched) {
      const cols = plans[index] as EquipmentColumns;
      const sheet = this.ids.equipment[index] as number;
      const list = rows[index] as RowInfo[];
      for (const r of set) {
        if (r === 0) continue;
        const line = this.contents.get(sheet)[r] ?? [];
        const after = readRowInfo(line, cols, (c) => this.valueAt(sheet, r, c));
        const before = list[r - 1] ?? {
          present: false,
          kind: undefined,
          tag: '',
          bus: '',
          toBus: '',
          u: undefined,
        };
        while (list.length < r)
          list.push({ present: false, kind: undefined, tag: '', bus: '', toBus: '', u: undefined });
        list[r - 1] = after;
        if (
          before.present !== after.present ||
          before.kind !== after.kind ||
          before.bus !== after.bus ||
          before.toBus !== after.toBus ||
          before.u !== after.u ||
          before.tag !== after.tag
        ) {
          changedRows.push({ index, row: r, before, after });
        }
      }
      while (list.length > 0 && !(list[list.length - 1] as RowInfo).present) list.pop();
    }
    if (changedRows.length === 0) return [];
    return this.follow(
      rows,
      changedRows.map((c) => ({
        index: c.index,
        row: c.row,
        buses: [c.before.bus, c.after.bus],
        rewrite: rowNeedsRewrite(c.before, c.after),
      })),
      renamed,
    );
  }

  /** After rows were inserted (count > 0) or removed (count < 0) on an equipment sheet. */
  afterEquipmentRows(index: number, at: number, count: number): Write[] {
    const sheet = this.ids.equipment[index] as number;
    const rows = this.state.rows.map((r) => [...r]);
    const list = rows[index] as RowInfo[];
    const removedBuses: string[] = [];
    const widened = new Set(this.state.widened);
    if (count > 0) {
      // Rows inserted between two rows of one bus land inside the range its sums read.
      const [above, below] = [list[at - 2], list[at - 1]];
      if (above?.present && below?.present && above.bus !== '' && busKey(above.bus) === busKey(below.bus))
        widened.add(busKey(above.bus));
      if (at - 1 < list.length)
        list.splice(
          at - 1,
          0,
          ...Array.from({ length: count }, () => ({
            present: false,
            kind: undefined,
            tag: '',
            bus: '',
            toBus: '',
            u: undefined,
          })),
        );
    } else {
      for (const r of list.splice(at - 1, -count)) if (r.present) removedBuses.push(r.bus);
    }
    while (list.length > 0 && !(list[list.length - 1] as RowInfo).present) list.pop();
    const overrides = new Map(this.state.overrides);
    overrides.set(sheet, moveOverrides(this.state.overrides.get(sheet), at, count));
    this.state = { ...this.state, rendered: moveRendered(this.state.rendered, index, at, count), overrides };
    // Blank rows inserted leave every item's order, and so the buses, as they were: the moved
    // structure above is what a new pass would find, without one over every row of the site.
    if (count > 0) {
      this.state = { ...this.state, rows, ...(widened.size > 0 ? { widened } : {}) };
      return [];
    }
    return this.follow(
      rows,
      removedBuses.length > 0 ? [{ index, row: -1, buses: removedBuses, rewrite: false }] : [],
    );
  }

  /** The writes that bring the generated cells in line with `rows`; the state then holds them. */
  private follow(
    rows: readonly (readonly RowInfo[])[],
    changed: ReadonlyArray<{ index: number; row: number; buses: readonly string[]; rewrite: boolean }>,
    renamed: ReadonlyMap<string, string> = new Map(),
  ): Write[] {
    const next = this.structure(rows);
    const writes: Write[] = [];
    if (!sameBuses(next, this.state.rendered)) {
      append(writes, this.writeDerived(next, renamed));
      for (const s of next.sheets) {
        if (s.cols.role !== 'branch') continue;
        s.rows.forEach((info, i) => {
          if (info.present) writes.push(...this.rowWrites(next, s.index, i + 1, info));
        });
      }
      for (const c of changed)
        if (c.rewrite && next.sheets[c.index]?.cols.role !== 'branch')
          writes.push(...this.rowWrites(next, c.index, c.row, rows[c.index]?.[c.row - 1]));
      this.state = { ...this.state, rows, rendered: next, widened: undefined };
      return writes;
    }
    for (const c of changed)
      if (c.rewrite) writes.push(...this.rowWrites(next, c.index, c.row, rows[c.index]?.[c.row - 1]));
    const widened = this.state.widened ?? new Set<string>();
    const keysOf = (list: typeof changed) =>
      new Set([
        ...list
          .flatMap((c) => c.buses)
          .filter((b) => b !== '')
          .map(busKey),
        ...widened,
      ]);
    // Only rows of sheets that carry charging (cables, lines, feeders) move a zone's charging.
    const charging = keysOf(changed.filter((c) => carriesCharging(next.sheets[c.index]?.cols)));
    const busRows = busRowIndex(next);
    writes.push(...this.sumWrites(next, keysOf(changed), charging, busRows, runsSeen.get(this.state.rows)));
    runsSeen.set(rows, busRows);
    this.state = { ...this.state, rows, widened: undefined };
    return writes;
  }

  /** Computed cells of one row (cleared when it is not an item), overrides left alone. */
  private rowWrites(s: WorkbookStructure, index: number, row: number, info: RowInfo | undefined): Write[] {
    const { plans, bus } = this.plans();
    const cols = plans[index] as EquipmentColumns;
    const sheet = this.ids.equipment[index] as number;
    const lookup = busLookup(bus.s, bus.sAfter, (name) => {
      const i = s.busIndex.get(busKey(name));
      return i === undefined ? undefined : i + 1;
    });
    const generated = new Map(info?.present ? computedCells(cols, row, info, s.cases, lookup) : []);
    const out: Write[] = [];
    for (let c = cols.firstComputed; c < cols.columns.length; c++) {
      if (this.isOverride(sheet, row, c)) continue;
      out.push({ sheet, row, col: c, content: generated.get(c) ?? null });
    }
    return out;
  }

  /**
   * The own-item sums of the buses named, where the engine's formula differs from the one wanted;
   * the zone charging of the buses sharing a zone with `charging`. `before`: the runs of rows the
   * engine's sums were written for, when known: a bus whose runs changed is written without
   * reading its formulas back (a paste over every bus changes them all).
   */
  private sumWrites(
    s: WorkbookStructure,
    keys: ReadonlySet<string>,
    charging: ReadonlySet<string>,
    busRows: BusRowIndex,
    before: BusRowIndex | undefined,
  ): Write[] {
    if (keys.size === 0) return [];
    const { bus, comp } = this.plans();
    const input = { s, cols: bus, comp, flavour: 'live' as const, busRows };
    const out: Write[] = [];
    const want = (sheet: number, row: number, col: number, formula: string, moved: boolean) => {
      if (this.isOverride(sheet, row, col)) return;
      if (!moved) {
        const have = this.hf.getCellFormula({ sheet, row, col });
        if (have !== undefined && squash(have) === squash(formula)) return;
      }
      out.push({ sheet, row, col, content: formula });
    };
    for (const key of keys) {
      const i = s.busIndex.get(key);
      if (i === undefined) continue;
      const moved = before !== undefined && !sameRuns(before.get(key), busRows.get(key));
      for (const [col, f] of ownSumCells(input, i)) want(this.ids.buses, i + 1, col, f, moved);
      want(
        this.ids.comp,
        i + 1,
        comp.plainInstalled,
        plainInstalledCell({ ...input, cols: comp, busCols: bus, inputs: new Map() }, i),
        false,
      );
    }
    // A cable added or removed on a bus changes the charging of every bus in its zone.
    if (charging.size === 0) return out;
    const tops = zoneTopIndex(s);
    for (const j of zoneMatesOf(s, tops, charging))
      want(this.ids.comp, j + 1, comp.zoneCharging, zoneChargingFormula(s, busRows, 'live', tops, j), false);
    return out;
  }

  /** The Buses and Compensation sheets written anew for a structure, banks kept with their bus. */
  private writeDerived(s: WorkbookStructure, renamed: ReadonlyMap<string, string>): Write[] {
    const { bus, comp } = this.plans();
    this.noteCompensationMoves(s, renamed);
    const busRows = busRowIndex(s);
    const inputs = this.bankInputs(renamed);
    // A bus that goes away keeps its bank inputs aside; one that comes back gets them again.
    const retired = new Map(this.state.retired);
    for (const [key, values] of inputs) {
      if (!s.busIndex.has(key)) {
        retired.set(key, values);
        inputs.delete(key);
      }
    }
    for (const b of s.buses) {
      const back = retired.get(b.key);
      if (back && !inputs.has(b.key)) inputs.set(b.key, new Map(back));
      retired.delete(b.key);
    }
    this.state = { ...this.state, retired };
    const buses = renderBusesSheet({ s, cols: bus, comp, flavour: 'live', busRows });
    const compGrid = renderCompensationSheet({
      s,
      cols: comp,
      busCols: bus,
      flavour: 'live',
      busRows,
      inputs,
    });
    const quant = this.quantitiesGrid(s);
    const out = [
      ...this.gridWrites(this.ids.buses, buses, this.state.extent.buses, bus.columns.length),
      ...this.gridWrites(this.ids.comp, compGrid, this.state.extent.comp, comp.columns.length),
      ...this.gridWrites(this.ids.quant, quant, this.state.extent.quant, QUANT_COLUMNS.length),
    ];
    this.state = {
      ...this.state,
      extent: { ...this.state.extent, buses: buses.length, comp: compGrid.length, quant: quant.length },
    };
    append(out, this.optionsWrites(s, undefined, renamed));
    return out;
  }

  /**
   * Rows of the derived sheets whose bus moved with the last rewrite, per sheet id: old row → new
   * row, undefined when gone (the Compensation sheet's rows, the Design options sheet's lines).
   */
  private rowMoves = new Map<number, ReadonlyMap<number, number | undefined>>();

  private noteRowMoves(sheet: number, moves: ReadonlyMap<number, number | undefined>): void {
    if (moves.size > 0) this.rowMoves.set(sheet, moves);
    else this.rowMoves.delete(sheet);
  }

  private noteCompensationMoves(s: WorkbookStructure, renamed: ReadonlyMap<string, string>): void {
    const moves = new Map<number, number | undefined>();
    this.state.rendered.buses.forEach((b, i) => {
      const to = s.busIndex.get(renamed.get(b.key) ?? b.key);
      const row = to === undefined ? undefined : to + 1;
      if (row !== i + 1) moves.set(i + 1, row);
    });
    this.noteRowMoves(this.ids.comp, moves);
  }

  /**
   * Where the derived sheets' rows went when the buses last changed, once, per sheet id: cell
   * marks there (assumed, proposed) follow their bus with it, as the bank inputs do.
   */
  takeRowMoves(): ReadonlyMap<number, ReadonlyMap<number, number | undefined>> {
    const moves = this.rowMoves;
    this.rowMoves = new Map();
    return moves;
  }

  /** The Quantities and cost and Design options sheets written anew (a Rates or Tariff sheet came or went). */
  quantitiesWrites(going?: string): Write[] {
    const grid = this.quantitiesGrid(this.state.rendered, going);
    const out = this.gridWrites(this.ids.quant, grid, this.state.extent.quant, QUANT_COLUMNS.length);
    this.state = { ...this.state, extent: { ...this.state.extent, quant: grid.length } };
    append(out, this.optionsWrites(this.state.rendered, going));
    return out;
  }

  /**
   * The Design options sheet written anew for a structure, each option's inputs kept with its
   * block and bus (read from the sheet as it is, by block label and bus name; `renamed`: buses
   * renamed since, old key → new key); those of a bus gone kept aside until it returns
   * (optionsAside.ts).
   */
  private optionsWrites(
    s: WorkbookStructure,
    going?: string,
    renamed: ReadonlyMap<string, string> = new Map(),
  ): Write[] {
    const follow = optionsFollowBuses(
      this.typedOptions(),
      (key) => s.busIndex.has(key),
      this.state.retiredOptions,
      renamed,
    );
    const { cells, compact } = this.optionsGrid(s, going, follow.typed);
    const was = this.state.rendered;
    this.noteRowMoves(
      this.ids.opts,
      optionRowMoves(
        { busCount: was.buses.length, cases: was.cases.length, compact: this.state.optionsCompact },
        { busCount: s.buses.length, cases: s.cases.length, compact },
        was.buses.map((b) => s.busIndex.get(renamed.get(b.key) ?? b.key)),
      ),
    );
    // The whole block in one write (one engine entry while a step holds evaluation).
    const out = this.gridWrites(
      this.ids.opts,
      cells,
      this.state.extent.opts,
      this.optionColumns().columns.length,
    );
    this.state = {
      ...this.state,
      extent: { ...this.state.extent, opts: cells.length },
      optionsCompact: compact,
      retiredOptions: follow.retired,
    };
    return out;
  }

  private optionColumns(): OptionColumns {
    const cases = this.state.cases;
    if (this.optionColsFor?.cases !== cases) this.optionColsFor = { cases, cols: planOptionColumns(cases) };
    return this.optionColsFor.cols;
  }

  private optionColsFor: { cases: readonly string[]; cols: OptionColumns } | undefined;

  /** The options as typed on the sheet now, block by block. */
  private typedOptions(): OptionInputs[] {
    return readOptionInputs({ cells: this.contents.get(this.ids.opts) }, this.optionColumns());
  }

  private optionsGrid(s: WorkbookStructure, going?: string, typed = this.typedOptions()) {
    const has = (name: string) =>
      this.hf.getSheetId(name) !== undefined && name.toLowerCase() !== going?.toLowerCase();
    const cols = this.optionColumns();
    const rows = this.state.rows.reduce((n, list) => n + list.filter((r) => r.present).length, 0);
    const leftOut = optionsLeftOut(rows, s);
    const { cells } = renderOptionsSheet({
      s,
      cols,
      busCols: this.plans().bus,
      comp: this.plans().comp,
      hasRates: has(RATES_SHEET),
      hasTariff: has(TARIFF_SHEET),
      typed,
      ...(leftOut !== undefined ? { leftOut } : {}),
    });
    return { cells, compact: leftOut !== undefined };
  }

  /** The "Quantities and cost" sheet for a structure (its rates from the Rates sheet, when there is one). */
  private quantitiesGrid(s: WorkbookStructure, going?: string) {
    const has = (name: string) =>
      this.hf.getSheetId(name) !== undefined && name.toLowerCase() !== going?.toLowerCase();
    return renderQuantitiesSheet({
      s,
      comp: this.plans().comp,
      hasRates: has(RATES_SHEET),
      hasTariff: has(TARIFF_SHEET),
    });
  }

  /** Bank inputs per bus as the Compensation sheet holds them now (by the bus on each row). */
  private bankInputs(renamed: ReadonlyMap<string, string>): Map<string, Map<number, CellContent>> {
    const { comp } = this.plans();
    const out = new Map<string, Map<number, CellContent>>();
    const rows = this.contents.get(this.ids.comp);
    this.state.rendered.buses.forEach((b, i) => {
      const line = rows[i + 1] ?? [];
      const values = new Map<number, CellContent>();
      for (const c of compensationInputCols(comp)) {
        const v = line[c] ?? null;
        if (v !== null) values.set(c, v);
      }
      if (values.size > 0) out.set(renamed.get(b.key) ?? b.key, values);
    });
    return out;
  }

  /** A generated block over `rows` rows: new cells, and the old block's leftovers cleared. */
  private gridWrites(
    sheet: number,
    grid: readonly (readonly CellContent[])[],
    oldRows: number,
    width: number,
  ): Write[] {
    const out: Write[] = [];
    for (let r = 0; r < Math.max(grid.length, oldRows); r++) {
      for (let c = 0; c < width; c++) {
        if (this.isOverride(sheet, r, c)) continue;
        out.push({ sheet, row: r, col: c, content: grid[r]?.[c] ?? null });
      }
    }
    return out;
  }
}

/**
 * Writes added to a list one by one: the derived sheets' writes run to 100,000 and more (the
 * Design options sheet alone), beyond what a spread into push() passes as arguments.
 */
function append(to: Write[], more: readonly Write[]): void {
  for (const w of more) to.push(w);
}

/** A row's computed cells change with whether it is an item, its kind and (a branch) the bus it feeds. */
function rowNeedsRewrite(a: RowInfo, b: RowInfo): boolean {
  return a.present !== b.present || a.kind !== b.kind || a.toBus !== b.toBus;
}

/**
 * The runs of rows each bus's sums were last written for, per rows list of the state (the state
 * is replaced, never changed in place, so a list in hand names one version of the rows).
 */
const runsSeen = new WeakMap<object, BusRowIndex>();

type BusRuns = ReadonlyMap<number, readonly Run[]>;

/** Same runs of rows on every sheet (both known). */
function sameRuns(a: BusRuns | undefined, b: BusRuns | undefined): boolean {
  if (a === undefined || b === undefined) return a === b;
  if (a.size !== b.size) return false;
  for (const [sheet, runs] of a) {
    const other = b.get(sheet);
    if (!other || other.length !== runs.length) return false;
    for (let k = 0; k < runs.length; k++)
      if (runs[k]?.first !== other[k]?.first || runs[k]?.last !== other[k]?.last) return false;
  }
  return true;
}

/** A sheet whose rows deliver charging: cables (a shunt sheet of charging kinds), lines, feeders. */
function carriesCharging(cols: EquipmentColumns | undefined): boolean {
  if (!cols) return false;
  if (cols.role === 'branch') return true;
  return cols.kinds.some((kind) => kind.traits?.charging);
}

/** Formula text compared without spaces and letter case (the engine prints its own way). */
function squash(f: string): string {
  return f.replace(/\s+/g, '').toUpperCase();
}
