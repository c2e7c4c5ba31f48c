// importKvarXlsx: open an xlsx as a workbook document. Our own export comes back exactly (the
// catalogue formulas and everything typed, from the hidden metadata) except rows someone changed
// in another program, which are read as that program left them; any other xlsx is read as plain
// formulas and values. Returns a new document or a problem; never touches the open workbook.
import type { Workbook, Worksheet } from 'exceljs';
import type { CellContent, SheetDoc, WorkbookDoc } from '../../core/workbook/document.ts';
import { checkXlsxBytes } from './checkFile.ts';
import { checkFormulas, type CheckScope } from './checkFormulas.ts';
import type { OwnPlugin } from '../../engine/index.ts';
import type { FileProblem } from './fileProblem.ts';
import { DEFAULT_XLSX_LIMITS, type XlsxLimits } from './limits.ts';
import { loadExcelJs } from './loadExcelJs.ts';
import {
  META_MARKER,
  META_SHEET_NAME,
  parseMeta,
  rowFingerprint,
  type ExportMeta,
  type SheetMeta,
} from './metadata.ts';
import { readRow, readSheet } from './readCells.ts';
import { COVER_TITLE } from './exportCover.ts';
import { MAX_EQUIPMENT_ROWS, tooManyText, workbookEquipmentRows } from '../../core/site/limits.ts';
import { equipmentSheets } from '../../core/kinds/index.ts';

export interface KvarImportOptions {
  /** Open the workbook even when formulas use unknown functions or refer to themselves in a loop. */
  readonly acceptFormulaProblems?: boolean;
  readonly limits?: XlsxLimits;
  /** Engine plugins of ours the formulas may use (e.g. the fast bus roll-up). */
  readonly plugins?: readonly OwnPlugin[];
}

export type KvarImportResult =
  | {
      readonly ok: true;
      readonly doc: WorkbookDoc;
      /** 'restored': all from our metadata; 'partly': some rows changed elsewhere; 'plain': no metadata. */
      readonly restored: 'restored' | 'partly' | 'plain';
      /** What the user should know (sheets or rows changed elsewhere, damaged metadata). */
      readonly notes: readonly string[];
      /** Formula problems, when accepted by option. */
      readonly problems: readonly FileProblem[];
    }
  | { readonly ok: false; readonly problem: FileProblem; readonly problems: readonly FileProblem[] };

function metaText(ws: Worksheet): string | undefined {
  if (ws.getCell(1, 1).value !== META_MARKER) return undefined;
  const count = Number(ws.getCell(1, 2).value);
  if (!Number.isInteger(count) || count < 1) return undefined;
  const parts: string[] = [];
  for (let r = 2; r < 2 + count; r++) {
    const v = ws.getCell(r, 1).value;
    if (typeof v !== 'string') return undefined;
    parts.push(v);
  }
  return parts.join('');
}

/** A sheet from our metadata, row by row: untouched rows restored, changed rows as found. */
function restoreSheet(
  ws: Worksheet,
  original: SheetDoc,
  meta: SheetMeta,
  date1904: boolean,
): { sheet: SheetDoc; changed: number[] } {
  // `changed` holds 1-based row numbers, as the user's program shows them.
  const rows: CellContent[][] = [];
  const changed: number[] = [];
  const last = Math.max(ws.rowCount, meta.rows.length);
  for (let r = 0; r < last; r++) {
    const file = readRow(ws, r + 1, date1904);
    if (r < meta.rows.length && rowFingerprint(file.prints) === meta.rows[r]) {
      rows.push([...(original.cells[r] ?? [])]);
    } else {
      rows.push(file.cells);
      changed.push(r + 1);
    }
  }
  while (rows.length > original.cells.length && (rows[rows.length - 1] as CellContent[]).length === 0)
    rows.pop();
  return { sheet: { ...original, cells: rows }, changed };
}

function isOurCover(ws: Worksheet): boolean {
  return ws.getCell(1, 1).value === COVER_TITLE;
}

function rowsText(rows: readonly number[]): string {
  const shown = rows.slice(0, 8).join(', ');
  return rows.length > 8 ? `${shown} and ${rows.length - 8} more` : shown;
}

interface FromMeta {
  readonly doc: WorkbookDoc;
  readonly notes: string[];
  /** Rows (0-based) and sheets that came from the file, not from our metadata: the ones to check. */
  readonly fresh: Map<string, 'all' | Set<number>>;
}

