// `kvar-ledger balance <list.csv|book.xlsx|template.json> [--case NAME] [--hz 50|60] [--json]`:
// the bus balance of one operating case, the compensation designed over all cases, and the
// warnings. Bad input (unreadable file, a row with an error, an unknown case) exits 1 with every
// problem said with its row and column.
import { readFileSync } from 'node:fs';
import { basename, extname } from 'node:path';
import { parseArgs } from './args.ts';
import type { CliIo } from './io.ts';
import { readEquipmentFile } from '../io/import/table.ts';
import { describeProblem } from '../io/xlsx/fileProblem.ts';
import type { Site } from '../core/site/model.ts';
import { parseEquipmentTable } from '../core/site/parse.ts';
import type { Problem } from '../core/site/problems.ts';
import { readSiteFile } from '../core/site/siteFile.ts';
import { siteFromWorkbook } from '../core/workbook/readSite.ts';
import { mergeProblems, validateSite } from '../core/site/validate.ts';
import { resolveCase } from '../core/site/cases.ts';
import { rollUpAll, SiteStructureError, type BusBalance, type CaseBalance } from '../core/site/rollup.ts';
import { designCompensation, type CompensationDesign } from '../core/site/compensation.ts';

const USAGE = `usage: kvar-ledger balance <list.csv|book.xlsx|template.json> [--case NAME] [--hz 50|60] [--json]
The kW and kvar of every bus in one operating case, rolled up to the point of connection,
with the compensation designed over all cases and its warnings.
  --case NAME  the operating case to show (default: the first)
  --hz 50|60   site frequency (overrides the file; a list alone is taken as 50 Hz)
  --json       print {case, buses, root, compensation, warnings} as JSON
A CSV or xlsx list carries no settings: the requirement is then taken as cos φ ≥ 0.95.
`;

/** Requirement assumed for a bare equipment list (common practice: many tariffs start at 0.95). */
const LIST_REQUIREMENT = { kind: 'cosphi', target: 0.95 } as const;
const CAUTION =
  'Estimate only: capacitor banks, resonance and overvoltage can hurt people and plant; the final design follows local codes, the utility and a licensed engineer.';

type Loaded = { ok: true; site: Site; problems: Problem[] } | { ok: false; message: string };

async function load(file: string, hz: 50 | 60 | undefined): Promise<Loaded> {
  let bytes: Uint8Array;
  try {
    bytes = readFileSync(file);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    return {
      ok: false,
      message: `cannot read ${file}: ${code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a directory' : e instanceof Error ? e.message : String(e)}`,
    };
  }
  if (extname(file).toLowerCase() === '.json') {
    const { site, problems } = readSiteFile(new TextDecoder().decode(bytes));
    const s = hz ? { ...site, settings: { ...site.settings, hz } } : site;
    return { ok: true, site: s, problems };
  }
  if (extname(file).toLowerCase() === '.xlsx') {
    const own = await siteFromOwnExport(bytes, hz);
    if (own) return own;
  }
  const table = await readEquipmentFile(basename(file), bytes);
  if (!table.ok) return { ok: false, message: describeProblem(table.problem) };
  const rows = table.value.rows.map((r) =>
    r.map((c) => (c === null ? '' : typeof c === 'boolean' ? (c ? 'TRUE' : 'FALSE') : String(c))),
  );
  const parsed = parseEquipmentTable(rows, { decimalComma: table.value.decimalComma });
  const site: Site = {
    settings: { name: basename(file), hz: hz ?? 50, cases: parsed.cases, requirement: LIST_REQUIREMENT },
    equipment: parsed.equipment,
  };
  return { ok: true, site, problems: parsed.problems };
}

/**
 * A workbook exported by Kvar Ledger carries the whole site (its first sheet is the cover, not
 * an equipment list): read the site back from its sheets. undefined = not one of ours.
 */
async function siteFromOwnExport(bytes: Uint8Array, hz: 50 | 60 | undefined): Promise<Loaded | undefined> {
  const { importKvarXlsx } = await import('../io/xlsx/index.ts');
  const imported = await importKvarXlsx(bytes);
  if (!imported.ok || imported.restored === 'plain') return undefined;
  const { site, problems } = siteFromWorkbook(imported.doc);
  const s = hz ? { ...site, settings: { ...site.settings, hz } } : site;
  return { ok: true, site: s, problems };
}

