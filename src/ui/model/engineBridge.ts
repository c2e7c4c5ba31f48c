// The app's engine: the shared configuration from src/engine plus a deeper undo history than the
// engine's default, since the engine's undo stack is the workbook's undo stack here.
import type { HyperFormula } from 'hyperformula';
import { createEngine, type SheetInput } from '../../engine/index.ts';

export const UNDO_LIMIT = 100;

export function createWorkbookEngine(sheets: readonly SheetInput[]): HyperFormula {
  return createEngine(sheets, { config: { undoLimit: UNDO_LIMIT } });
}
