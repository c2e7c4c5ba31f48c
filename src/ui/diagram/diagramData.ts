// The inputs of the diagram, read from the open workbook: the site as siteFromWorkbook reads it
// (the same reading the Checks panel and the export use), its problems, and the engine's values
// of the Buses sheet. No DOM.
import { buildBusGraph } from '../../core/site/graph.ts';
import { EQUIPMENT_KINDS } from '../../core/site/model.ts';
import { validateSite } from '../../core/site/validate.ts';
import { SHEETS } from '../../core/workbook/layout.ts';
import { siteFromWorkbook } from '../../core/workbook/readSite.ts';
import { casesOf, type Grid } from '../charts/chartData.ts';
import type { WorkbookSession } from '../model/session.ts';
import { buildDiagramModel, type DiagramModel } from './diagramModel.ts';

export interface DiagramInputs {
  readonly cases: readonly string[];
  readonly busesSheet: Grid | undefined;
  /** Builds the model for one case (the structure is read once). */
  model(caseName: string): DiagramModel;
}

export function readDiagramInputs(session: WorkbookSession): DiagramInputs {
  const engine = session.engine;
  const valueAt = (sheet: string, row: number, col: number) => {
    const id = engine.getSheetId(sheet);
    const v = id === undefined ? undefined : engine.getCellValue({ sheet: id, row, col });
    return typeof v === 'number' || typeof v === 'string' || typeof v === 'boolean' ? v : undefined;
  };
  const read = siteFromWorkbook(session.toDoc(), { valueAt });
  const problems = validateSite(read.site);
  const ok = read.site.equipment.filter((r) => EQUIPMENT_KINDS.includes(r.kind) && r.bus !== '');
  const graph = buildBusGraph(ok);
  const busesId = engine.getSheetId(SHEETS.buses);
  const busesSheet = busesId === undefined ? undefined : engine.getSheetValues(busesId);
  const fromSheet = casesOf(busesSheet);
  const cases = fromSheet.length > 0 ? fromSheet : read.site.settings.cases;
  return {
    cases,
    busesSheet,
    model: (caseName) => buildDiagramModel({ site: read.site, problems, busesSheet, caseName, graph }),
  };
}