function busJson(b: BusBalance) {
  return {
    bus: b.bus,
    level: b.level,
    fed_by: b.fed_by ?? null,
    u_kv: b.u_kv ?? null,
    p_kw: b.p_kw,
    q_kvar: b.q_kvar,
    q_absorbed_kvar: b.q_absorbed_kvar,
    q_delivered_kvar: b.q_delivered_kvar,
    s_kva: b.s_kva,
    cos_phi: b.cos_phi,
    tan_phi: b.tan_phi,
    sense: b.sense,
    own_p_kw: b.own_p_kw,
    own_q_kvar: b.own_q_kvar,
  };
}

function warningJson(w: Problem & { code?: string; case?: string }) {
  return {
    severity: w.severity,
    code: w.code ?? 'input',
    message: w.message,
    row: w.row ?? null,
    column: w.column ?? null,
    bus: w.bus ?? null,
    tag: w.tag ?? null,
    case: w.case ?? null,
  };
}

function toJson(site: Site, bal: CaseBalance, design: CompensationDesign, warnings: readonly Problem[]) {
  const outcome = design.cases.find((c) => c.case === bal.case);
  const after = design.after.find((a) => a.case === bal.case);
  return {
    site: site.settings.name,
    case: bal.case,
    cases: site.settings.cases,
    hz: bal.hz,
    buses: bal.buses.map(busJson),
    root: busJson(bal.root),
    compensation: {
      requirement: design.requirement,
      lag_tan: design.lag_tan,
      lead_tan: design.lead_tan,
      need_kvar: outcome?.need ?? null,
      met_before: outcome?.met_before ?? null,
      met_after: outcome?.met_after ?? null,
      root_after: after ? busJson(after.root) : null,
      banks: design.banks.map((b) => ({ ...b, steps_in_case: b.steps_in[bal.case] ?? 0 })),
      reactors: design.reactors.map((r) => ({ ...r, in_service_in_case: r.in_service[bal.case] ?? false })),
      bus_needs: design.needs
        .filter((n) => n.case === bal.case)
        .map((n) => ({ bus: n.bus, capacitive_kvar: n.capacitive_kvar, inductive_kvar: n.inductive_kvar })),
    },
    warnings: warnings.map(warningJson),
    caution: CAUTION,
  };
}

const num = (x: number | null | undefined, d = 1) => (x === null || x === undefined ? '–' : x.toFixed(d));

function table(header: string[], rows: string[][], leftCols = 1): string {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const line = (cells: string[]) =>
    cells
      .map((c, i) => (i < leftCols ? c.padEnd(widths[i] as number) : c.padStart(widths[i] as number)))
      .join('  ')
      .trimEnd();
  return [line(header), line(widths.map((w) => '-'.repeat(w))), ...rows.map(line)].join('\n') + '\n';
}

function toText(
  site: Site,
  bal: CaseBalance,
  design: CompensationDesign,
  warnings: readonly Problem[],
): string {
  const out: string[] = [];
  out.push(
    `${site.settings.name}\ncase ${bal.case} (of ${site.settings.cases.join(', ')}), ${bal.hz} Hz; requirement: ${design.requirement}\n\n`,
  );
  const rows = bal.buses.map((b) => [
    '  '.repeat(b.level) + b.bus,
    b.fed_by ?? '',
    num(b.u_kv ?? null, 3),
    num(b.p_kw),
    num(b.q_kvar),
    num(b.q_absorbed_kvar),
    num(b.q_delivered_kvar),
    num(b.s_kva),
    num(b.cos_phi, 3),
    num(b.tan_phi, 3),
    b.sense,
  ]);
  out.push(
    table(
      ['bus', 'fed by', 'U kV', 'P kW', 'Q kvar', 'Q abs', 'Q del', 'S kVA', 'cos φ', 'tan φ', 'sense'],
      rows,
      2,
    ),
  );
  const o = design.cases.find((c) => c.case === bal.case);
  const r = bal.root;
  out.push(
    `\npoint of connection ${r.bus}: P ${num(r.p_kw)} kW, Q ${num(r.q_kvar)} kvar, cos φ ${num(r.cos_phi, 3)} ${r.sense}`,
  );
  if (o)
    out.push(
      o.met_before
        ? ' — meets the requirement\n'
        : ` — needs ${o.need.capacitive_kvar > 0 ? `${num(o.need.capacitive_kvar)} kvar capacitive` : `${num(o.need.inductive_kvar)} kvar inductive`}\n`,
    );
  if (design.banks.length + design.reactors.length > 0) {
    out.push('\ncompensation proposed (sized over all cases):\n');
    for (const b of design.banks) {
      const parts = [
        b.fixed_kvar > 0 ? `fixed ${b.fixed_kvar} kvar` : '',
        b.steps > 0 ? `${b.steps} × ${b.step_kvar} kvar steps` : '',
      ]
        .filter(Boolean)
        .join(' + ');
      out.push(
        `  ${b.bus} (${b.u_kv} kV): ${parts} = ${b.total_kvar} kvar; ${b.p_pct > 0 ? `detuned ${b.p_pct} % (tuning order ${num(b.tuning_order, 2)})` : 'no detuning'}; ` +
          `capacitors see ${num(b.u_cap_kv, 3)} kV, rated ${b.u_rated_kv} kV; steps in this case ${b.steps_in[bal.case] ?? 0}; voltage rise per step ${num(b.vrise_step_pct, 2)} %\n    why: ${b.why}\n`,
      );
    }
    for (const x of design.reactors)
      out.push(
        `  ${x.bus} (${x.u_kv} kV): shunt reactor ${x.q_kvar} kvar, ${x.in_service[bal.case] ? 'in service' : 'out of service'} in this case\n`,
      );
    if (o)
      out.push(
        `  after: P ${num(o.after.p_kw)} kW, Q ${num(o.after.q_kvar)} kvar, cos φ ${num(o.after.cos_phi, 3)} ${o.after.sense} — ${o.met_after ? 'meets the requirement' : 'still outside the requirement'}\n`,
      );
  }
  if (warnings.length > 0)
    out.push('\nwarnings:\n' + warnings.map((w) => `  ${w.severity.padEnd(7)} ${w.message}\n`).join(''));
  out.push(`\n${CAUTION}\n`);
  return out.join('');
}

