// The one way the command line reads a site, for `balance`, `export` (and later commands):
//   - a workbook saved by the app (*.kvar.json, "format": "kvar-ledger-workbook"),
//   - an xlsx exported by Kvar Ledger (the site comes back from its sheets),
//   - a site file (templates/*.json, "format": "kvar-ledger-site"),
//   - an equipment list, CSV or the first sheet of any other xlsx, read exactly as the page's
//     import reads it (header words, units, decimal commas), with --map/--unit for the rest.
// Settings given as options override the file's. The result is validated; every problem names
// its row and column. Nothing here prints or exits: the commands decide that.
import { readFileSync, statSync } from 'node:fs';
import { basename } from 'node:path';
import { resolveCase } from '../core/site/cases.ts';
import { defaultSettings } from '../core/site/defaults.ts';
import { MAX_CASES } from '../core/site/limits.ts';
import { NUMERIC_COLUMNS, TEXT_COLUMNS, type Site, type SiteSettings } from '../core/site/model.ts';
import { CASE_PREFIX, DEFAULT_CASE } from '../core/site/parse.ts';
import { error, hasErrors, info, type Problem } from '../core/site/problems.ts';
import { rollUpAll, runawayProblem, SiteStructureError, type CaseBalance } from '../core/site/rollup.ts';
import { readSiteFile } from '../core/site/siteFile.ts';
import { mergeProblems, validateSite } from '../core/site/validate.ts';
import { fillSiteTypical, type AssumedInput } from '../core/site/typical/fillSite.ts';
import type { BankChoice } from '../core/site/bankChoice.ts';
import { siteFromWorkbook } from '../core/workbook/readSite.ts';
import { assumedInWorkbook } from '../core/workbook/assumedIn.ts';
import type { CellContent, SheetDoc, WorkbookDoc } from '../core/workbook/document.ts';
import { OPTIONS_SHEET } from '../core/workbook/optionsLayout.ts';
import { rateRowsOf, tariffRowsOf } from '../core/quote/index.ts';
import { previewImport } from '../io/import/preview.ts';
import {
  proposeMapping,
  withColumnTarget,
  withColumnUnit,
  withDefaultKind,
  type MappingProposal,
} from '../io/import/mapping.ts';
import { unitChoicesFor } from '../io/import/units.ts';
import { describeProblem } from '../io/xlsx/fileProblem.ts';
import { parseWorkbookText } from '../ui/model/docValidate.ts';
import type { SiteOptions } from './siteOptions.ts';

export type SourceKind = 'workbook' | 'own-xlsx' | 'site-file' | 'list';

export interface LoadedSite {
  readonly site: Site;
  /** Read and validation problems together; messages start with "row N, column C" where known. */
  readonly problems: readonly Problem[];
  /**
   * The banks the file holds: those typed on a workbook's Compensation sheet (none is a choice),
   * or a site file's "banks". Undefined when the file says nothing of banks (an equipment list, a
   * site file without "banks"): then the commands propose them, as the page does on import.
   */
  readonly banks?: readonly BankChoice[];
  readonly source: SourceKind;
  /** The rows of a workbook's Rates sheet (header first); undefined when the file has none. */
  readonly rateRows?: readonly (readonly CellContent[])[];
  /** The rows of a workbook's Tariff sheet (header first); undefined when the file has none. */
  readonly tariffRows?: readonly (readonly CellContent[])[];
  /** A workbook's Design options sheet (its option blocks); undefined when the file has none. */
  readonly optionSheet?: SheetDoc;
  /**
   * The workbook itself, for a workbook saved by the app or an xlsx exported by Kvar Ledger, when
   * no option changed its site (settings, --assume-typical): what `export` writes back whole.
   */
  readonly doc?: WorkbookDoc;
  /** The case asked for with --case (resolved against the site's cases), else the first. */
  readonly caseName: string;
  /** With --assume-typical: the typical values put in for blanks (indices into the site's equipment). */
  readonly assumed: readonly AssumedInput[];
  /** With --assume-typical: blanks left blank, and why. */
  readonly notAssumed: readonly string[];
  /** Typical values a workbook read already held as assumed (marked by the page); an export keeps them. */
  readonly held: readonly AssumedInput[];
  /** Every case rolled up, when the site has no input errors (commands reuse it). */
  readonly balances?: readonly CaseBalance[];
}

