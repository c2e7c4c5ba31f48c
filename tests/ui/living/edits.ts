// Random edits an estimator makes, applied through the page's own model (the session), as the
// grid would: typing, inserting (and typing into the rows inserted), deleting, pasting, filling, moving items between buses, banks
// typed on the Compensation sheet (steps, step series, detuning, capacitor rating), a line's resistance or a feeder
// cable's resistance or reactance typed or cleared, a motor's or load's supply typed or cleared, rates and tariff values
// typed or cleared on the Rates and Tariff sheets, the rated power the requirement refers to, renaming a bus, adding or renaming a case, sorting rows, undo and redo.
// Each edit picks its target from the workbook as it is when it runs.
import fc from 'fast-check';
import type { CellContent } from '../../../src/core/workbook/document.ts';
import { equipmentPlans } from '../../../src/core/workbook/structure.ts';
import { planCompensationColumns } from '../../../src/core/workbook/compensationColumns.ts';
import { blockOrigin, planOptionColumns } from '../../../src/core/workbook/optionsLayout.ts';
import { busLineRow } from '../../../src/core/workbook/quantitiesLayout.ts';
import { RATES_SHEET, TARIFF_SHEET } from '../../../src/core/quote/index.ts';
import { FIRST_CASE_ROW, SETTING_ROWS } from '../../../src/core/workbook/settingsLayout.ts';
import type { WorkbookSession } from '../../../src/ui/model/session.ts';
import { LOAD_SUPPLY_TEXTS, MOTOR_SUPPLY_TEXTS } from './siteArb.ts';

export type Edit =
  | { op: 'value'; sheet: number; row: number; field: 'p_kw' | 'cos_phi' | 'qty' | 'load'; value: number }
  | { op: 'moveBus'; sheet: number; row: number; bus: number }
  | { op: 'type'; sheet: number; bus: number; p: number; cos: number }
  | { op: 'insert'; sheet: number; at: number; count: number }
  | { op: 'insertTyped'; sheet: number; at: number; count: number; bus: number; p: number }
  | { op: 'remove'; sheet: number; row: number }
  | { op: 'paste'; sheet: number; n: number; bus: number; p: number }
  | { op: 'fill'; sheet: number; row: number; n: number }
  | { op: 'clear'; sheet: number; row: number }
  | { op: 'bank'; bus: number; step: number; steps: number; fixed: number; series: string | null }
  | { op: 'design'; bus: number; p: number; urFactor: number | null }
  | { op: 'detuneAlone'; bus: number; p: number }
  | {
      op: 'optionBank';
      option: number;
      bus: number;
      step: number | null;
      steps: number;
      p: number;
      reactor: number;
    }
  | {
      op: 'resistance';
      on: 'lines' | 'feeders';
      column: 'r_ohm_km' | 'x_ohm_km';
      row: number;
      value: number | null;
    }
  | { op: 'supply'; sheet: number; row: number; text: string | null }
  | { op: 'rate'; row: number; value: number | null }
  | { op: 'tariff'; row: number; value: number | null }
  | { op: 'ratedPower'; value: number | null }
  | { op: 'rename'; bus: number; suffix: number }
  | { op: 'case'; rename: boolean; suffix: number }
  | { op: 'sort'; sheet: number; by: 'tag' | 'bus' | 'p_kw' | 'computed'; descending: boolean }
  | { op: 'undo' }
  | { op: 'redo' };

// Motors and Loads: the sheets whose rows are typed most (indexes in sheet order).
const SHUNT_SHEETS = [0, 1];
const num = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

