import type { HyperFormula } from '../../engine/index.ts';
import type { SheetDoc } from '../../core/workbook/document.ts';
import { metaFromDoc, type Layout, type SheetMeta } from './sheetLayout.ts';

/** Engine sheet ids in document order, with each sheet's columns, purpose, choices and marks. */
export function layoutOf(engine: HyperFormula, sheets: readonly SheetDoc[]): Layout {
  const order: number[] = [];
  const meta = new Map<number, SheetMeta>();
  for (const s of sheets) {
    const id = engine.getSheetId(s.name) as number;
    order.push(id);
    meta.set(id, metaFromDoc(s));
  }
  return { order, meta };
}
