// The site settings a command line can give (or override): name, frequency, the utility's
// requirement, the supply's short-circuit power, the operating case, and the column mapping of
// an equipment list. `balance` and `export` read them here, so both understand the same words.
import type { Requirement } from '../core/site/model.ts';
import type { ParsedArgs } from './args.ts';
import type { CliIo } from './io.ts';
import { usageError } from './report.ts';

export interface ColumnChoice {
  /** A header as written in the file, or a column letter (A, B, …). */
  readonly column: string;
  /** An interchange column (tag, p_kw, load:night …) or null to ignore the column. */
  readonly target: string | null;
}

export interface UnitChoiceOption {
  readonly column: string;
  readonly unit: string;
}

export interface SiteOptions {
  readonly name?: string;
  readonly hz?: 50 | 60;
  readonly requirement?: Requirement;
  /** The rated power the requirement's limits refer to, kW (a site that generates). */
  readonly ratedKw?: number;
  readonly sscMva?: number;
  /** balance: the case shown; for a list: also the name of its plain load column's case. */
  readonly caseName?: string;
  readonly map: readonly ColumnChoice[];
  readonly units: readonly UnitChoiceOption[];
  /** A list without a kind column: the kind of every row (checked against the kinds when read). */
  readonly kind?: string;
  /** Fill blank motor and transformer inputs with typical values, listed and marked as assumed. */
  readonly assumeTypical?: boolean;
}

/** Options every site-reading command accepts (values), and the repeatable ones (lists). */
export const SITE_VALUE_OPTIONS = [
  '--name',
  '--hz',
  '--cos-phi',
  '--cos-phi-lagging',
  '--tan-phi',
  '--rated-kw',
  '--ssc-mva',
  '--case',
  '--kind',
] as const;
export const SITE_LIST_OPTIONS = ['--map', '--unit'] as const;
export const SITE_FLAGS = ['--assume-typical'] as const;

/** The --help text of these options, shared word for word by the commands. */
export const SITE_OPTIONS_HELP = `Site settings (given ones override the file's; a CSV or xlsx list has none of its own,
so without them it is taken as 50 Hz with cos φ ≥ 0.95 required):
  --name TEXT        the site's name (default: the file's own, else the file name without extension)
  --hz 50|60         frequency
  --cos-phi X        requirement cos φ ≥ X, lagging or leading (0 < X ≤ 1)
  --cos-phi-lagging X  requirement cos φ ≥ X while drawing kvar, no leading limit (a tariff
                     that bills drawn kvar alone: the design never adds a reactor for it)
  --tan-phi LAG[/LEAD]  requirement as tan φ limits: at most LAG drawing kvar and LEAD delivering
                     it (LEAD defaults to LAG); numbers ≥ 0, e.g. --tan-phi 0.4/0
  --rated-kw X       refer the requirement's limits to this rated active power, kW (> 0), not to
                     the site's P in each case: a site that generates (allowed kvar = tan φ × X)
  --ssc-mva X        short-circuit power of the supply, MVA (> 0), for resonance and voltage rise
  --case NAME        the operating case (balance shows it; default: the first); for a list whose
                     plain "load" column names no case, NAME becomes that case's name (else "normal")
Equipment lists (CSV, or the first sheet of an xlsx) are read as the page's import reads them:
the same header words and units ("Rated output (MW)"), decimal commas, percent signs.
  --map COLUMN=FIELD  read the column with header COLUMN (or letter, e.g. D) as FIELD (tag, bus,
                     kind, p_kw, cos_phi, load:night …; "none" ignores it); may be repeated
  --unit COLUMN=UNIT  the unit the column's numbers are in (e.g. --unit D=MW); may be repeated
  --kind KIND        a list without a kind column: every row is KIND (motor, load, transformer …)
Tender-stage lists without nameplates:
  --assume-typical   fill blank inputs of motors (efficiency, cos φ, no-load current, from the
                     rated output) and transformers (uk, losses, no-load current, from the kVA)
                     with typical values, as the page's "fill blanks with typical values" does;
                     each is listed (stderr, or "assumed" in --json) and marked in an export.
                     Typical values are no substitute for the nameplate or the maker's data.`;

export type OptionsResult =
  { readonly ok: true; readonly options: SiteOptions } | { readonly ok: false; readonly message: string };

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

function number(text: string): number | undefined {
  const t = text.trim();
  return NUMBER.test(t) ? Number(t) : undefined;
}