export const editArb: fc.Arbitrary<Edit> = fc.oneof(
  fc.record({
    op: fc.constant('value' as const),
    sheet: fc.constantFrom(...SHUNT_SHEETS),
    row: fc.nat(),
    field: fc.constantFrom('p_kw' as const, 'cos_phi' as const, 'qty' as const, 'load' as const),
    value: num(0, 1),
  }),
  fc.record({
    op: fc.constant('moveBus' as const),
    sheet: fc.constantFrom(...SHUNT_SHEETS),
    row: fc.nat(),
    bus: fc.nat(),
  }),
  fc.record({
    op: fc.constant('type' as const),
    sheet: fc.constantFrom(...SHUNT_SHEETS),
    bus: fc.nat(),
    p: num(1, 300),
    cos: num(0.7, 0.95),
  }),
  fc.record({
    op: fc.constant('insert' as const),
    sheet: fc.integer({ min: 0, max: 7 }),
    at: fc.nat(),
    count: fc.integer({ min: 1, max: 3 }),
  }),
  fc.record({
    // Rows inserted just below an item (often inside its bus's run of rows) and a row typed
    // into the last of them, on any bus: the engine widens the run's range over inserted rows.
    op: fc.constant('insertTyped' as const),
    sheet: fc.constantFrom(...SHUNT_SHEETS),
    at: fc.nat(),
    count: fc.integer({ min: 1, max: 3 }),
    bus: fc.nat(),
    p: num(1, 300),
  }),
  fc.record({
    op: fc.constant('remove' as const),
    // Cables and Capacitors and reactors (removing a branch would cut its bus off).
    sheet: fc.constantFrom(...SHUNT_SHEETS, 5, 7),
    row: fc.nat(),
  }),
  fc.record({
    op: fc.constant('paste' as const),
    sheet: fc.constantFrom(...SHUNT_SHEETS),
    n: fc.integer({ min: 1, max: 5 }),
    bus: fc.nat(),
    p: num(1, 200),
  }),
  fc.record({
    op: fc.constant('fill' as const),
    sheet: fc.constantFrom(...SHUNT_SHEETS),
    row: fc.nat(),
    n: fc.integer({ min: 1, max: 4 }),
  }),
  fc.record({ op: fc.constant('clear' as const), sheet: fc.constantFrom(...SHUNT_SHEETS), row: fc.nat() }),
  fc.record({
    // A bank typed into a design option's block (Design options sheet); a blank step clears it.
    op: fc.constant('optionBank' as const),
    option: fc.nat(3),
    bus: fc.nat(),
    step: fc.option(num(5, 100), { nil: null }),
    steps: fc.integer({ min: 0, max: 6 }),
    p: fc.constantFrom(0, 5.67, 7, 14),
    reactor: fc.constantFrom(0, 0, 50),
  }),
  fc.record({
    op: fc.constant('bank' as const),
    bus: fc.nat(),
    step: num(5, 100),
    steps: fc.integer({ min: 0, max: 6 }),
    fixed: num(0, 30),
    // Typed as an estimator would, without an apostrophe: the page keeps it as text.
    series: fc.constantFrom(null, '1:1:1', '1:2:2', '1:2:4'),
  }),
  fc.record({
    op: fc.constant('design' as const),
    bus: fc.nat(),
    p: fc.constantFrom(0, 5.67, 7, 14),
    urFactor: fc.option(fc.constantFrom(1.05, 1.1, 1.2), { nil: null }),
  }),
  // A detuning typed alone: the row's sizes and reactor cleared, only p (%) left on it.
  fc.record({
    op: fc.constant('detuneAlone' as const),
    bus: fc.nat(),
    p: fc.constantFrom(5.67, 7, 14),
  }),
  fc.record({
    op: fc.constant('supply' as const),
    sheet: fc.constantFrom(...SHUNT_SHEETS),
    row: fc.nat(),
    // Motors' and loads' spellings on either sheet: the other sheet's words are refused there.
    text: fc.option(fc.constantFrom(...MOTOR_SUPPLY_TEXTS, ...LOAD_SUPPLY_TEXTS), { nil: null, freq: 4 }),
  }),
  fc
    .record({
      // A line's R, a feeder cable's R or X (a line's X comes from its inductance).
      target: fc.constantFrom(
        ['lines', 'r_ohm_km'] as const,
        ['feeders', 'r_ohm_km'] as const,
        ['feeders', 'x_ohm_km'] as const,
      ),
      row: fc.nat(),
      value: fc.option(num(0.01, 2), { nil: null, freq: 4 }),
    })
    .map(({ target, row, value }) => ({
      op: 'resistance' as const,
      on: target[0],
      column: target[1],
      row,
      value,
    })),
  fc.record({
    op: fc.constant('rate' as const),
    row: fc.nat(),
    value: fc.option(num(0, 100), { nil: null, freq: 4 }),
  }),
  fc.record({
    op: fc.constant('tariff' as const),
    row: fc.nat(),
    value: fc.option(num(0, 5000), { nil: null, freq: 4 }),
  }),
  fc.record({
    op: fc.constant('ratedPower' as const),
    value: fc.option(num(50, 50_000), { nil: null, freq: 3 }),
  }),
  fc.record({ op: fc.constant('rename' as const), bus: fc.nat(), suffix: fc.nat(99) }),
  fc.record({ op: fc.constant('case' as const), rename: fc.boolean(), suffix: fc.nat(99) }),
  fc.record({
    op: fc.constant('sort' as const),
    sheet: fc.integer({ min: 0, max: 7 }),
    by: fc.constantFrom('tag' as const, 'bus' as const, 'p_kw' as const, 'computed' as const),
    descending: fc.boolean(),
  }),
  fc.constant({ op: 'undo' as const }),
  fc.constant({ op: 'redo' as const }),
);

