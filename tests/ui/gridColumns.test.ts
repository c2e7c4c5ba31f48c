// Frozen columns and widths of the grid, from the column descriptions the workbook builder
// writes (src/core/kinds/sheets.ts).
import { describe, expect, it } from 'vitest';
import { equipmentSheets } from '../../src/core/kinds/index.ts';

const EQUIPMENT_SHEETS = equipmentSheets().map((e) => ({
  id: e.sheet.id,
  sheet: e.sheet.name,
  inputs: e.sheet.inputs,
}));
import {
  columnWidth,
  frozenColumns,
  FROZEN_TEXT_MAX_PX,
  twoLineChars,
} from '../../src/ui/grid/gridColumns.ts';

const motors = (EQUIPMENT_SHEETS.find((l) => l.id === 'motors')?.inputs ?? []).map((c) => ({
  header: c.header,
  width: c.width,
}));

describe('grid columns', () => {
  it('freezes through Bus on equipment sheets, the bus name on bus sheets, nothing elsewhere', () => {
    for (const l of EQUIPMENT_SHEETS) {
      const cols = l.inputs.map((c) => ({ header: c.header }));
      expect(frozenColumns(cols), l.sheet).toBe(cols.findIndex((c) => c.header === 'Bus') + 1);
      expect(frozenColumns(cols)).toBeGreaterThanOrEqual(2);
    }
    expect(frozenColumns([{ header: 'Bus' }, { header: 'Level' }])).toBe(1);
    expect(frozenColumns([{ header: 'Setting' }, { header: 'Value' }])).toBe(0);
    expect(frozenColumns(undefined)).toBe(0);
  });

  it('keeps a frozen description narrow but never the tag or the bus', () => {
    const frozen = frozenColumns(motors);
    expect(columnWidth(motors, 1, frozen)).toBe(FROZEN_TEXT_MAX_PX);
    expect(columnWidth(motors, 0, frozen)).toBeGreaterThan(80);
    expect(columnWidth(motors, 1, 0)).toBeGreaterThan(FROZEN_TEXT_MAX_PX);
  });

  it('lets a long header wrap onto two lines instead of widening its column', () => {
    expect(twoLineChars('Rated output (kW)')).toBe(11);
    expect(twoLineChars('Running')).toBe(7);
    const rated = motors.findIndex((c) => c.header === 'Rated output (kW)');
    expect(columnWidth(motors, rated, 3)).toBeLessThan(100);
    expect(columnWidth(motors, rated, 3)).toBeGreaterThanOrEqual(11 * 7.8);
  });

  it('leaves room for six Motors columns at 1024 px beside a 320 px panel and a 124 px sheet list', () => {
    const frozen = frozenColumns(motors);
    const six = [0, 1, 2, 3, 4, 5].reduce((s, i) => s + columnWidth(motors, i, frozen), 0);
    // Row numbers 50 px and a 12 px scroll bar take their share.
    expect(six).toBeLessThanOrEqual(1024 - 124 - 320 - 50 - 12);
  });

  it('keeps widths within bounds', () => {
    expect(columnWidth([{ header: 'x', width: 1 }], 0, 0)).toBe(44);
    expect(columnWidth([{ header: 'x', width: 999 }], 0, 0)).toBe(400);
    expect(columnWidth([{ header: 'x'.repeat(80), width: 8 }], 0, 0)).toBe(180);
    // No description: a sheet without a header row, or a column beyond the described ones.
    expect(columnWidth(undefined, 3, 0)).toBe(90);
    expect(columnWidth([{ header: 'x' }], 5, 0)).toBe(64);
  });
});
