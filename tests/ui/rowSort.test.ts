// Sorting an equipment sheet's rows: the order users expect (numbers, natural text, blanks last,
// stable), rows that move whole (typed cells, typed-over cells, typed formulas with their row),
// totals that do not move, and one undo step that puts everything back.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { sortedOrder } from '../../src/ui/model/rowOrder.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';
import { workbookOf } from '../../src/ui/templates/templateBuild.ts';
import { pageFaces, relDiff } from './living/faces.ts';

describe('sortedOrder', () => {
  it('numbers ascending, then text in natural order, blanks last; descending keeps blanks last', () => {
    const values = ['M10', 3, null, 'm2', 1.5, '', 'M1', 20];
    expect(sortedOrder(values, false).map((i) => values[i])).toEqual([
      1.5,
      3,
      20,
      'M1',
      'm2',
      'M10',
      null,
      '',
    ]);
    expect(sortedOrder(values, true).map((i) => values[i])).toEqual([
      'M10',
      'm2',
      'M1',
      20,
      3,
      1.5,
      null,
      '',
    ]);
  });

  it('keeps equal keys in their order (stable), in both directions', () => {
    const values = ['B', 'A', 'B', 'A'];
    expect(sortedOrder(values, false)).toEqual([1, 3, 0, 2]);
    expect(sortedOrder(values, true)).toEqual([0, 2, 1, 3]);
  });
});

const ROOT = fileURLToPath(new URL('../../', import.meta.url));

async function demo(): Promise<WorkbookSession> {
  const id = 'cold-store';
  return WorkbookSession.fromDoc(await workbookOf(id, readFileSync(`${ROOT}templates/${id}.json`, 'utf8')));
}

describe('WorkbookSession.sortRows', () => {
  it('reorders Motors by rated output, moves typed cells with their row, keeps the totals; undo restores', async () => {
    const s = await demo();
    const motors = s.engine.getSheetId('Motors') as number;
    const header = s.sheetContents(motors)[0] ?? [];
    const tag = header.indexOf('Tag');
    const kw = header.indexOf('Rated output (kW)');
    expect(tag).toBeGreaterThanOrEqual(0);
    expect(kw).toBeGreaterThanOrEqual(0);
    const busCount = s.sheetContents(s.engine.getSheetId('Buses') as number).length - 1;
    const before = s.sheetContents(motors).map((r) => [...r]);
    const pairs = before.slice(1).map((r) => [r[tag], r[kw]] as const);
    const facesBefore = pageFaces(s, siteCases(s), busCount);

    s.sortRows(motors, kw, true);
    const after = s.sheetContents(motors);
    // Worked out here: the tags ordered by their rated output, largest first (ties keep order).
    const expected = [...pairs]
      .map((p, i) => ({ p, i }))
      .sort((a, b) => Number(b.p[1]) - Number(a.p[1]) || a.i - b.i)
      .map((x) => x.p[0]);
    expect(after.slice(1).map((r) => r[tag])).toEqual(expected);
    // Each row moved whole: the same typed cells as before, found under the same tag.
    for (const row of after.slice(1)) {
      const was = before.find((r) => r[tag] === row[tag]);
      expect(row).toEqual(was);
    }
    // Every bus total, before and after compensation, in every case, is as before the sort.
    const facesAfter = pageFaces(s, siteCases(s), busCount);
    facesAfter.buses.forEach((b, i) =>
      b.cases.forEach((c, k) =>
        c.forEach((x, j) => {
          const y = facesBefore.buses[i]?.cases[k]?.[j];
          if (typeof x === 'number' && typeof y === 'number') expect(relDiff(x, y)).toBeLessThan(1e-12);
        }),
      ),
    );

    expect(s.undo()).toBe(true);
    expect(s.sheetContents(motors)).toEqual(before);
    expect(s.redo()).toBe(true);
    expect(
      s
        .sheetContents(motors)
        .slice(1)
        .map((r) => r[tag]),
    ).toEqual(expected);
  });

  it('a typed formula keeps pointing at its own row; a typed-over cell moves with its row', async () => {
    const s = await demo();
    const motors = s.engine.getSheetId('Motors') as number;
    const header = s.sheetContents(motors)[0] ?? [];
    const tag = header.indexOf('Tag');
    const desc = header.indexOf('Description');
    const kw = header.indexOf('Rated output (kW)');
    const kvarCol = header.findIndex((h) => typeof h === 'string' && /^Q .*kvar/.test(h));
    expect(kvarCol).toBeGreaterThanOrEqual(0);
    const rows = s.sheetContents(motors);
    const first = rows[1]?.[tag];
    const letter = String.fromCharCode(65 + kw);
    // Row 2 gets a description built from its own rated output, and a kvar typed over.
    s.setCells(motors, [
      { row: 1, col: desc, content: `=${letter}2&" kW"` },
      { row: 1, col: kvarCol, content: 12.5 },
    ]);
    expect(s.isOverride(motors, 1, kvarCol)).toBe(true);
    s.sortRows(motors, tag, true);
    const moved = s.sheetContents(motors).findIndex((r) => r[tag] === first);
    expect(moved).toBeGreaterThan(1);
    expect(s.engine.getCellValue({ sheet: motors, row: moved, col: desc })).toBe(`${rows[1]?.[kw]} kW`);
    expect(s.engine.getCellValue({ sheet: motors, row: moved, col: kvarCol })).toBe(12.5);
    expect(s.isOverride(motors, moved, kvarCol)).toBe(true);
    expect(s.isOverride(motors, 1, kvarCol)).toBe(false);
  });

  it('refuses the sheets whose rows follow the site, saying why', async () => {
    const s = await demo();
    expect(() => s.sortRows(s.engine.getSheetId('Buses') as number, 0, false)).toThrow(
      /Sorting rows works on the equipment sheets; Buses keeps its order/,
    );
  });
});

function siteCases(s: WorkbookSession): readonly string[] {
  return s.site?.state.cases ?? [];
}