/** `usage`: the command line does not fit the file (an option names what the file lacks). */
export type LoadResult =
  | { readonly ok: true; readonly loaded: LoadedSite }
  | { readonly ok: false; readonly message: string; readonly usage?: boolean };

/** Largest JSON file read (the app opens workbooks up to the same size). */
export const MAX_JSON_BYTES = 64 * 1024 * 1024;

const ZIP_MAGIC = [0x50, 0x4b, 0x03, 0x04];

/** "list.csv" → "list", "site.kvar.json" → "site": how a site without a name of its own is named. */
export function siteNameFromFile(file: string): string {
  const stem = basename(file).replace(/(\.kvar)?\.[A-Za-z0-9]+$/, '');
  return stem === '' ? basename(file) : stem;
}

function readBytes(file: string): Uint8Array | string {
  try {
    const st = statSync(file);
    if (st.isDirectory()) return 'it is a directory, not a file';
    return readFileSync(file);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') return 'no such file';
    if (code === 'EACCES' || code === 'EPERM') return 'permission denied';
    return e instanceof Error ? e.message : String(e);
  }
}

function fail(message: string, usage = false): LoadResult {
  return usage ? { ok: false, message, usage } : { ok: false, message };
}

function decodeUtf8(bytes: Uint8Array): string {
  const text = new TextDecoder('utf-8').decode(bytes);
  return text.startsWith('\uFEFF') ? text.slice(1) : text;
}

/** Is the text JSON the app wrote? Decided from its first character and the "format" key. */
function jsonFormat(text: string): { format: unknown } | 'not-json' | 'invalid' {
  if (!text.trimStart().startsWith('{')) return 'not-json';
  try {
    const v: unknown = JSON.parse(text);
    return { format: typeof v === 'object' && v !== null ? (v as { format?: unknown }).format : undefined };
  } catch {
    return 'invalid';
  }
}

type Read = {
  site: Site;
  assumed?: readonly AssumedInput[];
  notAssumed?: readonly string[];
  held?: readonly AssumedInput[];
  problems: Problem[];
  banks?: readonly BankChoice[];
  source: SourceKind;
  rateRows?: readonly (readonly CellContent[])[];
  tariffRows?: readonly (readonly CellContent[])[];
  optionSheet?: SheetDoc;
  doc?: WorkbookDoc;
};

/** What a workbook carries beyond its site: itself, its Rates, Tariff and Design options sheets. */
const ratesOf = (doc: WorkbookDoc) => {
  const rows = rateRowsOf(doc);
  const tariff = tariffRowsOf(doc);
  const optionSheet = doc.sheets.find((s) => s.name === OPTIONS_SHEET);
  return {
    doc,
    ...(rows ? { rateRows: rows } : {}),
    ...(tariff ? { tariffRows: tariff } : {}),
    ...(optionSheet ? { optionSheet } : {}),
  };
};

async function readJson(file: string, bytes: Uint8Array): Promise<Read | LoadResult> {
  if (bytes.length > MAX_JSON_BYTES)
    return fail(
      `${file}: the file is ${Math.round(bytes.length / 1048576)} MB; JSON files up to 64 MB are read`,
    );
  const text = decodeUtf8(bytes);
  const kind = jsonFormat(text);
  if (kind !== 'not-json' && kind !== 'invalid' && kind.format === 'kvar-ledger-workbook') {
    const doc = parseWorkbookText(text);
    if (!doc.ok) return fail(`${file}: ${doc.message}`);
    const r = siteFromWorkbook(doc.doc);
    return {
      site: r.site,
      problems: r.problems,
      banks: r.banks,
      source: 'workbook',
      held: assumedInWorkbook(doc.doc, r),
      ...ratesOf(doc.doc),
    };
  }
  if (kind !== 'not-json' && kind !== 'invalid' && kind.format !== 'kvar-ledger-site')
    return fail(
      `${file} is not a Kvar Ledger file: its "format" is ${JSON.stringify(kind.format) ?? 'missing'}; expected "kvar-ledger-site" (a site file) or "kvar-ledger-workbook" (a workbook saved by the app)`,
    );
  // A site file, or text that is not valid JSON: the site file reader says where it breaks.
  const r = readSiteFile(text);
  return { site: r.site, problems: r.problems, ...(r.banks ? { banks: r.banks } : {}), source: 'site-file' };
}

