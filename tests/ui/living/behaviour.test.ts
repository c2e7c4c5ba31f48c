// The living workbook, edit by edit: every way an estimator changes the equipment list reaches
// the bus totals in the same step and undoes as one step; built-in sheets cannot vanish; a bank
// typed on any bus counts; a bus renamed on the Buses sheet is renamed everywhere; cases follow
// the Site sheet; a value typed over a formula is kept and marked. Expected values are computed
// independently in each test from the power triangle (P, Q = P·tan φ) and the motor's P = Pout/η.
import { describe, expect, it } from 'vitest';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { COMP_HEADERS, planCompensationColumns } from '../../../src/core/workbook/compensationColumns.ts';
import { FIRST_CASE_ROW } from '../../../src/core/workbook/settingsLayout.ts';
import { WorkbookSession } from '../../../src/ui/model/session.ts';
import { columnOf as col, sheetIdOf as id } from './sessionLookups.ts';
import { ADDED_CASE_NOTE } from '../../../src/ui/model/tariffCases.ts';
import { collectChecks } from '../../../src/ui/panels/checksModel.ts';
import { PLANT } from '../../core/workbook/sites.ts';
import * as chargedSolar from '../../core/workbook/chargedSolar.ts';

const open = () => WorkbookSession.fromDoc(buildWorkbook(PLANT, { flavour: 'live' }));
const bus = (s: WorkbookSession, name: string) =>
  s.sheetContents(id(s, 'Buses')).findIndex((r) => r[0] === name);
const busValue = (s: WorkbookSession, name: string, header: string) =>
  s.engine.getCellValue({ sheet: id(s, 'Buses'), row: bus(s, name), col: col(s, 'Buses', header) }) as number;

/** A motor's electrical P at full load: Pout / η (KW.MOTOR, IEC 60034-2-1 definition of efficiency). */
const motorP = (pOut: number, eff: number) => pOut / eff;

function typeMotor(
  s: WorkbookSession,
  row: number,
  tag: string,
  on: string,
  pOut: number,
  eff: number,
  cos: number,
) {
  const m = id(s, 'Motors');
  s.setCells(m, [
    { row, col: col(s, 'Motors', 'Tag'), content: tag },
    { row, col: col(s, 'Motors', 'Bus'), content: on },
    { row, col: col(s, 'Motors', 'Rated output (kW)'), content: pOut },
    { row, col: col(s, 'Motors', 'Efficiency'), content: eff },
    { row, col: col(s, 'Motors', 'cos φ'), content: cos },
  ]);
}

