// Every way the grid changes cells (typing, clearing, cut, paste, fill handle) ends here and goes
// to the session as one undoable step. Copies carry values at full precision for other programs;
// a paste of our own copy brings the formulas back with their references moved.
import type { CellRange, HotInstance } from 'handsontable/base';
import type { CellContent } from '../../core/workbook/document.ts';
import type { WorkbookSession } from '../model/session.ts';
import { neutraliseText } from '../../io/csv/write.ts';
import { contentOf } from '../model/typedInput.ts';
import { completeTypedFormula } from '../../io/formula/entry.ts';
import { clipboardText, type EngineValue } from './cellView.ts';
import { rectangular, sameBlock, type ClipboardMemo } from './clipboardMemo.ts';

export interface EditHost {
  readonly hot: HotInstance;
  readonly session: WorkbookSession;
  readonly sheetId: number;
  applying: boolean;
  reload(): void;
  /** Say why an edit was refused (the grid puts its copy back). */
  refuse(message: string): void;
  select(row: number, col: number, row2?: number, col2?: number): void;
}

type Change = [number, string | number, unknown, unknown] | null;

function same(a: CellContent, b: CellContent): boolean {
  return a === b || (a === null && b === '') || (a === '' && b === null);
}

export function installEditHandlers(host: EditHost): void {
  const { hot, session } = host;
  let memo: ClipboardMemo | undefined;

  hot.addHook('beforeChange', (changes: Change[], source: string) => {
    if (source === 'loadData' || source === 'updateData' || source === 'kl-sync') return;
    const cells: Array<{ row: number; col: number; content: CellContent }> = [];
    for (const ch of changes) {
      if (!ch) continue;
      const [row, prop, , next] = ch;
      const col = Number(prop);
      // As on Enter in other programs: open brackets closed, ';' between arguments read as ','
      // (the grid keeps the completed text too, so it and the session agree).
      const typed = typeof next === 'string' ? completeTypedFormula(next).text : next;
      if (typed !== next) ch[3] = typed;
      const content = contentOf(typed);
      if (same(content, session.cellContent(host.sheetId, row, col))) continue;
      cells.push({ row, col, content });
    }
    if (cells.length === 0) return;
    host.applying = true;
    try {
      session.setCells(host.sheetId, cells);
    } catch (e) {
      host.applying = false;
      host.refuse(e instanceof Error ? e.message : String(e));
      return false;
    } finally {
      host.applying = false;
    }
  });

  const valuesOf = (
    coords: ReadonlyArray<{ startRow: number; startCol: number; endRow: number; endCol: number }>,
  ): string[][] => {
    const c = coords[0];
    if (!c) return [];
    const out: string[][] = [];
    for (let r = c.startRow; r <= c.endRow; r++) {
      const row: string[] = [];
      for (let col = c.startCol; col <= c.endCol; col++) {
        row.push(
          clipboardText(session.engine.getCellValue({ sheet: host.sheetId, row: r, col }) as EngineValue),
        );
      }
      out.push(row);
    }
    return out;
  };

  const remember = (
    data: unknown[][],
    coords: ReadonlyArray<{ startRow: number; startCol: number; endRow: number; endCol: number }>,
    cut: boolean,
  ) => {
    const c = coords[0];
    if (!c || coords.length !== 1) {
      // Several ranges: the grid copies what is typed; formulas and formula-like text go out as text.
      memo = undefined;
      for (const row of data) row.forEach((v, i) => typeof v === 'string' && (row[i] = neutraliseText(v)));
      return;
    }
    const values = valuesOf(coords);
    // Replace what goes to the clipboard: values, not the formula text in the grid's copy.
    data.length = 0;
    for (const row of values) data.push([...row]);
    const source = {
      start: { sheet: host.sheetId, row: c.startRow, col: c.startCol },
      end: { sheet: host.sheetId, row: c.endRow, col: c.endCol },
    };
    const contents: CellContent[][] = [];
    for (let r = c.startRow; r <= c.endRow; r++) {
      const row: CellContent[] = [];
      for (let col = c.startCol; col <= c.endCol; col++) row.push(session.cellContent(host.sheetId, r, col));
      contents.push(row);
    }
    memo = { values, source, cut, contents };
  };

  hot.addHook('beforeCopy', (data: unknown[][], coords) => remember(data, coords as never, false));
  hot.addHook('beforeCut', (data: unknown[][], coords) => remember(data, coords as never, true));

  hot.addHook('beforePaste', (data: unknown[][]) => {
    const range = hot.getSelectedRangeLast();
    if (!range) return false;
    const tl = range.getTopStartCorner();
    const br = range.getBottomEndCorner();
    const top = Math.max(0, tl.row ?? 0),
      left = Math.max(0, tl.col ?? 0);
    const text = rectangular(data);
    let block: CellContent[][];
    if (memo && sameBlock(text, memo.values) && session.sheetIds().includes(memo.source.start.sheet)) {
      block = memo.cut
        ? memo.contents.map((r) => [...r])
        : session.movedContents(memo.source, { sheet: host.sheetId, row: top, col: left });
    } else {
      block = text.map((r) => r.map((v) => contentOf(v)));
    }
    // One value pasted over a selected block fills the block, as in other spreadsheet programs.
    const first = block[0]?.[0];
    if (
      block.length === 1 &&
      block[0]?.length === 1 &&
      first !== undefined &&
      ((br.row ?? 0) > top || (br.col ?? 0) > left)
    ) {
      const rows = (br.row ?? 0) - top + 1,
        cols = (br.col ?? 0) - left + 1;
      block = Array.from({ length: rows }, () => Array.from({ length: cols }, () => first));
    }
    try {
      session.setBlock(host.sheetId, top, left, block);
    } catch (e) {
      host.refuse(e instanceof Error ? e.message : String(e));
      return false;
    }
    const w = block.reduce((m, r) => Math.max(m, r.length), 1);
    host.select(top, left, top + block.length - 1, left + w - 1);
    return false;
  });

  hot.addHook('beforeAutofill', (_data: unknown, source: CellRange, target: CellRange) => {
    const s = source.getTopStartCorner(),
      se = source.getBottomEndCorner();
    const t = target.getTopStartCorner(),
      te = target.getBottomEndCorner();
    const sheet = host.sheetId;
    const fill = () =>
      session.fill(
        {
          start: { sheet, row: s.row ?? 0, col: s.col ?? 0 },
          end: { sheet, row: se.row ?? 0, col: se.col ?? 0 },
        },
        {
          start: { sheet, row: t.row ?? 0, col: t.col ?? 0 },
          end: { sheet, row: te.row ?? 0, col: te.col ?? 0 },
        },
      );
    try {
      fill();
    } catch (e) {
      host.refuse(e instanceof Error ? e.message : String(e));
      return false;
    }
    host.select(
      Math.min(s.row ?? 0, t.row ?? 0),
      Math.min(s.col ?? 0, t.col ?? 0),
      Math.max(se.row ?? 0, te.row ?? 0),
      Math.max(se.col ?? 0, te.col ?? 0),
    );
    return false;
  });
}