async function readOwnXlsx(bytes: Uint8Array): Promise<Read | undefined> {
  const { importKvarXlsx } = await import('../io/xlsx/index.ts');
  const imported = await importKvarXlsx(bytes);
  // Anything else (a client's list, a damaged file) goes the list way, whose gate says why.
  if (!imported.ok || imported.restored === 'plain') return undefined;
  const r = siteFromWorkbook(imported.doc);
  const notes = imported.notes.map((n) => info({}, n));
  return {
    site: r.site,
    problems: [...notes, ...r.problems],
    banks: r.banks,
    source: 'own-xlsx',
    held: assumedInWorkbook(imported.doc, r),
    ...ratesOf(imported.doc),
  };
}

/** The column a --map or --unit names: its header (any letter case) first, else its letter. */
function columnIndex(p: MappingProposal, column: string): number | undefined {
  const byHeader = p.columns.find((c) => c.header.toLowerCase() === column.toLowerCase());
  if (byHeader) return byHeader.index;
  return p.columns.find((c) => c.letter === column.toUpperCase())?.index;
}

const TARGETS = new Set<string>([...TEXT_COLUMNS, ...NUMERIC_COLUMNS]);
const isTarget = (t: string) =>
  TARGETS.has(t) || (t.startsWith(CASE_PREFIX) && t.length > CASE_PREFIX.length);

function headersText(p: MappingProposal): string {
  const shown = p.columns
    .filter((c) => c.header !== '')
    .slice(0, 8)
    .map((c) => {
      // Control characters (a binary file read as text) would garble the terminal.
      // eslint-disable-next-line no-control-regex -- control characters are what this replaces
      const h = c.header.replace(/[\u0000-\u001f\u007f-\u009f]/g, '·');
      return `${c.letter} "${h.length > 30 ? h.slice(0, 30) + '…' : h}"`;
    });
  return shown.length === 0 ? 'none' : shown.join(', ') + (p.columns.length > 8 ? ', …' : '');
}

function applyChoices(p: MappingProposal, file: string, options: SiteOptions): MappingProposal | LoadResult {
  let out = p;
  if (options.kind !== undefined) {
    const k = withDefaultKind(out, options.kind);
    if (!k.ok) return fail(`--kind ${options.kind}: ${k.message}`, true);
    out = k.proposal;
  }
  for (const m of options.map) {
    const i = columnIndex(out, m.column);
    if (i === undefined)
      return fail(
        `--map ${m.column}=…: ${file} has no column "${m.column}" (columns: ${headersText(out)})`,
        true,
      );
    if (m.target !== null && !isTarget(m.target))
      return fail(
        `--map ${m.column}=${m.target}: "${m.target}" is not a field; fields are ${[...TEXT_COLUMNS, ...NUMERIC_COLUMNS].join(', ')} and load:<case>`,
        true,
      );
    out = withColumnTarget(out, i, m.target);
  }
  for (const u of options.units) {
    const i = columnIndex(out, u.column);
    const col = i === undefined ? undefined : out.columns[i];
    if (col === undefined)
      return fail(
        `--unit ${u.column}=…: ${file} has no column "${u.column}" (columns: ${headersText(out)})`,
        true,
      );
    if (col.target === null)
      return fail(
        `--unit ${u.column}=${u.unit}: column ${col.letter} is not read; map it first with --map`,
        true,
      );
    const choices = unitChoicesFor(col.target).map((c) => c.label);
    const next = withColumnUnit(out, i as number, u.unit);
    if (next.columns[i as number]?.unit.label !== u.unit)
      return fail(
        `--unit ${u.column}=${u.unit}: not a unit for ${col.target}; choose one of ${choices.join(', ')}`,
        true,
      );
    out = next;
  }
  return out;
}

