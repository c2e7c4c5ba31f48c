// `kvar-ledger balance <file> [--case NAME] [site options] [--json]`: the bus balance of one
// operating case, the compensation designed over all cases, and the warnings. The file is read by
// the command line's one loader (loadSite.ts): a workbook saved by the app, an xlsx exported by
// Kvar Ledger, a site file, or an equipment list. Bad input exits 1 with every problem on one
// line with its row and column; a wrong command line exits 2.
import { parseArgs } from './args.ts';
import type { CliIo } from './io.ts';
import { loadSite } from './loadSite.ts';
import { EXIT_HELP, EXIT_OK, inputError, refuseErrors, usageError } from './report.ts';
import {
  SITE_FLAGS,
  SITE_LIST_OPTIONS,
  SITE_OPTIONS_HELP,
  SITE_VALUE_OPTIONS,
  oneSiteFile,
} from './siteOptions.ts';
import { assumedJson, reportAssumed } from './assumed.ts';
import type { AssumedInput } from '../core/site/typical/fillSite.ts';
import {
  DESIGN_FLAGS,
  DESIGN_LIST_OPTIONS,
  DESIGN_OPTIONS_HELP,
  DESIGN_VALUE_OPTIONS,
  readDesignOptions,
} from './designOptions.ts';
import type { Site } from '../core/site/model.ts';
import type { Problem } from '../core/site/problems.ts';
import type { SheetDoc } from '../core/workbook/document.ts';
import { optionDrafts } from '../core/workbook/optionDrafts.ts';
import { rollUpAll, SiteStructureError, type BusBalance, type CaseBalance } from '../core/site/rollup.ts';
import { withinRequirement, type CaseCompensation } from '../core/site/compensate.ts';
import { designWithSheet, type ChoiceOrigin } from '../core/site/sheetChoices.ts';
import { assessBanks, type Assessment } from '../core/site/assessBanks.ts';
import { bankTotal, controllerStepsOf, type BankChoice } from '../core/site/bankChoice.ts';
import { DEFAULT_STEP_SERIES } from '../core/site/stepSeries.ts';
import { requirementBand } from '../core/site/requirement.ts';
import { CAUTION_SHORT } from '../core/cautions.ts';

const USAGE = `usage: kvar-ledger balance <file> [--case NAME] [site options] [--json]
The kW and kvar of every bus in one operating case, rolled up to the point of connection,
with the compensation designed over all cases and its warnings. <file> is a workbook saved
by the app (*.kvar.json), an xlsx exported by Kvar Ledger, a site file (templates/*.json),
or an equipment list (CSV, or the first sheet of an xlsx).
  --json       print {case, buses, root, compensation, warnings, assumed} as JSON
${SITE_OPTIONS_HELP}
${DESIGN_OPTIONS_HELP}
${EXIT_HELP}
`;

const CAUTION = CAUTION_SHORT;

/** Where the banks come from: the page keeps a file's banks and proposes them for a file without. */
type BanksFrom = 'file' | 'proposed' | 'file and proposed';

