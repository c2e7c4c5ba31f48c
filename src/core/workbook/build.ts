// buildWorkbook: a site becomes a workbook of live formulas. Sheets, in order: Site (settings),
// one sheet per equipment class, Buses, Compensation. Inputs are the site's values as typed;
// every computed cell is a formula of catalogue and classic functions that refers to its inputs
// and to the Site sheet by cell, so an edit in the grid flows through to the point of connection.
import type { EquipmentRow, Site } from '../site/model.ts';
import { buildBusGraph, type BusGraph } from '../site/graph.ts';
import { busVoltages } from '../site/voltages.ts';
import type { SheetDoc, WorkbookDoc } from './document.ts';
import { EQUIPMENT_SHEETS, SHEETS, type EquipmentSheetLayout } from './buildLayout.ts';
import { planColumns } from './buildColumns.ts';
import { buildEquipmentSheet, type EquipmentSheetPlan } from './buildEquipment.ts';
import {
  buildBusesSheet,
  layoutCheckRow,
  planBusColumns,
  type BranchRef,
  type BusEntry,
  type Flavour,
} from './buildBuses.ts';
import { buildSettingsSheet } from './buildSettings.ts';
import { buildCompensationSheet, planCompensationColumns, type BankChoice } from './buildCompensation.ts';
import { proposeChoices } from './buildChoices.ts';
import { cellOn } from './buildRefs.ts';

export type { Flavour } from './buildBuses.ts';
export type { BankChoice } from './buildCompensation.ts';

export interface BuildOptions {
  /**
   * 'live': bus totals by one BUS.SUMS call (needs the engine's roll-up plugin; fast for the app).
   * 'portable': only catalogue and classic functions (SUMIF/SUMIFS), for the xlsx export.
   */
  readonly flavour: Flavour;
  /**
   * Banks on the Compensation sheet. Default: the compensation design's proposal for the site
   * (none when it cannot be designed). Pass what siteFromWorkbook read to keep a user's choice.
   */
  readonly banks?: readonly BankChoice[];
}

/** The bus names: the point of connection first, then level by level, then any bus the tree misses. */
function busNames(graph: BusGraph): string[] {
  return [...graph.order, ...[...graph.firstRow.keys()].filter((b) => !graph.level.has(b))];
}

function busEntries(
  site: Site,
  graph: BusGraph,
  names: readonly string[],
  plans: readonly EquipmentSheetPlan[],
): BusEntry[] {
  const where = new Map<EquipmentRow, { plan: EquipmentSheetPlan; row: number }>();
  for (const plan of plans) plan.rows.forEach((r, i) => where.set(r, { plan, row: i + 1 }));
  const voltages = busVoltages(site.equipment).voltages;
  // The row that stated the voltage: same row number, touching the bus, stating that voltage.
  const source = (bus: string, v: { row: number; u_kv: number }) =>
    site.equipment.find(
      (r) => r.row === v.row && r.values.u_kv === v.u_kv && (r.bus === bus || r.to_bus === bus),
    );

  return names.map((name) => {
    const feeder = graph.feeder.get(name);
    const v = voltages.get(name);
    const src = v ? source(name, v) : undefined;
    const at = src ? where.get(src) : undefined;
    const uCol = at?.plan.cols.input.get('u_kv');
    const level = graph.level.get(name);
    return {
      name,
      ...(level !== undefined ? { level } : {}),
      ...(feeder ? { fedBy: feeder.tag, upstream: feeder.bus } : {}),
      ...(at && uCol !== undefined ? { uRef: cellOn(at.plan.layout.sheet, at.row, uCol, true) } : {}),
    };
  });
}

/**
 * An equipment sheet's rows kept together by bus, in the order of the bus list (items on no
 * known bus last), and where each bus's block of rows sits. Each bus then sums its own block, so
 * an edit reaches only that bus and the buses above it.
 */
function planSheet(
  layout: EquipmentSheetLayout,
  site: Site,
  order: ReadonlyMap<string, number>,
): EquipmentSheetPlan {
  const rank = (r: EquipmentRow) => order.get(r.bus) ?? order.size;
  const rows = site.equipment
    .filter((r) => layout.kinds.includes(r.kind))
    .map((r, i) => ({ r, i }))
    .sort((a, b) => rank(a.r) - rank(b.r) || a.i - b.i)
    .map((x) => x.r);
  const blocks = new Map<string, { first: number; last: number }>();
  rows.forEach((r, i) => {
    if (!order.has(r.bus)) return;
    const b = blocks.get(r.bus);
    if (b) b.last = i + 1;
    else blocks.set(r.bus, { first: i + 1, last: i + 1 });
  });
  return { layout, rows, blocks, cols: planColumns(layout, site.settings.cases, rows) };
}

export function buildWorkbook(site: Site, opts: BuildOptions): WorkbookDoc {
  const cases = site.settings.cases;
  const graph = buildBusGraph(site.equipment.filter((r) => r.bus !== ''));
  const names = busNames(graph);
  const order = new Map(names.map((n, i) => [n, i]));
  const plans = EQUIPMENT_SHEETS.map((layout) => planSheet(layout, site, order));
  const buses = busEntries(site, graph, names, plans);
  const busRow = new Map(buses.map((b, i) => [b.name, i + 1]));
  const busCols = planBusColumns(cases);

  const branchesFrom = new Map<string, BranchRef[]>();
  for (const plan of plans) {
    if (plan.layout.role !== 'branch') continue;
    plan.rows.forEach((r, i) => {
      if (!r.to_bus || !busRow.has(r.to_bus) || !busRow.has(r.bus)) return;
      const list = branchesFrom.get(r.bus) ?? [];
      list.push({ plan, row: i + 1, toBus: r.to_bus });
      branchesFrom.set(r.bus, list);
    });
  }

  const ctx = {
    cases,
    busApparentPower: (bus: string, k: number) => {
      const r = busRow.get(bus);
      return r === undefined ? undefined : cellOn(SHEETS.buses, r, busCols.s[k] as number, true);
    },
  };
  const feederOf = new Map<string, BranchRef>();
  const childrenOf = new Map<string, string[]>();
  for (const [bus, list] of branchesFrom) {
    childrenOf.set(
      bus,
      list.map((b) => b.toBus),
    );
    for (const b of list) if (!feederOf.has(b.toBus)) feederOf.set(b.toBus, b);
  }
  const choices = new Map((opts.banks ?? proposeChoices(site)).map((c) => [c.bus, c]));
  const settings = buildSettingsSheet(site.settings);
  if (opts.flavour === 'live') settings.cells.push(layoutCheckRow(plans));
  const sheets: SheetDoc[] = [
    settings,
    ...plans.map((p) => buildEquipmentSheet(p, ctx)),
    buildBusesSheet({ cases, buses, cols: busCols, plans, branchesFrom, flavour: opts.flavour }),
    buildCompensationSheet({
      cases,
      buses,
      busCols,
      cols: planCompensationColumns(cases),
      flavour: opts.flavour,
      feederOf,
      childrenOf,
      banksPlan: plans.find((p) => p.layout.id === 'banks'),
      choices,
    }),
  ];
  return { format: 'kvar-ledger-workbook', version: 1, title: site.settings.name, sheets };
}
