// The app's engine: the shared configuration from src/engine with the catalogue and the bus
// roll-up (live workbooks total their buses with it), plus a deeper undo history than the
// engine's default, since the engine's undo stack is the workbook's undo stack here.
import type { HyperFormula } from 'hyperformula';
import { createEngine, type SheetInput } from '../../engine/index.ts';
import { BUS_ROLLUP_PLUGIN } from '../../engine/rollupPlugin.ts';

export const UNDO_LIMIT = 100;

export function createWorkbookEngine(sheets: readonly SheetInput[]): HyperFormula {
  return createEngine(sheets, { plugins: [BUS_ROLLUP_PLUGIN], config: { undoLimit: UNDO_LIMIT } });
}