/** The compensation a balance reports: the banks in use and what they do in every case. */
interface Compensation {
  readonly banks: readonly BankChoice[];
  readonly from: BanksFrom;
  readonly assessment: Assessment;
  /** Per bus, whether the file typed the bank, a detuning alone, or the design proposed it. */
  readonly origins?: ReadonlyMap<string, ChoiceOrigin>;
  /** Design options the file's typed choices won over, one sentence each. */
  readonly overridden?: readonly string[];
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

interface Typical {
  readonly assumed: readonly AssumedInput[];
  readonly notAssumed: readonly string[];
}

function toJson(
  site: Site,
  bal: CaseBalance,
  comp: Compensation,
  warnings: readonly Problem[],
  typical: Typical,
) {
  const band = requirementBand(site.settings.requirement);
  const outcome = comp.assessment.cases.find((c) => c.case === bal.case);
  return {
    site: site.settings.name,
    case: bal.case,
    cases: site.settings.cases,
    hz: bal.hz,
    buses: bal.buses.map(busJson),
    root: busJson(bal.root),
    compensation: {
      requirement: band.text,
      lag_tan: band.lagTan,
      lead_tan: band.leadTan,
      /** The rated power the limits refer to at the point of connection, kW; null: the case's own P. */
      rated_kw: site.settings.requirement.refKw ?? null,
      banks_from: comp.from,
      options_set_aside: comp.overridden ?? [],
      need_kvar: outcome?.need ?? null,
      met_before: withinRequirement(site, bal.root.p_kw, bal.root.q_kvar),
      met_after: outcome?.within_after ?? null,
      root_after: outcome ? busJson(outcome.after.root) : null,
      buses_after: outcome ? outcome.after.buses.map(busJson) : [],
      banks: comp.banks.map((b) => {
        const inCase = outcome?.banks.find((x) => x.bus === b.bus);
        return {
          ...b,
          chosen: comp.origins?.get(b.bus) ?? (comp.from === 'file' ? 'typed' : 'proposed'),
          series: b.series ?? DEFAULT_STEP_SERIES,
          controller_steps: controllerStepsOf(b),
          total_kvar: bankTotal(b),
          steps_in_case: inCase?.steps_in ?? 0,
          output_kvar_in_case: inCase?.output_kvar ?? 0,
          reactor_kvar_in_case: inCase?.reactor_kvar ?? 0,
        };
      }),
    },
    warnings: warnings.map(warningJson),
    assumed: assumedJson(site, typical.assumed),
    not_assumed: typical.notAssumed,
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

const FROM_TEXT: Record<BanksFrom, string> = {
  file: 'compensation as the file gives it',
  proposed: 'compensation proposed (the file gives none; sized over all cases)',
  'file and proposed':
    'compensation as the file types it, the rest proposed for the buses it leaves open (sized over all cases)',
};

/** A step or fixed size as typed, to 0.01 kvar (12.5 kvar steps are common; rounding to 13 misleads). */
const sizeText = (x: number) => String(Math.round(x * 100) / 100);

/** Equal stages as "6 × 50 kvar steps"; a series as "4 stages 1:2:2 = 7 × 25 kvar steps". */
function stepsText(b: BankChoice): string {
  const steps = `${num(controllerStepsOf(b), 0)} × ${sizeText(b.step_kvar ?? 0)} kvar steps`;
  const series = b.series ?? DEFAULT_STEP_SERIES;
  return series === DEFAULT_STEP_SERIES ? steps : `${b.steps} stages ${series} = ${steps}`;
}

function bankLine(
  b: BankChoice,
  u: number | undefined,
  inCase: CaseCompensation['banks'][number] | undefined,
) {
  const parts = [
    (b.fixed_kvar ?? 0) > 0 ? `fixed ${sizeText(b.fixed_kvar ?? 0)} kvar` : '',
    (b.steps ?? 0) > 0 ? stepsText(b) : '',
  ].filter(Boolean);
  const lines: string[] = [];
  const where = `  ${b.bus}${u === undefined ? '' : ` (${u} kV)`}: `;
  if (parts.length > 0)
    lines.push(
      `${where}${parts.join(' + ')} = ${num(bankTotal(b), 0)} kvar; ` +
        `${(b.p_pct ?? 0) > 0 ? `detuned ${b.p_pct} %` : 'no detuning'}` +
        `${b.u_rated_kv === undefined ? '' : `, capacitors rated ${b.u_rated_kv} kV`}; ` +
        `in this case ${inCase?.steps_in ?? 0} steps in, ${num(inCase?.output_kvar ?? 0)} kvar`,
    );
  if ((b.reactor_kvar ?? 0) > 0)
    lines.push(
      `${where}shunt reactor ${num(b.reactor_kvar ?? 0, 0)} kvar, ${(inCase?.reactor_kvar ?? 0) > 0 ? 'in service' : 'out of service'} in this case`,
    );
  if (b.note) lines.push(`    why: ${b.note}`);
  return lines.map((l) => l + '\n').join('');
}

function toText(site: Site, bal: CaseBalance, comp: Compensation, warnings: readonly Problem[]): string {
  const out: string[] = [];
  const band = requirementBand(site.settings.requirement);
  out.push(
    `${site.settings.name}\ncase ${bal.case} (of ${site.settings.cases.join(', ')}), ${bal.hz} Hz; requirement: ${band.text}\n\n`,
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
  const o = comp.assessment.cases.find((c) => c.case === bal.case);
  const r = bal.root;
  out.push(
    `\npoint of connection ${r.bus}: P ${num(r.p_kw)} kW, Q ${num(r.q_kvar)} kvar, cos φ ${num(r.cos_phi, 3)} ${r.sense}`,
  );
  if (o) {
    const n = o.need;
    out.push(
      withinRequirement(site, r.p_kw, r.q_kvar)
        ? ' — meets the requirement\n'
        : ` — needs ${n.capacitive_kvar > 0 ? `${num(n.capacitive_kvar)} kvar capacitive` : `${num(n.inductive_kvar)} kvar inductive`}\n`,
    );
  }
  const shown = comp.banks.filter((b) => bankTotal(b) > 0 || (b.reactor_kvar ?? 0) > 0);
  if (shown.length > 0) {
    out.push(`\n${FROM_TEXT[comp.from]}:\n`);
    for (const b of shown)
      out.push(
        bankLine(
          b,
          bal.buses.find((x) => x.bus === b.bus)?.u_kv,
          o?.banks.find((x) => x.bus === b.bus),
        ),
      );
    if (o) {
      const a = o.after.root;
      out.push(
        `  after: P ${num(a.p_kw)} kW, Q ${num(a.q_kvar)} kvar, cos φ ${num(a.cos_phi, 3)} ${a.sense} — ${o.within_after ? 'meets the requirement' : 'still outside the requirement'}\n`,
      );
    }
  }
  if ((comp.overridden ?? []).length > 0)
    out.push('\ndesign options set aside:\n' + (comp.overridden ?? []).map((o) => `  ${o}\n`).join(''));
  if (warnings.length > 0)
    out.push('\nwarnings:\n' + warnings.map((w) => `  ${w.severity.padEnd(7)} ${w.message}\n`).join(''));
  out.push(`\n${CAUTION}\n`);
  return out.join('');
}

export async function run(argv: string[], io: CliIo): Promise<number> {
  const parsed = parseArgs(argv, {
    command: 'balance',
    flags: ['--json', ...DESIGN_FLAGS, ...SITE_FLAGS],
    values: [...SITE_VALUE_OPTIONS, ...DESIGN_VALUE_OPTIONS],
    lists: [...SITE_LIST_OPTIONS, ...DESIGN_LIST_OPTIONS],
  });
  if (!parsed.ok) return usageError(io, 'balance', parsed.message);
  const { flags } = parsed.args;
  if (flags.has('--help')) {
    io.out(USAGE);
    return EXIT_OK;
  }
  const input = oneSiteFile(io, 'balance', parsed.args);
  if (typeof input === 'number') return input;
  const { file, options } = input;
  const loaded = await loadSite(file, options);
  if (!loaded.ok)
    return loaded.usage
      ? usageError(io, 'balance', `balance: ${loaded.message}`)
      : inputError(io, 'balance', loaded.message);
  const { site, problems, caseName: found } = loaded.loaded;
  const refused = problems.some((p) => p.severity === 'error');
  // With --json the list is in the JSON, unless the site is refused and no JSON comes.
  if (!flags.has('--json') || refused) reportAssumed(io, file, site, loaded.loaded);
  if (refused) return refuseErrors(io, 'balance', file, problems, 'nothing was balanced');
  let balances: readonly CaseBalance[];
  try {
    balances = loaded.loaded.balances ?? rollUpAll(site);
  } catch (e) {
    if (e instanceof SiteStructureError) return inputError(io, 'balance', `${file}: ${e.message}`);
    throw e;
  }
  const bal = balances.find((b) => b.case === found) as CaseBalance;
  const design = readDesignOptions(parsed.args, site);
  if (!design.ok) return usageError(io, 'balance', `balance: ${design.message}`);
  // The banks the page would hold for this file: its own as typed; with a design option, the
  // design's for the buses the file leaves open and with a detuning typed alone on a bus
  // (sheetChoices.ts); the design's alone for a file without banks.
  const fileBanks = loaded.loaded.banks;
  // Without an option the file's rows stand as the page shows them (a detuning typed alone
  // proposes nothing until the design is asked for).
  const asTyped = fileBanks !== undefined && design.options === undefined;
  const comp: Compensation = asTyped
    ? { banks: fileBanks, from: 'file', assessment: assessBanks(site, fileBanks, balances) }
    : (() => {
        const d = designWithSheet(site, fileBanks, design.options, balances);
        const typed = [...d.origins.values()].some((o) => o !== 'proposed');
        return {
          banks: d.choices,
          from: typed ? ('file and proposed' as const) : ('proposed' as const),
          assessment: assessBanks(site, d.choices, balances),
          origins: d.origins,
          overridden: d.overridden,
        };
      })();
  const warnings = [
    ...problems,
    ...optionInputWarnings(loaded.loaded.optionSheet, site.settings.cases),
    ...bal.problems,
    ...comp.assessment.warnings.filter((w) => w.case === undefined || w.case === found),
  ];
  io.out(
    flags.has('--json')
      ? JSON.stringify(toJson(site, bal, comp, warnings, loaded.loaded), null, 2) + '\n'
      : toText(site, bal, comp, warnings),
  );
  return EXIT_OK;
}

/**
 * A workbook's option inputs that cannot be read, as Checks lists them: warnings here, since the
 * balance does not depend on them, each naming its cell and the option waiting for it.
 */
function optionInputWarnings(sheet: SheetDoc | undefined, cases: readonly string[]): Problem[] {
  return optionDrafts(sheet, cases).flatMap((d) =>
    d.problems.map((p) => ({
      ...p,
      severity: 'warning' as const,
      message: `${p.message}; the option "${d.name}" is not worked out until this is mended (kvar-ledger quote --compare)`,
    })),
  );
}
