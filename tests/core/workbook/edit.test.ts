// An edit in the grid reaches exactly the buses it should: the item's own bus and the buses
// above it up to the point of connection, in the case edited; nothing else moves.
import { describe, expect, it } from 'vitest';
import { WorkbookSession } from '../../../src/ui/model/session.ts';
import type { HyperFormula } from 'hyperformula';
import { ancestors, buildBusGraph } from '../../../src/core/site/graph.ts';
import { rollUp } from '../../../src/core/site/rollup.ts';
import type { EquipmentRow, Site } from '../../../src/core/site/model.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import type { WorkbookDoc } from '../../../src/core/workbook/document.ts';
import { PLANT } from './sites.ts';
import { busRow, close, liveEngine, num, portableEngine, sheet, valueAt } from './engineDoc.ts';

function busValues(hf: HyperFormula, doc: WorkbookDoc, site: Site): Map<string, number> {
  const out = new Map<string, number>();
  for (const c of site.settings.cases) {
    for (const b of rollUp(site, c).buses) {
      for (const h of [`P ${c} (kW)`, `Q ${c} (kvar)`])
        out.set(`${b.bus}|${h}`, num(valueAt(hf, doc, 'Buses', busRow(doc, b.bus), h)));
    }
  }
  return out;
}

function setCell(
  hf: HyperFormula,
  doc: WorkbookDoc,
  sheetName: string,
  row: number,
  header: string,
  value: number | string,
): void {
  const col = sheet(doc, sheetName).cells[0]?.indexOf(header) ?? -1;
  hf.setCellContents({ sheet: hf.getSheetId(sheetName) as number, row, col }, [[value]]);
}

/** The same site with one motor's load factor in one case changed (for the roll-up's answer). */
function withLoad(site: Site, tag: string, caseName: string, x: number): Site {
  return {
    settings: site.settings,
    equipment: site.equipment.map((r): EquipmentRow =>
      r.tag === tag ? { ...r, loads: { ...r.loads, [caseName]: x } } : r,
    ),
  };
}

describe('editing one motor', () => {
  for (const flavour of ['live', 'portable'] as const) {
    it(`changes its bus and the buses above only (${flavour})`, () => {
      const doc = buildWorkbook(PLANT, { flavour });
      const hf = flavour === 'live' ? liveEngine(doc) : portableEngine(doc);
      const before = busValues(hf, doc, PLANT);
      // M3 is on LV2, fed from MV through T2; the edit is its night load factor.
      const motors = sheet(doc, 'Motors');
      const row = motors.cells.findIndex((r) => r[0] === 'M3');
      setCell(hf, doc, 'Motors', row, 'Load: night', 0.4);
      const after = busValues(hf, doc, PLANT);

      const graph = buildBusGraph(PLANT.equipment);
      const affected = new Set(['LV2', ...ancestors(graph, 'LV2')]);
      expect([...affected].sort()).toEqual(['LV2', 'MV']);
      const changed = [...before.keys()].filter((k) => before.get(k) !== after.get(k));
      expect(changed.length).toBeGreaterThan(0);
      for (const k of changed) {
        const [bus, header] = k.split('|') as [string, string];
        expect(affected.has(bus), `${k} changed`).toBe(true);
        expect(header).toContain('night');
      }
      for (const b of affected) expect(changed).toContain(`${b}|P night (kW)`);

      // And the new values are the roll-up of the edited site.
      const edited = withLoad(PLANT, 'M3', 'night', 0.4);
      for (const b of rollUp(edited, 'night').buses) {
        expect(close(after.get(`${b.bus}|P night (kW)`) as number, b.p_kw, 1e-9)).toBe(true);
        expect(close(after.get(`${b.bus}|Q night (kvar)`) as number, b.q_kvar, 1e-9)).toBe(true);
      }
    });
  }

  it('moving a motor to another bus in the page moves its power to that bus at once', () => {
    const session = WorkbookSession.fromDoc(buildWorkbook(PLANT, { flavour: 'live' }));
    const motors = session.engine.getSheetId('Motors') as number;
    const row = session.sheetContents(motors).findIndex((r) => r[0] === 'M3');
    const busCol = (session.sheetContents(motors)[0] ?? []).indexOf('Bus');
    session.setCells(motors, [{ row, col: busCol, content: 'lv1' }]);
    const moved: Site = {
      settings: PLANT.settings,
      equipment: PLANT.equipment.map((r) => (r.tag === 'M3' ? { ...r, bus: 'LV1' } : r)),
    };
    const doc = buildWorkbook(moved, { flavour: 'live' });
    const buses = session.engine.getSheetId('Buses') as number;
    for (const c of PLANT.settings.cases) {
      for (const b of rollUp(moved, c).buses) {
        const col = (doc.sheets.find((s) => s.name === 'Buses')?.cells[0] ?? []).indexOf(`P ${c} (kW)`);
        const v = session.engine.getCellValue({ sheet: buses, row: busRow(doc, b.bus), col });
        expect(close(num({ ok: true, value: v as number }), b.p_kw, 1e-9), `${c} ${b.bus}`).toBe(true);
      }
    }
  });

  it('a row added below the last one counts in the portable flavour (SUMIF over whole columns)', () => {
    const doc = buildWorkbook(PLANT, { flavour: 'portable' });
    const hf = portableEngine(doc);
    const before = num(valueAt(hf, doc, 'Buses', busRow(doc, 'PUMP'), 'P own items day (kW)'));
    const r = sheet(doc, 'Loads').cells.length + 3; // a few rows below the list, as someone might type it
    setCell(hf, doc, 'Loads', r, 'Bus', 'PUMP');
    setCell(hf, doc, 'Loads', r, 'P day (kW)', 100);
    expect(num(valueAt(hf, doc, 'Buses', busRow(doc, 'PUMP'), 'P own items day (kW)'))).toBe(before + 100);
  });

  it('switching a motor off (load 0) drops its magnetising kvar too, as the roll-up does', () => {
    const doc = buildWorkbook(PLANT, { flavour: 'live' });
    const hf = liveEngine(doc);
    const row = sheet(doc, 'Motors').cells.findIndex((r) => r[0] === 'P1');
    setCell(hf, doc, 'Motors', row, 'Load: day', 0);
    expect(num(valueAt(hf, doc, 'Motors', row, 'Q day (kvar)'))).toBe(0);
    expect(num(valueAt(hf, doc, 'Buses', busRow(doc, 'PUMP'), 'P own items day (kW)'))).toBe(0);
  });

  it('a bad value shows as an error on its row and its bus, with the catalogue message', () => {
    const doc = buildWorkbook(PLANT, { flavour: 'live' });
    const hf = liveEngine(doc);
    const row = sheet(doc, 'Motors').cells.findIndex((r) => r[0] === 'M3');
    setCell(hf, doc, 'Motors', row, 'cos φ', 1.3);
    const q = valueAt(hf, doc, 'Motors', row, 'Q day (kvar)');
    expect(q).toMatchObject({
      ok: false,
      message: expect.stringContaining('KVAR.MOTOR: argument 3 (cos_phi) must be in (0, 1]; got 1.3'),
    });
    expect(valueAt(hf, doc, 'Buses', busRow(doc, 'LV2'), 'Q day (kvar)').ok).toBe(false);
    expect(valueAt(hf, doc, 'Buses', busRow(doc, 'LV1'), 'Q day (kvar)').ok).toBe(true);
  });
});