function fromMeta(wb: Workbook, meta: ExportMeta, date1904: boolean): FromMeta {
  const notes: string[] = [];
  const fresh = new Map<string, 'all' | Set<number>>();
  const byFile = new Map(
    meta.sheets.map((s, i) => [s.file, { meta: s, original: meta.doc.sheets[i] as SheetDoc }]),
  );
  const skip = new Set([...meta.generated, META_SHEET_NAME]);
  const sheets: SheetDoc[] = [];
  for (const ws of wb.worksheets) {
    if (skip.has(ws.name)) continue;
    const known = byFile.get(ws.name);
    if (!known) {
      notes.push(`sheet "${ws.name}" was added in another program; read as plain formulas and values`);
      sheets.push({ name: ws.name, cells: readSheet(ws, date1904) });
      fresh.set(ws.name, 'all');
      continue;
    }
    byFile.delete(ws.name);
    const { sheet, changed } = restoreSheet(ws, known.original, known.meta, date1904);
    if (changed.length > 0) {
      fresh.set(ws.name, new Set(changed.map((r) => r - 1)));
      notes.push(
        `sheet "${ws.name}": row(s) ${rowsText(changed)} were changed in another program; read as plain formulas and values`,
      );
    }
    sheets.push(sheet);
  }
  for (const gone of byFile.keys()) notes.push(`sheet "${gone}" was removed in another program`);
  return { doc: { ...meta.doc, sheets }, notes, fresh };
}

function plainDoc(wb: Workbook, date1904: boolean): WorkbookDoc {
  const sheets: SheetDoc[] = wb.worksheets
    .filter((ws) => ws.state !== 'veryHidden' && !isOurCover(ws))
    .map((ws) => ({ name: ws.name, cells: readSheet(ws, date1904) }));
  const title = typeof wb.title === 'string' && wb.title.trim() !== '' ? wb.title : 'Imported workbook';
  return { format: 'kvar-ledger-workbook', version: 1, title, sheets };
}

export async function importKvarXlsx(
  bytes: Uint8Array,
  opts: KvarImportOptions = {},
): Promise<KvarImportResult> {
  const refuse = (p: FileProblem, problems: FileProblem[] = []): KvarImportResult => ({
    ok: false,
    problem: p,
    problems,
  });
  const gate = await checkXlsxBytes(bytes, opts.limits ?? DEFAULT_XLSX_LIMITS);
  if (!gate.ok) return refuse(gate.problem);
  const ExcelJS = await loadExcelJs();
  const wb = new ExcelJS.Workbook();
  try {
    await wb.xlsx.load(bytes as unknown as ArrayBuffer);
  } catch (e) {
    return refuse({
      code: 'corrupt',
      message: `the workbook cannot be read (${e instanceof Error ? e.message : String(e)}); it may be damaged`,
    });
  }
  const date1904 = Boolean(wb.properties?.date1904);
  const metaSheet = wb.getWorksheet(META_SHEET_NAME);
  const text = metaSheet ? metaText(metaSheet) : undefined;
  const meta = text === undefined ? undefined : parseMeta(text);
  const notes: string[] = [];
  if (metaSheet && !meta)
    notes.push(
      'the data that restores catalogue formulas is damaged; the workbook was read as plain formulas and values',
    );

  let doc: WorkbookDoc;
  let restored: 'restored' | 'partly' | 'plain' = 'plain';
  // Formulas restored from our metadata were the app's own; only what came from the file is checked.
  let scope: CheckScope = 'all';
  if (meta) {
    const m = fromMeta(wb, meta, date1904);
    doc = m.doc;
    for (const n of m.notes) notes.push(n);
    restored = m.notes.length > 0 ? 'partly' : 'restored';
    scope = m.fresh;
  } else doc = plainDoc(wb, date1904);

  if (doc.sheets.length === 0 || doc.sheets.every((s) => s.cells.every((r) => r.length === 0))) {
    return refuse({ code: 'wrong-layout', message: 'the workbook holds no data (every sheet is empty)' });
  }
  const equipment = workbookEquipmentRows(
    doc.sheets,
    equipmentSheets().map((l) => l.sheet.name),
  );
  if (equipment > MAX_EQUIPMENT_ROWS)
    return refuse({
      code: 'too-many-rows',
      message: `the workbook has ${tooManyText('equipment rows', equipment, MAX_EQUIPMENT_ROWS)}`,
    });
  const problems = checkFormulas(doc, scope, opts.plugins);
  if (problems.length > 0 && !opts.acceptFormulaProblems) return refuse(problems[0] as FileProblem, problems);
  return { ok: true, doc, restored, notes, problems };
}