describe('equipment sheets are tables that grow and shrink', () => {
  it('a motor typed into the first empty row counts on its bus at once, and undoes in one step', () => {
    const s = open();
    const before = busValue(s, 'LV1', 'P own items day (kW)');
    const row = s.sheetContents(id(s, 'Motors')).length;
    typeMotor(s, row, 'M-NEW', 'LV1', 90, 0.95, 0.85);
    expect(busValue(s, 'LV1', 'P own items day (kW)')).toBeCloseTo(before + motorP(90, 0.95), 9);
    expect(s.undo()).toBe(true);
    expect(busValue(s, 'LV1', 'P own items day (kW)')).toBeCloseTo(before, 9);
  });

  it('rows inserted above keep the totals; a motor typed into them counts', () => {
    const s = open();
    const before = busValue(s, 'LV2', 'P own items day (kW)');
    s.insertRows(id(s, 'Motors'), 1, 3);
    expect(busValue(s, 'LV2', 'P own items day (kW)')).toBeCloseTo(before, 9);
    typeMotor(s, 2, 'M-INS', 'LV2', 30, 0.92, 0.8);
    expect(busValue(s, 'LV2', 'P own items day (kW)')).toBeCloseTo(before + motorP(30, 0.92), 9);
  });

  it("rows inserted inside one bus's run of rows: a motor of another bus typed there counts on its own bus only", () => {
    const s = open();
    const m = id(s, 'Motors');
    const rows = s.sheetContents(m);
    const busCol = col(s, 'Motors', 'Bus');
    // Two neighbouring motors on one bus: the engine widens that bus's range over rows inserted between them.
    const r = rows.findIndex((line, i) => i > 0 && line[busCol] && line[busCol] === rows[i + 1]?.[busCol]);
    expect(r).toBeGreaterThan(0);
    const runBus = String(rows[r]?.[busCol]);
    const other = ['LV1', 'LV2'].find((b) => b !== runBus) as string;
    const [runBefore, otherBefore] = [
      busValue(s, runBus, 'P own items day (kW)'),
      busValue(s, other, 'P own items day (kW)'),
    ];
    s.insertRows(m, r + 1, 3);
    typeMotor(s, r + 2, 'M-MID', other, 45, 0.93, 0.84);
    expect(busValue(s, runBus, 'P own items day (kW)')).toBeCloseTo(runBefore, 9);
    expect(busValue(s, other, 'P own items day (kW)')).toBeCloseTo(otherBefore + motorP(45, 0.93), 9);
  });

  it('rows pasted at once count, each on its bus; deleting them takes them out', () => {
    const s = open();
    const [lv1, pump] = [
      busValue(s, 'LV1', 'P own items day (kW)'),
      busValue(s, 'PUMP', 'P own items day (kW)'),
    ];
    const loads = id(s, 'Loads');
    const at = s.sheetContents(loads).length;
    const line = (tag: string, on: string, p: number) => {
      const out: (string | number | null)[] = new Array(col(s, 'Loads', 'cos φ') + 1).fill(null);
      out[col(s, 'Loads', 'Tag')] = tag;
      out[col(s, 'Loads', 'Bus')] = on;
      out[col(s, 'Loads', 'P (kW)')] = p;
      out[col(s, 'Loads', 'cos φ')] = 0.9;
      return out;
    };
    s.setBlock(loads, at, 0, [line('L-A', 'LV1', 40), line('L-B', 'PUMP', 25)]);
    expect(busValue(s, 'LV1', 'P own items day (kW)')).toBeCloseTo(lv1 + 40, 9);
    expect(busValue(s, 'PUMP', 'P own items day (kW)')).toBeCloseTo(pump + 25, 9);
    s.removeRows(loads, at, 2);
    expect(busValue(s, 'LV1', 'P own items day (kW)')).toBeCloseTo(lv1, 9);
    expect(busValue(s, 'PUMP', 'P own items day (kW)')).toBeCloseTo(pump, 9);
  });

  it('a motor on a new bus name makes a bus (fed by nothing: the Buses sheet lists it, Checks reports it)', () => {
    const s = open();
    const row = s.sheetContents(id(s, 'Motors')).length;
    typeMotor(s, row, 'M-X', 'LV9', 10, 0.9, 0.8);
    expect(bus(s, 'LV9')).toBeGreaterThan(0);
    expect(busValue(s, 'LV9', 'P own items day (kW)')).toBeCloseTo(motorP(10, 0.9), 9);
    // The Compensation sheet follows the buses: one row per bus, same order.
    const comp = s.sheetContents(id(s, 'Compensation'));
    expect(comp[bus(s, 'LV9')]?.[0]).toBe('LV9');
  });
});

describe('built-in sheets cannot vanish', () => {
  it('refuses to delete or rename the site sheets, and says why', () => {
    const s = open();
    expect(() => s.removeSheet(id(s, 'Loads'))).toThrow(/can be emptied but not deleted/);
    expect(() => s.renameSheet(id(s, 'Buses'), 'Totals')).toThrow(/find it by this name/);
    expect(() => s.insertRows(id(s, 'Buses'), 2, 1)).toThrow(/follow the site/);
  });

  it('a sheet the user added can be deleted with undo; a formula that refers to it shows #REF!', () => {
    const s = open();
    const mine = s.addSheet('Mine');
    s.setCells(mine, [{ row: 0, col: 0, content: 42 }]);
    s.setCells(id(s, 'Loads'), [{ row: 20, col: 30, content: '=Mine!A1*2' }]);
    expect(s.engine.getCellValue({ sheet: id(s, 'Loads'), row: 20, col: 30 })).toBe(84);
    s.removeSheet(mine);
    expect(
      (s.engine.getCellValue({ sheet: id(s, 'Loads'), row: 20, col: 30 }) as { type?: string }).type,
    ).toBe('REF');
    s.undo();
    expect(s.engine.getCellValue({ sheet: id(s, 'Loads'), row: 20, col: 30 })).toBe(84);
  });
});

