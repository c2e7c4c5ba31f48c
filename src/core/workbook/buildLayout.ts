// The shape of the workbook: sheet names and, for each equipment sheet, its input columns in
// the interchange terms. The builder writes these columns and siteFromWorkbook reads them back
// by their header text, so the two cannot drift apart.
import type { EquipmentKind, NumericColumn, TextColumn } from '../site/model.ts';

export const SHEETS = {
  settings: 'Site',
  motors: 'Motors',
  loads: 'Loads',
  generators: 'Generators',
  transformers: 'Transformers',
  lines: 'Lines',
  cables: 'Cables',
  banks: 'Capacitors and reactors',
  buses: 'Buses',
  compensation: 'Compensation',
} as const;

export interface InputColumn {
  readonly key: TextColumn | NumericColumn;
  readonly header: string;
  readonly format?: string;
  readonly width: number;
}

/** How an equipment sheet's rows reach the bus totals. */
export type SheetRole =
  /** Shunt items: per-case P and Q, summed per bus by name. */
  | 'shunt'
  /** Transformers and lines: they carry the bus they feed, referenced cell by cell. */
  | 'branch';

export interface EquipmentSheetLayout {
  readonly id: keyof typeof SHEETS;
  readonly sheet: string;
  readonly kinds: readonly EquipmentKind[];
  readonly role: SheetRole;
  /** Shunt sheets with active power (motors, loads, generators) get P columns per case. */
  readonly hasP: boolean;
  /** Sheets whose items follow the per-case load factor. */
  readonly usesLoad: boolean;
  readonly inputs: readonly InputColumn[];
  readonly purpose: string;
}

const KV = '0.0##';
const col = (key: InputColumn['key'], header: string, width: number, format?: string): InputColumn =>
  format === undefined ? { key, header, width } : { key, header, width, format };

const TAG = col('tag', 'Tag', 12);
const DESCRIPTION = col('description', 'Description', 24);
const BUS = col('bus', 'Bus', 12);
const KIND = col('kind', 'Kind', 11);
const TO_BUS = col('to_bus', 'Feeds bus', 12);
const QTY = col('qty', 'Qty', 6, '0');
const RUNNING = col('running', 'Running', 8, '0');
const U = col('u_kv', 'U (kV)', 8, KV);
const COS = col('cos_phi', 'cos φ', 7, '0.000');