async function readList(file: string, bytes: Uint8Array, options: SiteOptions): Promise<Read | LoadResult> {
  // Loaded here: the list reader brings the xlsx reader and, through it, the engine, which a
  // site file or a workbook never needs (a third of a small site's whole run was loading them).
  const { readEquipmentFile } = await import('../io/import/index.ts');
  const table = await readEquipmentFile(basename(file), bytes);
  if (!table.ok) return fail(`${file}: ${describeProblem(table.problem)}`);
  const mapped = applyChoices(proposeMapping(table.value), file, options);
  if ('ok' in mapped) return mapped;
  // Two of the three columns every list has are missing: this is some other file (README.md).
  if (mapped.missing.length >= 2)
    return fail(
      `${file} is not an equipment list: no column reads as ${mapped.missing.join(' or ')} (columns found: ${headersText(mapped)}); a list has a header row naming tag, bus and kind, or use --map COLUMN=tag`,
    );
  if (mapped.missing.length > 0)
    return fail(
      `${file}: no column for ${mapped.missing.join(', ')} (columns found: ${headersText(mapped)}); name it in the header row or use --map COLUMN=${mapped.missing[0] as string}${mapped.missing.includes('kind') ? ', or give every row one kind with --kind KIND' : ''}`,
    );
  // The plain load column's case: --case names it unless the list has a load:<case> column of that name.
  const listCases = mapped.columns.flatMap((c) =>
    c.target?.startsWith(CASE_PREFIX) ? [c.target.slice(CASE_PREFIX.length)] : [],
  );
  const asked = options.caseName;
  const defaultCase =
    asked !== undefined && resolveCase(listCases, asked) === undefined ? asked : DEFAULT_CASE;
  // The settings go into the preview, which validates the rows under them as the page does.
  const settings = withOptions(defaultSettings(siteNameFromFile(file), [defaultCase]), options);
  const preview = previewImport(mapped, {
    settings,
    ...(options.assumeTypical ? { fillTypical: true } : {}),
  });
  const problems = [...preview.problems];
  // The preview checks rows only when there are some; a list of headers alone is still no site.
  if (preview.counts.rows === 0)
    problems.push(
      error({ row: mapped.headerRow }, 'the list has a header row but no equipment rows below it'),
    );
  return {
    site: { settings: { ...settings, cases: [...preview.cases] }, equipment: [...preview.equipment] },
    problems,
    source: 'list',
    assumed: preview.assumed,
    notAssumed: preview.notAssumed,
  };
}

function withOptions(s: SiteSettings, options: SiteOptions): SiteSettings {
  const requirement = options.requirement ?? s.requirement;
  return {
    ...s,
    ...(options.name !== undefined ? { name: options.name } : {}),
    ...(options.hz !== undefined ? { hz: options.hz } : {}),
    ...(options.requirement !== undefined || options.ratedKw !== undefined
      ? {
          requirement:
            options.ratedKw !== undefined ? { ...requirement, refKw: options.ratedKw } : requirement,
        }
      : {}),
    ...(options.sscMva !== undefined ? { sscMva: options.sscMva } : {}),
  };
}

/**
 * Every case rolled up once, and branch losses that run away (no site draws a terawatt): every
 * command refuses such a site with the branch's row, as it refuses bad input, instead of failing
 * inside the compensation rule. The balances go to the command, which need not roll up again.
 */
function rollUpChecked(site: Site): { balances?: CaseBalance[]; runaway: Problem[] } {
  try {
    const balances = rollUpAll(site);
    return { balances, runaway: balances.flatMap((b) => runawayProblem(b) ?? []).slice(0, 1) };
  } catch (e) {
    if (e instanceof SiteStructureError) return { runaway: [] }; // said by the command that rolls up
    throw e;
  }
}