describe('the Compensation sheet follows the buses', () => {
  it('a bank typed for a bus that had none takes effect after compensation at once', () => {
    const s = open();
    const comp = planCompensationColumns(PLANT.settings.cases);
    const row = bus(s, 'PUMP');
    const qAfter = () => busValue(s, 'PUMP', 'Q after day (kvar)');
    const before = qAfter();
    s.setCells(id(s, 'Compensation'), [
      { row, col: comp.input.fixed_kvar, content: 20 },
      { row, col: comp.input.step_kvar, content: 25 },
      { row, col: comp.input.steps, content: 2 },
    ]);
    const out = s.engine.getCellValue({
      sheet: id(s, 'Compensation'),
      row,
      col: comp.capOut[0] as number,
    }) as number;
    expect(out).toBeGreaterThanOrEqual(20);
    // Q after on the bus = Q before − the bank's output (its own losses are not there: PUMP feeds nothing).
    expect(qAfter()).toBeCloseTo(before - out, 9);
  });

  it('a bus renamed on the Buses sheet is renamed on every row, its bank with it', () => {
    const s = open();
    const comp = planCompensationColumns(PLANT.settings.cases);
    const step = s.sheetContents(id(s, 'Compensation'))[bus(s, 'LV2')]?.[comp.input.step_kvar];
    expect(typeof step).toBe('number');
    s.setCells(id(s, 'Buses'), [{ row: bus(s, 'LV2'), col: 0, content: 'LV-SOUTH' }]);
    expect(bus(s, 'LV2')).toBe(-1);
    const motors = s.sheetContents(id(s, 'Motors'));
    expect(motors.some((r) => r[col(s, 'Motors', 'Bus')] === 'LV-SOUTH')).toBe(true);
    const transformers = s.sheetContents(id(s, 'Transformers'));
    expect(transformers.some((r) => r[col(s, 'Transformers', 'Feeds bus')] === 'LV-SOUTH')).toBe(true);
    expect(s.sheetContents(id(s, 'Compensation'))[bus(s, 'LV-SOUTH')]?.[comp.input.step_kvar]).toBe(step);
    expect(() => s.setCells(id(s, 'Buses'), [{ row: bus(s, 'LV-SOUTH'), col: 0, content: 'lv1' }])).toThrow(
      /already a bus called LV1/,
    );
  });
});

describe('a workbook emptied of equipment', () => {
  // Found by the living property test: a site whose only motor was cleared has no bus left; a
  // write addressed to a bus row computed from that empty list (row NaN) reached the content
  // store and broke undo. The session now refuses a cell address that is not a whole number.
  it('refuses a write to a row that is not a whole number, and still undoes the clear', () => {
    const s = open();
    const motors = id(s, 'Motors');
    const rows = s.sheetContents(motors).length;
    const width = (s.sheetContents(motors)[0] ?? []).length;
    const all = Array.from({ length: rows - 1 }, (_, r) =>
      Array.from({ length: width }, (_, c) => ({ row: r + 1, col: c, content: null })),
    ).flat();
    s.setCells(motors, all);
    expect(() => s.setCells(id(s, 'Compensation'), [{ row: Number.NaN, col: 1, content: 5 }])).toThrow(
      /row NaN, column 1/,
    );
    expect(s.undo()).toBe(true);
    expect(s.sheetContents(motors).length).toBe(rows);
  });
});

describe('cases follow the Site sheet', () => {
  it('adds a case in the empty Case row, renames one keeping its load factors, refuses a duplicate', () => {
    const s = open();
    const motors = () => s.sheetContents(id(s, 'Motors'));
    const nightCol = () => (motors()[0] ?? []).indexOf('Load: night');
    const typed = motors().map((r) => r[nightCol()]);
    s.setCells(id(s, 'Site'), [{ row: FIRST_CASE_ROW + 3, col: 1, content: 'maintenance' }]);
    expect(motors()[0]).toContain('Load: maintenance');
    expect(s.sheetContents(id(s, 'Buses'))[0]).toContain('P maintenance (kW)');
    s.setCells(id(s, 'Site'), [{ row: FIRST_CASE_ROW + 1, col: 1, content: 'evening' }]);
    const eveningCol = (motors()[0] ?? []).indexOf('Load: evening');
    expect(eveningCol).toBeGreaterThan(0);
    expect(motors().map((r) => r[eveningCol])).toEqual(typed.map((v, i) => (i === 0 ? 'Load: evening' : v)));
    expect(() => s.setCells(id(s, 'Site'), [{ row: FIRST_CASE_ROW + 1, col: 1, content: 'DAY' }])).toThrow(
      /already a case called DAY/i,
    );
    s.undo();
    expect((motors()[0] ?? []).indexOf('Load: night')).toBeGreaterThan(0);
  });
});

