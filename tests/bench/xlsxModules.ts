// The xlsx exporter and importer, found at run time: they are another part's work and may not
// have landed yet. When one is missing the bench says "not available" instead of a number.
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';

const XLSX_DIR = fileURLToPath(new URL('../../src/io/xlsx/', import.meta.url));

export type Found<F> = { readonly ok: true; readonly fn: F; readonly from: string } | { readonly ok: false; readonly why: string };

export type ExportFn = (doc: WorkbookDoc) => Promise<Uint8Array>;
/** The contract says `importXlsx(bytes) → ...`; the bench only needs it to finish and say whether it read the file. */
export type ImportFn = (bytes: Uint8Array) => Promise<unknown>;

/** The first file under src/io/xlsx that exports a function of this name (its text is searched, then it is loaded). */
async function findExport<F>(name: string, preferred: string): Promise<Found<F>> {
  if (!existsSync(XLSX_DIR)) return { ok: false, why: 'src/io/xlsx does not exist yet' };
  const declares = new RegExp(`export\\s+(async\\s+)?function\\s+${name}\\b|export\\s+const\\s+${name}\\b|export\\s*\\{[^}]*\\b${name}\\b`);
  const files = readdirSync(XLSX_DIR).filter((f) => f.endsWith('.ts'));
  const ordered = [preferred, ...files.filter((f) => f !== preferred)].filter((f) => files.includes(f));
  const file = ordered.find((f) => declares.test(readFileSync(join(XLSX_DIR, f), 'utf8')));
  if (file === undefined) return { ok: false, why: `no module under src/io/xlsx exports ${name} yet` };
  try {
    const mod = (await import(pathToFileURL(join(XLSX_DIR, file)).href)) as Record<string, unknown>;
    const fn = mod[name];
    if (typeof fn !== 'function') return { ok: false, why: `src/io/xlsx/${file} does not export a function ${name}` };
    return { ok: true, fn: fn as F, from: `src/io/xlsx/${file}` };
  } catch (e) {
    return { ok: false, why: `src/io/xlsx/${file} failed to load: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}` };
  }
}

export const findExporter = () => findExport<ExportFn>('exportWorkbookXlsx', 'export.ts');
export const findImporter = () => findExport<ImportFn>('importXlsx', 'import.ts');

/** Whether an importer's answer reports failure ({ok:false, ...} by the project's convention). */
export function importFailure(result: unknown): string | undefined {
  if (typeof result !== 'object' || result === null) return undefined;
  const r = result as { ok?: unknown; message?: unknown; problem?: { message?: unknown } };
  if (r.ok !== false) return undefined;
  const msg = typeof r.message === 'string' ? r.message : typeof r.problem?.message === 'string' ? r.problem.message : 'the importer refused the file';
  return msg;
}