export async function run(argv: string[], io: CliIo): Promise<number> {
  const parsed = parseArgs(argv, { command: 'balance', flags: ['--json'], values: ['--case', '--hz'] });
  if (!parsed.ok) {
    io.err(`${parsed.message}\n${USAGE}`);
    return 1;
  }
  const { positional, flags, values } = parsed.args;
  if (flags.has('--help')) {
    io.out(USAGE);
    return 0;
  }
  if (positional.length !== 1) {
    io.err(
      `balance: give exactly one file (a .csv or .xlsx equipment list or a .json site file); got ${positional.length}\n${USAGE}`,
    );
    return 1;
  }
  const file = positional[0] as string;
  const hzText = values.get('--hz');
  if (hzText !== undefined && hzText !== '50' && hzText !== '60') {
    io.err(`balance: --hz must be 50 or 60; got "${hzText}"\n`);
    return 1;
  }
  const loaded = await load(file, hzText === undefined ? undefined : (Number(hzText) as 50 | 60));
  if (!loaded.ok) {
    io.err(`balance: ${loaded.message}\n`);
    return 1;
  }
  const { site } = loaded;
  // A file that could not be read at all has no rows to validate; say only why it could not.
  const unreadable = site.equipment.length === 0 && loaded.problems.some((p) => p.severity === 'error');
  const problems = mergeProblems(loaded.problems, unreadable ? [] : validateSite(site));
  const errors = problems.filter((p) => p.severity === 'error');
  if (errors.length > 0) {
    io.err(
      `balance: ${file} has ${errors.length} error${errors.length === 1 ? '' : 's'}; nothing was balanced:\n` +
        problems.map((p) => `  ${p.severity}: ${p.message}\n`).join(''),
    );
    return 1;
  }
  const caseName = values.get('--case') ?? (site.settings.cases[0] as string);
  const found = resolveCase(site.settings.cases, caseName);
  if (found === undefined) {
    io.err(
      `balance: --case "${caseName}" is not a case of ${file}; its cases are ${site.settings.cases.join(', ')}\n`,
    );
    return 1;
  }
  let balances: CaseBalance[];
  try {
    balances = rollUpAll(site);
  } catch (e) {
    if (e instanceof SiteStructureError) {
      io.err(`balance: ${file}: ${e.message}\n`);
      return 1;
    }
    throw e;
  }
  const bal = balances.find((b) => b.case === found) as CaseBalance;
  const design = designCompensation(site, balances);
  const warnings = [
    ...problems,
    ...bal.problems,
    ...design.warnings.filter((w) => w.case === undefined || w.case === found),
  ];
  io.out(
    flags.has('--json')
      ? JSON.stringify(toJson(site, bal, design, warnings), null, 2) + '\n'
      : toText(site, bal, design, warnings),
  );
  return 0;
}