describe('a renamed case keeps its hours per year on the Tariff sheet', () => {
  it('renames the Tariff row with the case, the saving counts the same hours, and undo renames it back', () => {
    const s = open();
    const tariff = id(s, 'Tariff');
    const settings = () => s.sheetContents(tariff).map((r) => r[0]);
    const nightRow = settings().indexOf('Hours per year: night');
    expect(nightRow).toBeGreaterThan(0);
    s.setCells(tariff, [{ row: nightRow, col: 1, content: 1234 }]);
    s.setCells(id(s, 'Site'), [{ row: FIRST_CASE_ROW + 1, col: 1, content: 'evening' }]);
    expect(settings()[nightRow]).toBe('Hours per year: evening');
    expect(s.sheetContents(tariff)[nightRow]?.[1]).toBe(1234);
    // The Quantities and cost sheet reads the hours by the case's name: the renamed case finds them.
    const q = id(s, 'Quantities and cost');
    const hoursCell = s
      .sheetContents(q)
      .findIndex(
        (r, i) =>
          r[0] === 'evening' && typeof s.engine.getCellValue({ sheet: q, row: i, col: 3 }) === 'number',
      );
    expect(hoursCell).toBeGreaterThan(0);
    expect(s.engine.getCellValue({ sheet: q, row: hoursCell, col: 3 })).toBe(1234);
    s.undo();
    expect(settings()[nightRow]).toBe('Hours per year: night');
  });
});

describe('an added case gets its hours row on the Tariff sheet', () => {
  it('appends the row with a blank value, Checks asks for the hours, typed hours count, undo removes it', () => {
    const s = open();
    const tariff = id(s, 'Tariff');
    const rowsBefore = s.sheetContents(tariff).length;
    const settings = () => s.sheetContents(tariff).map((r) => r[0]);
    s.setCells(id(s, 'Site'), [{ row: FIRST_CASE_ROW + 3, col: 1, content: 'maintenance' }]);
    const row = settings().indexOf('Hours per year: maintenance');
    expect(row).toBe(rowsBefore);
    expect(s.sheetContents(tariff)[row]?.slice(1)).toEqual([null, 'h', ADDED_CASE_NOTE]);
    const asks = () =>
      collectChecks(s.toDoc()).items.filter((i) => i.code === 'tariff' && i.text.includes('maintenance'));
    expect(asks()).toEqual([
      expect.objectContaining({ severity: 'warning', where: `Tariff row ${row + 1}, column Value` }),
    ]);
    s.setCells(tariff, [{ row, col: 1, content: 500 }]);
    // The hours are no longer asked for; the demo's three cases already share the year, so
    // Checks now says that the four add up to more than a year.
    expect(asks()).toEqual([
      expect.objectContaining({ text: expect.stringMatching(/add up to 9,260 h per year/) }),
    ]);
    const q = id(s, 'Quantities and cost');
    const hours = s
      .sheetContents(q)
      .findIndex(
        (r, i) =>
          r[0] === 'maintenance' && typeof s.engine.getCellValue({ sheet: q, row: i, col: 3 }) === 'number',
      );
    expect(s.engine.getCellValue({ sheet: q, row: hours, col: 3 })).toBe(500);
    s.undo();
    s.undo();
    expect(settings()).not.toContain('Hours per year: maintenance');
    expect(s.sheetContents(tariff).length).toBe(rowsBefore);
  });

  it('a case without any hours row is listed by Checks, with what to add', () => {
    const s = open();
    const tariff = id(s, 'Tariff');
    const row = s.sheetContents(tariff).findIndex((r) => r[0] === 'Hours per year: night');
    s.setCells(tariff, [{ row, col: 0, content: 'Hours per year: nights' }]);
    const items = collectChecks(s.toDoc()).items.filter((i) => i.code === 'tariff');
    expect(items.map((i) => i.text)).toContainEqual(expect.stringMatching(/no row "Hours per year: night"/));
  });

  it('hours that add up to more than a year are listed by Checks at the first hours row', () => {
    const s = open();
    const tariff = id(s, 'Tariff');
    const rows = s.sheetContents(tariff);
    const day = rows.findIndex((r) => r[0] === 'Hours per year: day');
    const first = rows.findIndex((r) => String(r[0]).startsWith('Hours per year: '));
    expect(collectChecks(s.toDoc()).items.filter((i) => /add up to/.test(i.text))).toEqual([]);
    s.setCells(tariff, [{ row: day, col: 1, content: 8760 }]);
    const items = collectChecks(s.toDoc()).items.filter((i) => /add up to/.test(i.text));
    expect(items).toHaveLength(1);
    expect(items[0]?.where).toBe(`Tariff row ${first + 1}, column Value`);
    expect(items[0]?.target).toEqual({ sheet: 'Tariff', row: first + 1, col: 1 });
  });
});

