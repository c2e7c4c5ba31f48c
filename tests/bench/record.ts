// The shape of a measurement, shared by the steps, the child-process phases, the peer, the
// browser part and the report. A step that could not give a number says why in `status` and
// `note`; there are never made-up figures.

export const STEP_NAMES = {
  floor: 'Floor: typed-array loop, all cases',
  rollup: 'Core rollUp, all cases',
  buildLive: 'buildWorkbook (live) to a WorkbookDoc',
  buildPortable: 'buildWorkbook (portable) to a WorkbookDoc',
  engineBuild: 'Engine build (catalogue + bus roll-up plugin)',
  editOne: 'One edit (motor load) to updated root P',
  editBatch: 'Batch of 1,000 edits to updated root P',
  modelOpen: "Page's model: open the workbook (engine + living model)",
  modelEditOne: "Page's model: one load factor typed to updated root P",
  modelInsertRow: "Page's model: row inserted, motor typed in, to updated root P",
  modelPaste500: "Page's model: 500 motor rows pasted to updated root P",
  xlsxExport: 'xlsx export (portable workbook, results from the live engine)',
  xlsxImport: 'xlsx import',
  cliStart: 'CLI start-up alone (--version), process',
  cliBalance: 'CLI balance --json, whole process',
  cliExport: 'CLI export <site> <out.xlsx>, whole process',
  peerStartup: 'Peer: LibreOffice no-op start-up (tiny file)',
  peerGross: 'Peer: LibreOffice load + recalc + CSV, whole process',
  peerRecalc: 'Peer: LibreOffice recalculation (gross − start-up)',
} as const;

export type StepId = keyof typeof STEP_NAMES;

export type Status = 'ok' | 'exceeded' | 'not available' | 'failed' | 'not run';

export interface Check {
  /** true when the step's bus totals agree with the reference named in `detail`. */
  readonly agrees: boolean;
  readonly detail: string;
}

export interface StepResult {
  readonly step: StepId;
  readonly rows: number;
  readonly status: Status;
  /** Median of `runs` timings (one run for slow steps); whole-process steps give their fastest run. */
  readonly ms?: number;
  readonly minMs?: number;
  readonly runs?: number;
  /** Whole-process steps: CPU time of the process (user + system, minimum over the runs). */
  readonly cpuMs?: number;
  readonly note?: string;
  readonly check?: Check;
}

/** Peak resident memory of a child-process phase, MB (from process.resourceUsage().maxRSS). */
export interface MemoryResult {
  readonly rows: number;
  readonly phase: string;
  readonly peakRssMb: number;
  /** false when the phase was stopped before its end (the peak is then a lower bound). */
  readonly complete: boolean;
}

export interface BrowserResult {
  readonly status: Status;
  readonly note?: string;
  readonly rows?: number;
  readonly openMs?: number;
  readonly editPaintMs?: number;
  readonly editPaintRuns?: number;
  /** A row inserted below a motor (to the repainted grid) plus Fill down of that motor into it (to the repainted totals). */
  readonly structuralPaintMs?: number;
  /** Navigation (a reload restoring the workbook) to the first edit's repainted totals, page clock. */
  readonly firstEditMs?: number;
  /** The longest gap between frames while the grid scrolls during an edit's recalculation. */
  readonly scrollLongestFrameMs?: number;
  readonly jsHeapUsedMb?: number;
  readonly initialJsBytes?: number;
  readonly initialJsGzipBytes?: number;
  readonly check?: Check;
}

/** Relative agreement of two totals, with a scale floor so a zero total does not divide. */
export function agreeRel(a: number, b: number, tol = 1e-9): boolean {
  return Math.abs(a - b) <= tol * Math.max(1, Math.abs(a), Math.abs(b));
}