let tags = 0;

/** Apply an edit; returns a short description for a failure report. */
export function applyEdit(s: WorkbookSession, e: Edit): string {
  const model = s.site;
  if (!model) throw new Error('not a site workbook');
  const cases = model.state.cases;
  const plans = equipmentPlans(cases);
  const buses = model.state.rendered.buses.map((b) => b.name);
  // With every row cleared there is no bus left to pick: a new one, as a user would type.
  const pickBus = (k: number) => buses[k % buses.length] ?? `B${k % 3}`;
  const sheetId = (i: number) => model.ids.equipment[i] as number;
  const present = (i: number) =>
    (model.state.rows[i] ?? []).map((r, k) => ({ r, row: k + 1 })).filter((x) => x.r.present);
  const col = (i: number, key: string) => plans[i]?.input.get(key) as number;
  const pickRow = (i: number, k: number) => {
    const list = present(i);
    return list.length === 0 ? undefined : (list[k % list.length] as { row: number }).row;
  };
  switch (e.op) {
    case 'value': {
      const row = pickRow(e.sheet, e.row);
      if (row === undefined) return 'value: no row';
      const v =
        e.field === 'p_kw'
          ? 1 + e.value * 300
          : e.field === 'cos_phi'
            ? 0.7 + e.value * 0.28
            : e.field === 'qty'
              ? 1 + Math.floor(e.value * 3)
              : e.value < 0.01
                ? 0
                : e.value;
      const c = e.field === 'load' ? (plans[e.sheet]?.loadDefault as number) : col(e.sheet, e.field);
      s.setCells(sheetId(e.sheet), [{ row, col: c, content: v }]);
      return `value ${e.field}=${v} at ${plans[e.sheet]?.sheet.name} row ${row + 1}`;
    }
    case 'supply': {
      const row = pickRow(e.sheet, e.row);
      if (row === undefined) return 'supply: no row';
      s.setCells(sheetId(e.sheet), [{ row, col: col(e.sheet, 'supply'), content: e.text }]);
      return `supply ${String(e.text)} on ${plans[e.sheet]?.sheet.name} row ${row + 1}`;
    }
    case 'resistance': {
      const i = plans.findIndex((p) => p.sheet.id === e.on);
      const row = pickRow(i, e.row);
      if (row === undefined) return `resistance: no row on ${e.on}`;
      s.setCells(sheetId(i), [{ row, col: col(i, e.column), content: e.value }]);
      return `${e.column} ${String(e.value)} on ${plans[i]?.sheet.name} row ${row + 1}`;
    }
    case 'moveBus': {
      const row = pickRow(e.sheet, e.row);
      if (row === undefined) return 'moveBus: no row';
      s.setCells(sheetId(e.sheet), [{ row, col: col(e.sheet, 'bus'), content: pickBus(e.bus) }]);
      return `move ${plans[e.sheet]?.sheet.name} row ${row + 1} to ${pickBus(e.bus)}`;
    }
    case 'type': {
      const row = s.sheetContents(sheetId(e.sheet)).length;
      const cells: Array<{ row: number; col: number; content: CellContent }> = [
        { row, col: col(e.sheet, 'tag'), content: `N${++tags}` },
        { row, col: col(e.sheet, 'bus'), content: pickBus(e.bus) },
        { row, col: col(e.sheet, 'p_kw'), content: e.p },
        { row, col: col(e.sheet, 'cos_phi'), content: e.cos },
      ];
      if (e.sheet === 0) cells.push({ row, col: col(e.sheet, 'eff'), content: 0.93 });
      s.setCells(sheetId(e.sheet), cells);
      return `type a row on ${plans[e.sheet]?.sheet.name} at row ${row + 1} on ${pickBus(e.bus)}`;
    }
    case 'insert': {
      const rows = s.sheetContents(sheetId(e.sheet)).length;
      const at = 1 + (e.at % Math.max(1, rows));
      s.insertRows(sheetId(e.sheet), at, e.count);
      return `insert ${e.count} rows at ${at + 1} on ${plans[e.sheet]?.sheet.name}`;
    }
    case 'insertTyped': {
      const below = pickRow(e.sheet, e.at);
      if (below === undefined) return 'insertTyped: no row';
      const at = below + 1;
      s.insertRows(sheetId(e.sheet), at, e.count);
      const row = at + e.count - 1;
      const cells: Array<{ row: number; col: number; content: CellContent }> = [
        { row, col: col(e.sheet, 'tag'), content: `I${++tags}` },
        { row, col: col(e.sheet, 'bus'), content: pickBus(e.bus) },
        { row, col: col(e.sheet, 'p_kw'), content: e.p },
        { row, col: col(e.sheet, 'cos_phi'), content: 0.82 },
      ];
      if (e.sheet === 0) cells.push({ row, col: col(e.sheet, 'eff'), content: 0.93 });
      s.setCells(sheetId(e.sheet), cells);
      return `insert ${e.count} rows below row ${below + 1} of ${plans[e.sheet]?.sheet.name}, type a row on ${pickBus(e.bus)} at row ${row + 1}`;
    }
    case 'remove': {
      const row = pickRow(e.sheet, e.row);
      if (row === undefined) return 'remove: no row';
      s.removeRows(sheetId(e.sheet), row, 1);
      return `remove row ${row + 1} of ${plans[e.sheet]?.sheet.name}`;
    }
    case 'paste': {
      const cols = plans[e.sheet];
      if (!cols) return 'paste: no sheet';
      const row = s.sheetContents(sheetId(e.sheet)).length;
      const width = cols.firstComputed;
      const block: CellContent[][] = Array.from({ length: e.n }, (_, k) => {
        const line = new Array<CellContent>(width).fill(null);
        line[col(e.sheet, 'tag')] = `P${++tags}`;
        line[col(e.sheet, 'bus')] = pickBus(e.bus + k);
        line[col(e.sheet, 'p_kw')] = e.p + k;
        line[col(e.sheet, 'cos_phi')] = 0.8;
        if (e.sheet === 0) line[col(e.sheet, 'eff')] = 0.9;
        return line;
      });
      s.setBlock(sheetId(e.sheet), row, 0, block);
      return `paste ${e.n} rows at ${row + 1} on ${cols.sheet.name}`;
    }
    case 'fill': {
      const row = pickRow(e.sheet, e.row);
      if (row === undefined) return 'fill: no row';
      const c = col(e.sheet, 'cos_phi');
      const id = sheetId(e.sheet);
      const last = Math.min(row + e.n, present(e.sheet).at(-1)?.row ?? row);
      s.fill(
        { start: { sheet: id, row, col: c }, end: { sheet: id, row, col: c } },
        { start: { sheet: id, row, col: c }, end: { sheet: id, row: last, col: c } },
      );
      return `fill cos φ from row ${row + 1} to ${last + 1} on ${plans[e.sheet]?.sheet.name}`;
    }
    case 'clear': {
      const row = pickRow(e.sheet, e.row);
      const cols = plans[e.sheet];
      if (row === undefined || !cols) return 'clear: no row';
      s.setCells(
        sheetId(e.sheet),
        cols.inputCols.map((c) => ({ row, col: c, content: null })),
      );
      return `clear row ${row + 1} of ${cols.sheet.name}`;
    }
    case 'bank': {
      if (buses.length === 0) return 'bank: no bus';
      const comp = planCompensationColumns(cases);
      const row = 1 + (e.bus % buses.length);
      s.setCells(model.ids.comp, [
        { row, col: comp.input.step_kvar, content: e.step },
        { row, col: comp.input.steps, content: e.steps },
        { row, col: comp.input.fixed_kvar, content: e.fixed > 1 ? e.fixed : null },
        { row, col: comp.input.series, content: e.series === '1:2:4' && e.steps > 4 ? null : e.series },
      ]);
      return `bank on ${buses[row - 1]}: ${e.steps} × ${e.step} ${e.series ?? ''}`;
    }
    case 'optionBank': {
      if (buses.length === 0) return 'optionBank: no bus';
      const cols = planOptionColumns(cases);
      const i = e.bus % buses.length;
      const row = busLineRow(i, blockOrigin(e.option, buses.length, cases.length));
      if (model.state.optionsCompact) return 'optionBank: the options hold inputs only';
      s.setCells(model.ids.opts, [
        { row, col: cols.input.step_kvar, content: e.step },
        { row, col: cols.input.steps, content: e.step === null ? null : e.steps },
        { row, col: cols.input.p_pct, content: e.p > 0 ? e.p : null },
        { row, col: cols.input.reactor_kvar, content: e.reactor > 0 ? e.reactor : null },
      ]);
      return `option ${e.option + 1} bank on ${buses[i]}: ${e.steps} × ${e.step} p ${e.p} reactor ${e.reactor}`;
    }
    case 'design': {
      // Detuning and capacitor rating typed on the Compensation sheet (the rating a factor of U).
      if (buses.length === 0) return 'design: no bus';
      const comp = planCompensationColumns(cases);
      const row = 1 + (e.bus % buses.length);
      const u = s.engine.getCellValue({ sheet: model.ids.comp, row, col: comp.u });
      const ur = e.urFactor !== null && typeof u === 'number' && u > 0 ? e.urFactor * u : null;
      s.setCells(model.ids.comp, [
        { row, col: comp.input.p_pct, content: e.p > 0 ? e.p : null },
        { row, col: comp.input.u_rated_kv, content: ur },
      ]);
      return `design on ${buses[row - 1]}: p ${e.p} %, Ur ${ur}`;
    }
    case 'detuneAlone': {
      if (buses.length === 0) return 'detuneAlone: no bus';
      const comp = planCompensationColumns(cases);
      const row = 1 + (e.bus % buses.length);
      s.setCells(model.ids.comp, [
        { row, col: comp.input.fixed_kvar, content: null },
        { row, col: comp.input.step_kvar, content: null },
        { row, col: comp.input.steps, content: null },
        { row, col: comp.input.series, content: null },
        { row, col: comp.input.reactor_kvar, content: null },
        { row, col: comp.input.p_pct, content: e.p },
      ]);
      return `detuning ${e.p} % typed alone on ${buses[row - 1]}`;
    }
    case 'rate': {
      // A rate typed or cleared on the Rates sheet (any row, surcharges included).
      const rates = s.engine.getSheetId(RATES_SHEET);
      if (rates === undefined) return 'rate: no Rates sheet';
      const rows = s.engine.getSheetDimensions(rates).height;
      if (rows < 2) return 'rate: no rows';
      const row = 1 + (e.row % (rows - 1));
      s.setCells(rates, [{ row, col: 2, content: e.value }]);
      return `rate row ${row + 1} = ${e.value}`;
    }
    case 'tariff': {
      // A tariff value or a case's hours typed or cleared on the Tariff sheet.
      const tariff = s.engine.getSheetId(TARIFF_SHEET);
      if (tariff === undefined) return 'tariff: no Tariff sheet';
      const rows = s.engine.getSheetDimensions(tariff).height;
      if (rows < 2) return 'tariff: no rows';
      const row = 1 + (e.row % (rows - 1));
      s.setCells(tariff, [{ row, col: 1, content: e.value }]);
      return `tariff row ${row + 1} = ${e.value}`;
    }
    case 'ratedPower': {
      // The rated power the requirement's limits refer to, typed or cleared on the Site sheet.
      const site = s.engine.getSheetId('Site') as number;
      s.setCells(site, [{ row: SETTING_ROWS.refKw, col: 1, content: e.value }]);
      return `rated power for the limits = ${e.value}`;
    }
    case 'rename': {
      if (buses.length === 0) return 'rename: no bus';
      const row = 1 + (e.bus % buses.length);
      const name = `R${e.suffix}-${buses[row - 1]}`;
      if (buses.some((b) => b.toUpperCase() === name.toUpperCase())) return 'rename: taken';
      s.setCells(model.ids.buses, [{ row, col: 0, content: name }]);
      return `rename ${buses[row - 1]} to ${name}`;
    }
    case 'case': {
      const name = `c${e.suffix}`;
      if (cases.some((c) => c.toLowerCase() === name)) return 'case: taken';
      const row = e.rename ? FIRST_CASE_ROW + (e.suffix % cases.length) : FIRST_CASE_ROW + cases.length;
      s.setCells(model.ids.site, [{ row, col: 1, content: name }]);
      return `${e.rename ? 'rename' : 'add'} case ${name}`;
    }
    case 'sort': {
      const cols = plans[e.sheet];
      if (!cols) return 'sort: no sheet';
      const c = e.by === 'computed' ? cols.firstComputed : cols.input.get(e.by);
      if (c === undefined) return `sort: ${cols.sheet.name} has no ${e.by}`;
      s.sortRows(sheetId(e.sheet), c, e.descending);
      return `sort ${cols.sheet.name} by ${e.by}${e.descending ? ' descending' : ''}`;
    }
    case 'undo':
      return s.undo() ? 'undo' : 'undo: nothing';
    case 'redo':
      return s.redo() ? 'redo' : 'redo: nothing';
  }
}
