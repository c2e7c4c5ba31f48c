// The app's engine: the shared configuration from src/engine with the catalogue and the bus
// roll-up (live workbooks total their buses with it; createEngine registers both), plus a deeper
// undo history than the engine's default, since the engine's undo stack is the workbook's here.
import { createEngine, type HyperFormula, type SheetInput } from '../../engine/index.ts';

export const UNDO_LIMIT = 100;

export function createWorkbookEngine(sheets: readonly SheetInput[]): HyperFormula {
  return createEngine(sheets, { config: { undoLimit: UNDO_LIMIT } });
}