/** Read, name, override and validate the site in `file`. Never throws for bad input. */
export async function loadSite(file: string, options: SiteOptions): Promise<LoadResult> {
  const bytes = readBytes(file);
  if (typeof bytes === 'string') return fail(`cannot read ${file}: ${bytes}`);
  if (bytes.length === 0) return fail(`${file}: the file is empty (0 bytes)`);
  const isZip = ZIP_MAGIC.every((b, i) => bytes[i] === b);
  let read: Read | LoadResult | undefined;
  if (isZip || /\.xls[xm]?$/i.test(file)) read = isZip ? await readOwnXlsx(bytes) : undefined;
  else if (/\.json$/i.test(file) || decodeUtf8(bytes.subarray(0, 64)).trimStart().startsWith('{'))
    read = await readJson(file, bytes);
  read ??= await readList(file, bytes, options);
  if ('ok' in read) return read;
  if (
    read.source !== 'list' &&
    (options.map.length > 0 || options.units.length > 0 || options.kind !== undefined)
  )
    return fail(
      `--map, --unit and --kind apply to equipment lists (CSV or xlsx); ${file} is a ${describeSource(read.source)}`,
      true,
    );
  const given: Site =
    read.source === 'list' ? read.site : { ...read.site, settings: withOptions(read.site.settings, options) };
  // A list was filled as its rows arrived (the import's way); any other source is filled here,
  // before it is validated, by the same rule.
  const fill =
    options.assumeTypical && read.source !== 'list'
      ? fillSiteTypical(given)
      : { site: given, assumed: read.assumed ?? [], notAssumed: read.notAssumed ?? [] };
  const site = fill.site;
  const caseName =
    options.caseName === undefined
      ? (site.settings.cases[0] ?? DEFAULT_CASE)
      : resolveCase(site.settings.cases, options.caseName);
  if (caseName === undefined) {
    const cases = site.settings.cases;
    return fail(
      `--case "${options.caseName ?? ''}" is not a case of ${file}; its cases are ${cases.slice(0, MAX_CASES).join(', ')}`,
      true,
    );
  }
  // A list comes validated from the import preview. A file that could not be read at all has no
  // rows to validate; say only why it could not.
  const unreadable = site.equipment.length === 0 && read.problems.some((p) => p.severity === 'error');
  const checked =
    read.source === 'list' || unreadable ? read.problems : mergeProblems(read.problems, validateSite(site));
  const rolled = hasErrors(checked) ? { runaway: [] } : rollUpChecked(site);
  const problems = [...checked, ...rolled.runaway];
  const banks = read.banks ? { banks: read.banks } : {};
  // The site as read is the site the workbook holds unless an option changed it.
  const settingsGiven = [options.name, options.hz, options.requirement, options.ratedKw, options.sscMva].some(
    (v) => v !== undefined,
  );
  const unchanged = !settingsGiven && (!options.assumeTypical || fill.assumed.length === 0);
  const rates = {
    ...(read.doc && unchanged ? { doc: read.doc } : {}),
    ...(read.rateRows ? { rateRows: read.rateRows } : {}),
    ...(read.tariffRows ? { tariffRows: read.tariffRows } : {}),
    ...(read.optionSheet ? { optionSheet: read.optionSheet } : {}),
  };
  const typical = { assumed: fill.assumed, notAssumed: fill.notAssumed, held: read.held ?? [] };
  return {
    ok: true,
    loaded: {
      site,
      problems,
      ...banks,
      ...rates,
      ...(rolled.balances ? { balances: rolled.balances } : {}),
      source: read.source,
      caseName,
      ...typical,
    },
  };
}

export function describeSource(source: SourceKind): string {
  switch (source) {
    case 'workbook':
      return 'workbook saved by the app';
    case 'own-xlsx':
      return 'workbook exported by Kvar Ledger';
    case 'site-file':
      return 'site file';
    case 'list':
      return 'equipment list';
  }
}
