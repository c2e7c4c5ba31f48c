// Opening a site workbook: every generated cell written from the inputs (render.ts), the engine
// built over the result, the living model set up beside it, and the contents kept as typed.
import type { HyperFormula } from '../../engine/index.ts';
import type { CellContent, WorkbookDoc } from '../../core/workbook/document.ts';
import { SHEETS } from '../../core/workbook/layout.ts';
import { renderWorkbook } from '../../core/workbook/render.ts';
export { isSiteDoc } from '../../core/workbook/render.ts';
import { readSettingsInputs } from '../../core/workbook/renderSettings.ts';
import { SETTING_ROWS, VALUE_COL } from '../../core/workbook/settingsLayout.ts';
import { equipmentPlans } from '../../core/workbook/structure.ts';
import { ContentStore } from './contentStore.ts';
import { createWorkbookEngine } from './engineBridge.ts';
import type { Layout } from './sheetLayout.ts';
import { SiteModel } from './siteModel.ts';
import { stateOf } from './siteState.ts';
import { layoutOf } from './layoutOf.ts';

const isFormula = (v: CellContent): v is string => typeof v === 'string' && v.startsWith('=');

/** A sheet's cells without the formulas the model writes (kept: inputs, notes, typed-over cells, constants). */
export function stripGenerated(
  site: SiteModel,
  id: number,
  cells: readonly (readonly CellContent[])[],
): CellContent[][] {
  return cells.map((line, r) =>
    line.map((v, c) => (isFormula(v) && site.isGenerated(id, r, c) && !site.isOverride(id, r, c) ? null : v)),
  );
}

/** The site name on the Site sheet, as the workbook's title. */
export function siteTitle(contents: ContentStore, siteSheet: number, fallback: string): string {
  const v = contents.cell(siteSheet, SETTING_ROWS.name, VALUE_COL);
  const t = v === null ? '' : String(v).trim();
  return t === '' || t.startsWith('=') ? fallback : t;
}

export interface OpenedSite {
  readonly engine: HyperFormula;
  readonly title: string;
  readonly layout: Layout;
  readonly contents: ContentStore;
  readonly site: SiteModel;
}

export function openSite(doc: WorkbookDoc): OpenedSite {
  const r = renderWorkbook(doc, { flavour: 'live' });
  const full = r.doc;
  const engine = createWorkbookEngine(full.sheets.map((s) => ({ name: s.name, cells: s.cells })));
  engine.clearUndoStack();
  const layout = layoutOf(engine, full.sheets);
  const id = (name: string) => engine.getSheetId(name) as number;
  const ids = {
    site: id(SHEETS.settings),
    equipment: equipmentPlans(r.structure.cases).map((p) => id(p.sheet.name)),
    buses: id(SHEETS.buses),
    comp: id(SHEETS.compensation),
    quant: id(SHEETS.quantities),
    opts: id(SHEETS.options),
  };
  const overrides = new Map<number, Set<string>>();
  for (const s of full.sheets) {
    if (s.overrides && s.overrides.length > 0)
      overrides.set(id(s.name), new Set(s.overrides.map(([a, b]) => `${a},${b}`)));
  }
  const notes = readSettingsInputs(full.sheets[0]).notes.length;
  const contents = new ContentStore();
  const site = new SiteModel(engine, contents, ids, stateOf(r, overrides, notes));
  full.sheets.forEach((s, i) => {
    const sheet = layout.order[i] as number;
    contents.seed(sheet, stripGenerated(site, sheet, s.cells));
  });
  return { engine, title: siteTitle(contents, ids.site, full.title), layout, contents, site };
}