function pairs(list: readonly string[], option: string): Array<[string, string]> | string {
  const out: Array<[string, string]> = [];
  for (const item of list) {
    const eq = item.lastIndexOf('=');
    if (eq <= 0 || eq === item.length - 1)
      return `${option} must be written COLUMN=VALUE (e.g. ${option} "Rated kW=p_kw"); got "${item}"`;
    out.push([item.slice(0, eq).trim(), item.slice(eq + 1).trim()]);
  }
  return out;
}

/** Read the site options of a parsed command line; a message for the first bad one. */
export function readSiteOptions(args: ParsedArgs): OptionsResult {
  const v = (k: string) => args.values.get(k);
  const bad = (message: string): OptionsResult => ({ ok: false, message });
  const out: {
    -readonly [K in keyof SiteOptions]: SiteOptions[K];
  } = { map: [], units: [] };
  const name = v('--name');
  if (name !== undefined) {
    if (name.trim() === '') return bad('--name must not be blank');
    out.name = name.trim();
  }
  const hz = v('--hz');
  if (hz !== undefined) {
    if (hz !== '50' && hz !== '60') return bad(`--hz must be 50 or 60; got "${hz}"`);
    out.hz = Number(hz) as 50 | 60;
  }
  const both = v('--cos-phi');
  const lagging = v('--cos-phi-lagging');
  const tan = v('--tan-phi');
  if ([both, lagging, tan].filter((x) => x !== undefined).length > 1)
    return bad(
      'give one of --cos-phi, --cos-phi-lagging or --tan-phi, not several: the requirement is one of them',
    );
  const cos = both ?? lagging;
  if (cos !== undefined) {
    const name = both !== undefined ? '--cos-phi' : '--cos-phi-lagging';
    const x = number(cos);
    if (x === undefined || !(x > 0 && x <= 1))
      return bad(`${name} must be a number in (0, 1], with a decimal point; got "${cos}"`);
    out.requirement = { kind: 'cosphi', target: x, ...(lagging !== undefined ? { lagOnly: true } : {}) };
  }
  if (tan !== undefined) {
    const [lagText, leadText, extra] = tan.split('/');
    const lag = number(lagText ?? '');
    const lead = leadText === undefined ? lag : number(leadText);
    if (extra !== undefined || lag === undefined || lead === undefined || !(lag >= 0) || !(lead >= 0))
      return bad(
        `--tan-phi must be LAG or LAG/LEAD, numbers ≥ 0 with a decimal point (e.g. 0.4/0); got "${tan}"`,
      );
    out.requirement = { kind: 'tanphi', lagMax: lag, leadMax: lead };
  }
  for (const [option, unit, key] of [
    ['--rated-kw', 'kW', 'ratedKw'],
    ['--ssc-mva', 'MVA', 'sscMva'],
  ] as const) {
    const text = v(option);
    if (text === undefined) continue;
    const x = number(text);
    if (x === undefined || !(x > 0) || !Number.isFinite(x))
      return bad(`${option} must be a number > 0 (${unit}); got "${text}"`);
    out[key] = x;
  }
  const caseName = v('--case');
  if (caseName !== undefined) {
    if (caseName.trim() === '') return bad('--case must not be blank');
    out.caseName = caseName.trim();
  }
  const kind = v('--kind');
  if (kind !== undefined) {
    if (kind.trim() === '') return bad('--kind must not be blank');
    out.kind = kind.trim();
  }
  const map = pairs(args.lists.get('--map') ?? [], '--map');
  if (typeof map === 'string') return bad(map);
  out.map = map.map(([column, target]) => ({
    column,
    target: ['none', '-', ''].includes(target.toLowerCase()) ? null : target,
  }));
  const units = pairs(args.lists.get('--unit') ?? [], '--unit');
  if (typeof units === 'string') return bad(units);
  out.units = units.map(([column, unit]) => ({ column, unit }));
  if (args.flags.has('--assume-typical')) out.assumeTypical = true;
  return { ok: true, options: out };
}

/**
 * The one file a site command reads and the site options given with it; or, when either is
 * wrong, the usage error already reported (its exit status).
 */
export function oneSiteFile(
  io: CliIo,
  command: string,
  args: ParsedArgs,
): { readonly file: string; readonly options: SiteOptions } | number {
  if (args.positional.length !== 1)
    return usageError(
      io,
      command,
      `${command}: give exactly one file (a workbook, a site file or an equipment list); got ${args.positional.length}`,
    );
  const options = readSiteOptions(args);
  if (!options.ok) return usageError(io, command, `${command}: ${options.message}`);
  return { file: args.positional[0] as string, options: options.options };
}
