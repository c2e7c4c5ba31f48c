// One home for the names the workbook's builder, engine, page, charts and export share: sheet
// names and the header texts of computed columns. Readers find columns by these texts, so a
// text written here is the contract, never repeated elsewhere.
import {
  BANKS_SHEET,
  CABLES_SHEET,
  GENERATORS_SHEET,
  LINES_SHEET,
  LOADS_SHEET,
  MOTORS_SHEET,
  TRANSFORMERS_SHEET,
} from '../kinds/index.ts';

export const SHEETS = {
  settings: 'Site',
  motors: MOTORS_SHEET.name,
  loads: LOADS_SHEET.name,
  generators: GENERATORS_SHEET.name,
  transformers: TRANSFORMERS_SHEET.name,
  lines: LINES_SHEET.name,
  cables: CABLES_SHEET.name,
  banks: BANKS_SHEET.name,
  buses: 'Buses',
  compensation: 'Compensation',
  quantities: 'Quantities and cost',
  options: 'Design options',
} as const;

/** Header texts of the load-factor and computed columns, per case where the text names one. */
export const HEADERS = {
  loadDefault: 'Load (default)',
  loadCase: (c: string) => `Load: ${c}`,
  other: 'Other values',
  inService: 'In service',
  loadUsed: (c: string) => `Load used: ${c}`,
  p: (c: string) => `P ${c} (kW)`,
  q: (c: string) => `Q ${c} (kvar)`,
  resonance: 'Plain capacitor, full output (kvar)',
  sCarried: (c: string) => `S carried ${c} (kVA)`,
  sCarriedAfter: (c: string) => `S carried after ${c} (kVA)`,
  loading: (c: string) => `Loading ${c} (%)`,
  loadingAfter: (c: string) => `Loading after ${c} (%)`,
  pLoss: (c: string) => `P loss ${c} (kW)`,
  pLossAfter: (c: string) => `P loss after ${c} (kW)`,
  qLoss: (c: string) => `Q absorbed ${c} (kvar)`,
  qLossAfter: (c: string) => `Q absorbed after ${c} (kvar)`,
  qCharging: 'Q delivered (kvar)',
} as const;

/** Header texts of the Buses sheet. */
export const BUS_HEADERS = {
  bus: 'Bus',
  level: 'Level',
  fedBy: 'Fed by',
  upstream: 'Upstream bus',
  u: 'U (kV)',
  p: (c: string) => `P ${c} (kW)`,
  q: (c: string) => `Q ${c} (kvar)`,
  qAbs: (c: string) => `Q absorbed ${c} (kvar)`,
  qDel: (c: string) => `Q delivered ${c} (kvar)`,
  s: (c: string) => `S ${c} (kVA)`,
  cos: (c: string) => `cos φ ${c}`,
  tan: (c: string) => `tan φ ${c}`,
  sense: (c: string) => `Sense ${c}`,
  pAfter: (c: string) => `P after ${c} (kW)`,
  qAfter: (c: string) => `Q after ${c} (kvar)`,
  qAbsAfter: (c: string) => `Q absorbed after ${c} (kvar)`,
  qDelAfter: (c: string) => `Q delivered after ${c} (kvar)`,
  sAfter: (c: string) => `S after ${c} (kVA)`,
  cosAfter: (c: string) => `cos φ after ${c}`,
  pOwn: (c: string) => `P own items ${c} (kW)`,
  qAbsOwn: (c: string) => `Q absorbed own items ${c} (kvar)`,
  qDelOwn: (c: string) => `Q delivered own items ${c} (kvar)`,
  qOwn: (c: string) => `Q own items ${c} (kvar)`,
  tanAfter: (c: string) => `tan φ after ${c}`,
} as const;

/** Formats of computed columns. */
export const FORMATS = {
  kw: '0.0',
  kvar: '0.0',
  kva: '0.0',
  pf: '0.000',
  pct: '0.0',
  count: '0',
  kv: '0.0##',
} as const;

/** Sheets Kvar Ledger keeps in step with the equipment: they can be emptied, not deleted or renamed. */
export function isBuiltInSheet(name: string, equipmentSheets: readonly string[]): boolean {
  const n = name.toLowerCase();
  return [
    SHEETS.settings,
    SHEETS.buses,
    SHEETS.compensation,
    SHEETS.quantities,
    SHEETS.options,
    ...equipmentSheets,
  ].some((s) => s.toLowerCase() === n);
}
