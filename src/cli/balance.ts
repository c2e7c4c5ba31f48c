// `kvar-ledger balance <file> [--case NAME] [site options] [--json]`: the bus balance of one
// operating case, the compensation designed over all cases, and the warnings. The file is read by
// the command line's one loader (loadSite.ts): a workbook saved by the app, an xlsx exported by
// Kvar Ledger, a site file, or an equipment list. Bad input exits 1 with every problem on one
// line with its row and column; a wrong command line exits 2.
import { parseArgs } from './args.ts';
import type { CliIo } from './io.ts';
import { loadSite } from './loadSite.ts';
import { EXIT_HELP, EXIT_OK, inputError, refuseErrors, usageError } from './report.ts';
import { SITE_LIST_OPTIONS, SITE_OPTIONS_HELP, SITE_VALUE_OPTIONS, readSiteOptions } from './siteOptions.ts';
import type { Site } from '../core/site/model.ts';
import type { Problem } from '../core/site/problems.ts';
import { rollUpAll, SiteStructureError, type BusBalance, type CaseBalance } from '../core/site/rollup.ts';
import { designCompensation, type CompensationDesign } from '../core/site/compensation.ts';

const USAGE = `usage: kvar-ledger balance <file> [--case NAME] [site options] [--json]
The kW and kvar of every bus in one operating case, rolled up to the point of connection,
with the compensation designed over all cases and its warnings. <file> is a workbook saved
by the app (*.kvar.json), an xlsx exported by Kvar Ledger, a site file (templates/*.json),
or an equipment list (CSV, or the first sheet of an xlsx).
  --json       print {case, buses, root, compensation, warnings} as JSON
${SITE_OPTIONS_HELP}
${EXIT_HELP}
`;

const CAUTION =
  'Estimate only: capacitor banks, resonance and overvoltage can hurt people and plant; the final design follows local codes, the utility and a licensed engineer.';

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
  const widths = header.map((h, i) => rows.reduce((w, r) => Math.max(w, (r[i] ?? '').length), h.length));
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
  const parsed = parseArgs(argv, {
    command: 'balance',
    flags: ['--json'],
    values: [...SITE_VALUE_OPTIONS],
    lists: [...SITE_LIST_OPTIONS],
  });
  if (!parsed.ok) return usageError(io, 'balance', parsed.message);
  const { positional, flags } = parsed.args;
  if (flags.has('--help')) {
    io.out(USAGE);
    return EXIT_OK;
  }
  if (positional.length !== 1)
    return usageError(
      io,
      'balance',
      `balance: give exactly one file (a workbook, a site file or an equipment list); got ${positional.length}`,
    );
  const file = positional[0] as string;
  const options = readSiteOptions(parsed.args);
  if (!options.ok) return usageError(io, 'balance', `balance: ${options.message}`);
  const loaded = await loadSite(file, options.options);
  if (!loaded.ok)
    return loaded.usage
      ? usageError(io, 'balance', `balance: ${loaded.message}`)
      : inputError(io, 'balance', loaded.message);
  const { site, problems, caseName: found } = loaded.loaded;
  if (problems.some((p) => p.severity === 'error'))
    return refuseErrors(io, 'balance', file, problems, 'nothing was balanced');
  let balances: CaseBalance[];
  try {
    balances = rollUpAll(site);
  } catch (e) {
    if (e instanceof SiteStructureError) return inputError(io, 'balance', `${file}: ${e.message}`);
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
  return EXIT_OK;
}
