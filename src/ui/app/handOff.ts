// The xlsx hand-off of the open workbook (loaded on demand with the xlsx library). The engine
// needs our bus roll-up plugin to compute the cached values of a live workbook.
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { BUS_ROLLUP_PLUGIN } from '../../engine/rollupPlugin.ts';
import { exportWorkbookXlsxWithReport } from '../../io/xlsx/export.ts';

export async function handOff(doc: WorkbookDoc): Promise<{ bytes: Uint8Array; issues: number }> {
  const r = await exportWorkbookXlsxWithReport(doc, { plugins: [BUS_ROLLUP_PLUGIN] });
  return { bytes: r.bytes, issues: r.issues.length };
}