export const EQUIPMENT_SHEETS: readonly EquipmentSheetLayout[] = [
  {
    id: 'motors',
    sheet: SHEETS.motors,
    kinds: ['motor'],
    role: 'shunt',
    hasP: true,
    usesLoad: true,
    purpose:
      "Motors: rated output, efficiency and cos φ in; electrical P (KW.MOTOR) and Q (KVAR.MOTOR) at each case's load factor out, times the units running.",
    inputs: [
      TAG,
      DESCRIPTION,
      BUS,
      QTY,
      RUNNING,
      col('p_kw', 'Rated output (kW)', 10, '0.0'),
      col('eff', 'Efficiency', 9, '0.000'),
      COS,
      col('i0_pct', 'No-load current (%)', 10, '0.0'),
      U,
    ],
  },
  {
    id: 'loads',
    sheet: SHEETS.loads,
    kinds: ['load'],
    role: 'shunt',
    hasP: true,
    usesLoad: true,
    purpose: 'Other loads: P = rated P × load factor, Q from cos φ (KVAR.LOAD), times the units running.',
    inputs: [TAG, DESCRIPTION, BUS, QTY, RUNNING, col('p_kw', 'P (kW)', 10, '0.0'), COS, U],
  },
  {
    id: 'generators',
    sheet: SHEETS.generators,
    kinds: ['generator'],
    role: 'shunt',
    hasP: true,
    usesLoad: true,
    purpose:
      'Generators: they deliver P (negative in bus totals) and, over-excited, deliver kvar (KVAR.GEN).',
    inputs: [TAG, DESCRIPTION, BUS, QTY, RUNNING, col('p_kw', 'P (kW)', 10, '0.0'), COS, U],
  },
  {
    id: 'transformers',
    sheet: SHEETS.transformers,
    kinds: ['transformer'],
    role: 'branch',
    hasP: true,
    usesLoad: false,
    purpose:
      'Transformers: each carries the apparent power of the bus it feeds and adds its losses at that loading (KW.XFMR.LOSS, KVAR.XFMR.MAG, KVAR.XFMR.LEAK) to its upstream bus; units in parallel share the load.',
    inputs: [
      TAG,
      DESCRIPTION,
      BUS,
      TO_BUS,
      QTY,
      RUNNING,
      col('s_kva', 'Rating (kVA)', 10, '0'),
      col('uk_pct', 'uk (%)', 7, '0.00'),
      col('p0_kw', 'No-load loss (kW)', 10, '0.00'),
      col('pk_kw', 'Load loss (kW)', 10, '0.00'),
      col('i0_pct', 'No-load current (%)', 10, '0.00'),
      col('u_kv', 'U secondary (kV)', 9, KV),
    ],
  },
  {
    id: 'lines',
    sheet: SHEETS.lines,
    kinds: ['line'],
    role: 'branch',
    hasP: false,
    usesLoad: false,
    purpose:
      'Overhead lines: each carries the bus it feeds; series reactance absorbs kvar with the load, charging delivers kvar (KVAR.LINE).',
    inputs: [
      TAG,
      DESCRIPTION,
      BUS,
      TO_BUS,
      QTY,
      RUNNING,
      U,
      col('l_mh_km', 'L (mH/km)', 9, '0.000'),
      col('c_nf_km', 'C (nF/km)', 9, '0.0'),
      col('len_km', 'Length (km)', 9, '0.00'),
    ],
  },
  {
    id: 'cables',
    sheet: SHEETS.cables,
    kinds: ['cable'],
    role: 'shunt',
    hasP: false,
    usesLoad: true,
    purpose:
      'Cables: charging kvar delivered while energised (KVAR.CABLE); load factor 0 = de-energised in that case.',
    inputs: [
      TAG,
      DESCRIPTION,
      BUS,
      QTY,
      RUNNING,
      U,
      col('c_uf_km', 'C (µF/km)', 9, '0.000'),
      col('len_km', 'Length (km)', 9, '0.00'),
    ],
  },
  {
    id: 'banks',
    sheet: SHEETS.banks,
    kinds: ['capacitor', 'reactor'],
    role: 'shunt',
    hasP: false,
    usesLoad: true,
    purpose:
      'Capacitor steps and shunt reactors already on site: output at the operating voltage (KVAR.CAPBANK, KVAR.REACTOR); the load factor is the share of the nameplate switched in.',
    inputs: [
      TAG,
      DESCRIPTION,
      BUS,
      KIND,
      QTY,
      RUNNING,
      col('q_kvar', 'Rated output (kvar)', 10, '0.0'),
      col('u_rated_kv', 'Rated voltage (kV)', 9, KV),
      U,
      col('p_pct', 'Detuning p (%)', 9, '0.00'),
    ],
  },
];

export function layoutForKind(kind: EquipmentKind): EquipmentSheetLayout {
  const found = EQUIPMENT_SHEETS.find((l) => l.kinds.includes(kind));
  if (!found) throw new Error(`no equipment sheet holds kind ${kind}`);
  return found;
}

/** Header texts of the per-case and bookkeeping columns, shared by builder and reader. */
export const HEADERS = {
  inService: 'In service',
  loadDefault: 'Load (default)',
  loadCase: (c: string) => `Load: ${c}`,
  loadUsed: (c: string) => `Load used: ${c}`,
  other: 'Other values',
  p: (c: string) => `P ${c} (kW)`,
  q: (c: string) => `Q ${c} (kvar)`,
  sLoad: (c: string) => `S carried ${c} (kVA)`,
  loading: (c: string) => `Loading ${c} (%)`,
  pLoss: (c: string) => `P loss ${c} (kW)`,
  qLoss: (c: string) => `Q loss ${c} (kvar)`,
  qSeries: (c: string) => `Q absorbed ${c} (kvar)`,
  qCharging: 'Q delivered (kvar)',
  plainCap: 'Plain capacitor, full output (kvar)',
} as const;

/** Formats and widths of computed columns. */
export const FORMATS = { kw: '0.0', kvar: '0.0', kva: '0.0', pf: '0.000', pct: '0.0', count: '0' } as const;
