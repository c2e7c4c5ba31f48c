// The peer: LibreOffice opening the exported workbook headless, recalculating every formula on
// load (a throwaway profile sets the recalculation mode to "always") and writing the Buses sheet
// as CSV. A no-op start-up on a tiny file is measured the same way and subtracted. The tiny file
// carries a deliberately wrong cached result, so it also proves that loading recalculates.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import type * as ExcelJSNamespace from 'exceljs';
import { agreeRel, type Check, type StepResult } from './record.ts';
import { withChildCpu } from './childCpu.ts';
import type { RootTotals } from './workbookView.ts';

const RECALC_ALWAYS = `<?xml version="1.0" encoding="UTF-8"?>
<oor:items xmlns:oor="http://openoffice.org/2001/registry" xmlns:xs="http://www.w3.org/2001/XMLSchema" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance">
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="OOXMLRecalcMode" oor:op="fuse"><value>0</value></prop></item>
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="ODFRecalcMode" oor:op="fuse"><value>0</value></prop></item>
</oor:items>
`;

/** CSV filter: comma, double quote, UTF-8, full precision (not "as shown"), one sheet by number. */
const csvFilter = (sheet: number) =>
  `csv:Text - txt - csv (StarCalc):44,34,76,1,,0,false,true,false,false,false,${sheet}`;

export interface Peer {
  readonly dir: string;
  readonly profile: string;
}

export function soffice(): string | undefined {
  const r = spawnSync('soffice', ['--version'], { encoding: 'utf8', timeout: 60_000 });
  return r.status === 0 ? r.stdout.trim() : undefined;
}

export function makePeer(workDir: string): Peer {
  const dir = join(workDir, 'peer');
  const profile = join(dir, 'profile');
  mkdirSync(join(profile, 'user'), { recursive: true });
  writeFileSync(join(profile, 'user', 'registrymodifications.xcu'), RECALC_ALWAYS);
  return { dir, profile };
}

interface Conversion {
  readonly ms: number;
  readonly cpuMs?: number;
  readonly csv?: string;
  readonly error?: string;
  readonly timedOut?: boolean;
}

function convert(peer: Peer, file: string, sheet: number, budgetS: number): Conversion {
  const out = join(peer.dir, 'out');
  rmSync(out, { recursive: true, force: true });
  mkdirSync(out, { recursive: true });
  const args = [
    `-env:UserInstallation=file://${peer.profile}`,
    '--headless',
    '--norestore',
    '--convert-to',
    csvFilter(sheet),
    '--outdir',
    out,
    file,
  ];
  const t0 = performance.now();
  const { value: r, cpuMs } = withChildCpu(() =>
    spawnSync('soffice', args, { encoding: 'utf8', timeout: budgetS * 1_000, killSignal: 'SIGKILL' }),
  );
  const ms = performance.now() - t0;
  if ((r.error as NodeJS.ErrnoException | undefined)?.code === 'ETIMEDOUT')
    return { ms, timedOut: true, error: `exceeded ${budgetS} s` };
  const stem = basename(file).replace(/\.xlsx$/, '');
  const made = existsSync(out)
    ? readdirSync(out).find((f) => f.startsWith(stem) && f.endsWith('.csv'))
    : undefined;
  if (r.status !== 0 || made === undefined)
    return {
      ms,
      error: `soffice exit ${r.status}, no CSV written: ${(r.stderr || r.stdout).trim().split('\n')[0] ?? ''}`,
    };
  return { ms, ...(cpuMs !== undefined ? { cpuMs } : {}), csv: readFileSync(join(out, made), 'utf8') };
}

/** A tiny workbook whose one formula has a wrong cached result: 2 after a recalculation, 999 if not. */
async function tinyFile(peer: Peer): Promise<string> {
  const mod = (await import('exceljs')) as unknown as {
    default?: typeof ExcelJSNamespace;
  } & typeof ExcelJSNamespace;
  const ExcelJS = mod.default ?? mod;
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet('Tiny');
  ws.getCell('A1').value = 1;
  ws.getCell('A2').value = { formula: 'A1*2', result: 999 };
  const file = join(peer.dir, 'tiny.xlsx');
  writeFileSync(file, new Uint8Array((await wb.xlsx.writeBuffer()) as ArrayBuffer));
  return file;
}

export interface Startup {
  readonly result: StepResult;
  readonly recalculates: boolean;
}

/** Fastest wall time and least CPU time of a set of runs (the machine is shared: the minimum is the least disturbed). */
function fastest(runs: readonly Conversion[]) {
  const ms = runs.map((r) => r.ms);
  const cpu = runs.map((r) => r.cpuMs).filter((x): x is number => x !== undefined);
  return {
    ms: Math.min(...ms),
    minMs: Math.min(...ms),
    runs: ms.length,
    ...(cpu.length > 0 ? { cpuMs: Math.min(...cpu) } : {}),
  };
}

