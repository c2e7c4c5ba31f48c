// Reading a session's figures (what the page shows) and the core's figures for the same
// workbook (what the command line prints), to compare them.
import { rollUpAll, runawayProblem } from '../../../src/core/site/rollup.ts';
import type { WorkbookSession } from '../../../src/ui/model/session.ts';
import { siteFromWorkbook } from '../../../src/core/workbook/readSite.ts';
import { validateSite, mergeProblems } from '../../../src/core/site/validate.ts';
import { compensate, type CaseCompensation } from '../../../src/core/site/compensate.ts';
import { zoneChargingMost } from '../../../src/core/site/chargingResonance.ts';
import { buildBusGraph } from '../../../src/core/site/graph.ts';
import { planBusColumns } from '../../../src/core/workbook/busColumns.ts';
import { planCompensationColumns } from '../../../src/core/workbook/compensationColumns.ts';
import { designWithSheet } from '../../../src/core/site/sheetChoices.ts';
import { hasBankChoice, type BankChoice } from '../../../src/core/site/bankChoice.ts';
import type { CellContent } from '../../../src/core/workbook/document.ts';
import { shownText } from '../../../src/core/text/cellText.ts';

export interface BusFigures {
  readonly bus: string;
  /** Per case: P, Q, cos φ before; P, Q after. */
  readonly cases: ReadonlyArray<readonly [number, number, number | null, number, number]>;
  /** Cable and line charging of the bus's zone, the most of any case (Compensation sheet, last column). */
  readonly charging: number;
}

export interface Faces {
  readonly buses: readonly BusFigures[];
  readonly within: readonly boolean[];
}

const num = (v: unknown): number => {
  if (typeof v !== 'number') throw new Error(`expected a number, got ${JSON.stringify(v)}`);
  return v;
};

/** What the page's engine shows on the Buses and Compensation sheets. */
export function pageFaces(s: WorkbookSession, cases: readonly string[], busCount: number): Faces {
  const cols = planBusColumns(cases);
  const comp = planCompensationColumns(cases);
  const buses = s.engine.getSheetId('Buses') as number;
  const compId = s.engine.getSheetId('Compensation') as number;
  const v = (sheet: number, row: number, col: number) => s.engine.getCellValue({ sheet, row, col });
  const out: BusFigures[] = [];
  for (let i = 0; i < busCount; i++) {
    const r = i + 1;
    out.push({
      bus: String(v(buses, r, 0)),
      cases: cases.map((_, k) => {
        const cos = v(buses, r, cols.cos[k] as number);
        return [
          num(v(buses, r, cols.p[k] as number)),
          num(v(buses, r, cols.q[k] as number)),
          cos === '' ? null : num(cos),
          num(v(buses, r, cols.pAfter[k] as number)),
          num(v(buses, r, cols.qAfter[k] as number)),
        ] as const;
      }),
      charging: num(v(compId, r, comp.zoneCharging)),
    });
  }
  const within = cases.map((_, k) => v(compId, 1, comp.within[k] as number) === 'yes');
  return { buses: out, within };
}

/** The core's figures for the workbook as saved; undefined when the inputs have errors. */
export function coreFaces(s: WorkbookSession): { faces: Faces; cases: readonly string[] } | undefined {
  const read = siteFromWorkbook(s.toDoc());
  const problems = mergeProblems(read.problems, validateSite(read.site));
  if (problems.some((p) => p.severity === 'error')) return undefined;
  // Losses that run away (a long chain of low-voltage lines): the core refuses, the page shows errors.
  if (rollUpAll(read.site).some((b) => runawayProblem(b) !== undefined)) return undefined;
  const res: CaseCompensation[] = compensate(read.site, read.banks);
  const first = res[0];
  if (!first) return undefined;
  const charging = zoneChargingMost(
    read.site,
    buildBusGraph(read.site.equipment),
    res.map((c) => c.before),
  );
  const buses = first.before.buses.map((b, i) => ({
    bus: b.bus,
    charging: charging.get(b.bus) ?? 0,
    cases: res.map((c) => {
      const before = c.before.buses[i];
      const after = c.after.buses[i];
      if (!before || !after) throw new Error(`bus ${b.bus} missing in case ${c.case}`);
      return [before.p_kw, before.q_kvar, before.cos_phi, after.p_kw, after.q_kvar] as const;
    }),
  }));
  return { faces: { buses, within: res.map((c) => c.within_after) }, cases: read.site.settings.cases };
}

/** Relative difference with a floor of 1 (kW or kvar). */
export function relDiff(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(1, Math.abs(a), Math.abs(b));
}

/** The sizes a Compensation row holds (blank and 0 read as null), in the order of SIZE_KEYS. */
const SIZE_KEYS = ['fixed_kvar', 'step_kvar', 'steps', 'series', 'u_rated_kv', 'reactor_kvar'] as const;

export function rowSizes(s: WorkbookSession, row: number, cases: readonly string[]): CellContent[] {
  const comp = planCompensationColumns(cases);
  const line = s.sheetContents(s.engine.getSheetId('Compensation') as number)[row] ?? [];
  return SIZE_KEYS.map((k) => {
    const v = line[comp.input[k]] ?? null;
    // A series is held as text marked for the engine ('1:2:2); compare the text it shows.
    if (typeof v === 'string') return v === '' ? null : shownText(v);
    return v === 0 ? null : v;
  });
}

/**
 * What a Compensation row should hold after a detuning p (%) is typed alone on it, from the core:
 * the workbook as saved before the edit, the row's sizes and reactor cleared and p typed, read
 * back and designed with designWithSheet (what Checks and `kvar-ledger balance` propose). The
 * design's bank fills the blanks; a capacitor rating typed before stays. Inputs with errors, a
 * design that refuses the site or no bank proposed: the row keeps only what was typed.
 */
export function expectedDetuningRow(
  s: WorkbookSession,
  row: number,
  p: number,
  cases: readonly string[],
): CellContent[] {
  const comp = planCompensationColumns(cases);
  const saved = s.toDoc();
  const doc = {
    ...saved,
    sheets: saved.sheets.map((sh) => {
      if (sh.name !== 'Compensation') return sh;
      const cells = sh.cells.map((line) => [...line]);
      while (cells.length <= row) cells.push([]);
      const line = cells[row] as CellContent[];
      for (const k of SIZE_KEYS) if (k !== 'u_rated_kv') line[comp.input[k]] = null;
      line[comp.input.p_pct] = p;
      return { ...sh, cells };
    }),
  };
  const typedUr = doc.sheets.find((x) => x.name === 'Compensation')?.cells[row]?.[comp.input.u_rated_kv];
  const asTyped = SIZE_KEYS.map((k) =>
    k === 'u_rated_kv' && typedUr != null && typedUr !== '' ? typedUr : null,
  );
  const read = siteFromWorkbook(doc);
  const bus = String(doc.sheets.find((x) => x.name === 'Compensation')?.cells[row]?.[0]);
  if (mergeProblems(read.problems, validateSite(read.site)).some((x) => x.severity === 'error'))
    return asTyped;
  let bank: BankChoice | undefined;
  try {
    bank = designWithSheet(read.site, read.banks).choices.find((c) => c.bus === bus && hasBankChoice(c));
  } catch {
    return asTyped;
  }
  if (!bank) return asTyped;
  return SIZE_KEYS.map((k, i) => {
    if (asTyped[i] !== null) return asTyped[i] ?? null;
    const v = bank[k];
    return v === undefined || v === 0 ? null : v;
  });
}