describe('a value typed over a formula', () => {
  it('is kept, counts in the totals, is marked, and clearing it brings the formula back', () => {
    const s = open();
    const loads = id(s, 'Loads');
    const q = col(s, 'Loads', 'Q day (kvar)');
    const formula = s.cellContent(loads, 1, q);
    expect(String(formula)).toMatch(/^=IF\(/);
    const before = busValue(s, 'LV1', 'Q absorbed own items day (kvar)');
    const was = s.engine.getCellValue({ sheet: loads, row: 1, col: q }) as number;
    s.setCells(loads, [{ row: 1, col: q, content: 999 }]);
    expect(s.isOverride(loads, 1, q)).toBe(true);
    expect(busValue(s, 'LV1', 'Q absorbed own items day (kvar)')).toBeCloseTo(before - was + 999, 9);
    const reopened = WorkbookSession.fromDoc(s.toDoc());
    expect(reopened.isOverride(loads, 1, q)).toBe(true);
    expect(reopened.engine.getCellValue({ sheet: loads, row: 1, col: q })).toBe(999);
    s.setCells(loads, [{ row: 1, col: q, content: null }]);
    expect(s.isOverride(loads, 1, q)).toBe(false);
    expect(s.cellContent(loads, 1, q)).toBe(formula);
    expect(busValue(s, 'LV1', 'Q absorbed own items day (kvar)')).toBeCloseTo(before, 9);
  });

  it('keeps header rows as they are', () => {
    const s = open();
    expect(() => s.setCells(id(s, 'Motors'), [{ row: 0, col: 0, content: 'Name' }])).toThrow(
      /header row of Motors/,
    );
  });
});

describe('the charging of a zone follows a cable typed on any of its buses', () => {
  it('a cable added on block B counts in block A’s resonance at once (one zone through the feeders)', () => {
    const s = WorkbookSession.fromDoc(
      buildWorkbook(chargedSolar.site, { flavour: 'live', banks: [chargedSolar.bank] }),
    );
    const comp = id(s, 'Compensation');
    const rowA = s.sheetContents(comp).findIndex((r) => r[0] === 'BLK-A');
    const charging = () =>
      s.engine.getCellValue({
        sheet: comp,
        row: rowA,
        col: col(s, 'Compensation', COMP_HEADERS.zoneCharging),
      });
    expect(charging()).toBeCloseTo(chargedSolar.nightCharging, 6);
    const cables = id(s, 'Cables');
    const row = s.sheetContents(cables).length;
    s.setCells(cables, [
      { row, col: col(s, 'Cables', 'Tag'), content: 'CB-Y' },
      { row, col: col(s, 'Cables', 'Bus'), content: 'BLK-B' },
      { row, col: col(s, 'Cables', 'U (kV)'), content: 33 },
      { row, col: col(s, 'Cables', 'C (µF/km)'), content: 0.2 },
      { row, col: col(s, 'Cables', 'Length (km)'), content: 2 },
    ]);
    // Q = 2πf·C·len·U² (IEC 60287-1-1 / any cable handbook), energised in every case.
    const added = (2 * Math.PI * 50 * 0.2e-6 * 2 * 33e3 ** 2) / 1e3;
    expect(charging()).toBeCloseTo(chargedSolar.nightCharging + added, 6);
    expect(s.undo()).toBe(true);
    expect(charging()).toBeCloseTo(chargedSolar.nightCharging, 6);
  });
});