const wallList = (runs: readonly Conversion[]) => runs.map((r) => Math.round(r.ms)).join(', ');

/** One unmeasured run (the profile is created), then five. */
export async function measureStartup(peer: Peer): Promise<Startup> {
  const tiny = await tinyFile(peer);
  convert(peer, tiny, 1, 120);
  const runs = [0, 1, 2, 3, 4].map(() => convert(peer, tiny, 1, 60));
  const bad = runs.find((r) => r.error !== undefined);
  if (bad)
    return {
      result: { step: 'peerStartup', rows: 0, status: 'failed', note: bad.error as string },
      recalculates: false,
    };
  const lines = (runs[0]?.csv ?? '').trim().split(/\r?\n/);
  const recalculates = lines[1]?.trim() === '2';
  const check: Check = recalculates
    ? { agrees: true, detail: 'a stale cached result (999) came out recalculated (2): loading recalculates' }
    : {
        agrees: false,
        detail: `the stale cached result was not recalculated (got ${lines[1] ?? 'nothing'}); peer times do not include recalculation`,
      };
  return {
    result: {
      step: 'peerStartup',
      rows: 0,
      status: 'ok',
      ...fastest(runs),
      note: `tiny xlsx to CSV; wall of ${wallList(runs)} ms`,
      check,
    },
    recalculates,
  };
}

/** Root P and Q of the first case from the Buses CSV, compared with the floor. */
function checkCsv(csv: string, floor: RootTotals, caseName: string): Check {
  const rows = csv
    .trim()
    .split(/\r?\n/)
    .map((l) => l.split(','));
  const header = rows[0] ?? [];
  const pCol = header.indexOf(`P ${caseName} (kW)`);
  const qCol = header.indexOf(`Q ${caseName} (kvar)`);
  const root = rows[1] ?? [];
  if (pCol < 0 || qCol < 0)
    return { agrees: false, detail: `the CSV of the Buses sheet has no column "P ${caseName} (kW)"` };
  const p = Number(root[pCol]),
    q = Number(root[qCol]);
  const ok = root[0] === floor.bus && agreeRel(p, floor.p[0] as number) && agreeRel(q, floor.q[0] as number);
  return ok
    ? {
        agrees: true,
        detail: `LibreOffice's recalculated root ${floor.bus} P and Q (first case) equal the floor to 1e-9 relative`,
      }
    : {
        agrees: false,
        detail: `LibreOffice gives ${root[0]} P ${root[pCol]} Q ${root[qCol]}; the floor ${floor.bus} P ${floor.p[0]} Q ${floor.q[0]}`,
      };
}

/**
 * The exported workbook recalculated by the peer: gross (whole process, fastest of up to three
 * runs within a third of the budget) and net (gross minus the start-up, wall and CPU alike).
 * `busesSheet` is the 1-based position of the Buses sheet in the file.
 */
export function measurePeer(
  peer: Peer,
  xlsx: string,
  busesSheet: number,
  floor: RootTotals,
  caseName: string,
  startup: StepResult,
  rows: number,
  budgetS: number,
): StepResult[] {
  const runs: Conversion[] = [];
  let spent = 0;
  while (runs.length < 3 && (runs.length === 0 || spent < (budgetS * 1_000) / 3)) {
    const c = convert(peer, xlsx, busesSheet, budgetS);
    if (c.error !== undefined) {
      const status = c.timedOut ? ('exceeded' as const) : ('failed' as const);
      return [
        { step: 'peerGross', rows, status, note: c.error },
        { step: 'peerRecalc', rows, status, note: c.error },
      ];
    }
    runs.push(c);
    spent += c.ms;
  }
  const check = checkCsv(runs[0]?.csv as string, floor, caseName);
  const gross = fastest(runs);
  const ms = Math.max(0, gross.ms - (startup.ms ?? 0));
  const cpu =
    gross.cpuMs !== undefined && startup.cpuMs !== undefined
      ? { cpuMs: Math.max(0, gross.cpuMs - startup.cpuMs) }
      : {};
  return [
    {
      step: 'peerGross',
      rows,
      status: 'ok',
      ...gross,
      note: `soffice --headless --convert-to csv (Buses sheet); wall of ${wallList(runs)} ms`,
      check,
    },
    {
      step: 'peerRecalc',
      rows,
      status: 'ok',
      ms,
      runs: gross.runs,
      ...cpu,
      note: `fastest gross ${Math.round(gross.ms)} ms − fastest start-up ${Math.round(startup.ms ?? 0)} ms`,
    },
  ];
}
