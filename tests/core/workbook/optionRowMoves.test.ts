// Where the Design options sheet's lines go when the buses change (optionRowMoves): checked
// against the sheets themselves, rendered before and after, each line found by its block label
// and bus name, in the full layout, the compact one (inputs only) and from one to the other.
import { describe, expect, it } from 'vitest';
import type { Site } from '../../../src/core/site/model.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import type { CellContent } from '../../../src/core/workbook/document.ts';
import { readOptionInputs } from '../../../src/core/workbook/optionInputs.ts';
import {
  OPTIONS_SHEET,
  optionLabel,
  optionRowMoves,
  planOptionColumns,
} from '../../../src/core/workbook/optionsLayout.ts';
import { renderWorkbook } from '../../../src/core/workbook/render.ts';
import { renderOptionsSheet } from '../../../src/core/workbook/renderOptions.ts';
import { PLANT } from './sites.ts';

/** PLANT with a bus AUX fed first (listed before the others) and the pump bus taken away. */
const CHANGED: Site = {
  ...PLANT,
  equipment: [
    {
      row: 2,
      tag: 'T0',
      bus: 'MV',
      kind: 'transformer',
      to_bus: 'AUX',
      values: { s_kva: 630, uk_pct: 6, u_kv: 0.4 },
      loads: {},
    },
    ...PLANT.equipment.filter((r) => r.bus !== 'PUMP' && r.to_bus !== 'PUMP'),
  ],
};

const EMPTY: Site = { ...PLANT, equipment: [] };

/** The options sheet of a site in either layout, with its buses by key. */
function laidOut(site: Site, compact: boolean) {
  const r = renderWorkbook(buildWorkbook(site, { flavour: 'live' }), { flavour: 'live' });
  const cols = planOptionColumns(r.structure.cases);
  const own = r.doc.sheets.find((x) => x.name === OPTIONS_SHEET);
  const { cells } = renderOptionsSheet({
    s: r.structure,
    cols,
    busCols: r.busCols,
    comp: r.compCols,
    hasRates: false,
    hasTariff: false,
    typed: readOptionInputs(own, cols),
    ...(compact ? { leftOut: 'inputs only' } : {}),
  });
  const shape = { busCount: r.structure.buses.length, cases: r.structure.cases.length, compact };
  return { cells, shape, s: r.structure };
}

/** Row of option j's title line, or of `bus`'s line in its block (undefined: none). */
function lineOf(cells: readonly (readonly CellContent[])[], j: number, bus?: string): number | undefined {
  let block = -1;
  for (let r = 1; r < cells.length; r++) {
    const label = cells[r]?.[1];
    if (typeof label === 'string' && /^Option \d+$/.test(label)) {
      block = label === optionLabel(j) ? j : -1;
      if (block === j && bus === undefined) return r;
      continue;
    }
    if (block === j && bus !== undefined && cells[r]?.[0] === bus) return r;
  }
  return undefined;
}

describe.each([
  [false, false],
  [true, true],
  [false, true],
  [true, false],
])('optionRowMoves, compact before %s, after %s', (compactBefore, compactAfter) => {
  it('sends each title and bus line where the sheet laid out anew has it', () => {
    const before = laidOut(PLANT, compactBefore);
    const after = laidOut(CHANGED, compactAfter);
    const busTo = before.s.buses.map((b) => after.s.busIndex.get(b.key));
    expect(busTo).toContain(undefined);
    const want = new Map<number, number | undefined>();
    for (let j = 0; j < 4; j++) {
      const names = [undefined, ...before.s.buses.map((b) => b.name)];
      for (const name of names) {
        const from = lineOf(before.cells, j, name);
        const to = lineOf(after.cells, j, name);
        expect(from).toBeDefined();
        if (from !== to) want.set(from as number, to);
      }
    }
    expect(want.size).toBeGreaterThan(0);
    expect(optionRowMoves(before.shape, after.shape, busTo)).toEqual(want);
  });
});

describe('optionRowMoves when no bus is left', () => {
  it('sends every line nowhere; from no bus at all, nothing moves', () => {
    const before = laidOut(PLANT, false);
    const after = laidOut(EMPTY, false);
    const busTo = before.s.buses.map(() => undefined);
    const moves = optionRowMoves(before.shape, after.shape, busTo);
    expect(moves.size).toBe(4 * (1 + before.s.buses.length));
    expect([...moves.values()].every((v) => v === undefined)).toBe(true);
    expect(optionRowMoves(after.shape, before.shape, []).size).toBe(0);
  });
});
