// The site file: templates and saved sites as diff-friendly JSON, one equipment row per line.
//   {"format":"kvar-ledger-site","version":1,
//    "settings":{"name":...,"hz":50,"cases":[...],"requirement":{...},"sscMva":...,"notes":[...]},
//    "equipment":[
//      {"tag":"T1","bus":"MV","kind":"transformer",...,"load:night":0.4},
//      ...],
//    "banks":[{"bus":"LV1","fixed_kvar":20,"step_kvar":25,"steps":4,"series":"1:2:2",...}, ...]}
//    (optional; "series" absent: equal stages)
// Equipment keys are exactly the interchange column names (load:<case> included), so a row
// reads the same in the file, in a CSV and in the workbook. Rows are read through
// parseEquipmentTable, so numbers, kinds and unknown keys get the same messages; "row N" in a
// message is the N-th equipment row of the file. `banks`, when given, are the Compensation
// sheet's inputs per bus (a template carries the design's proposal, so opening it needs no design).
import { STEP_SERIES_ALLOWED, seriesProblem, type StepSeries } from './stepSeries.ts';
import { DEFAULT_CASE, DEFAULT_REQUIREMENT, defaultSettings, UNTITLED_SITE } from './defaults.ts';
import {
  NUMERIC_COLUMNS,
  type EquipmentRow,
  type Requirement,
  type Site,
  type SiteSettings,
} from './model.ts';
import { CASE_PREFIX, parseEquipmentTable } from './parse.ts';
import type { BankChoice } from './bankChoice.ts';
import { error, type Problem } from './problems.ts';
import { jsonErrorOffset, lineAndCharacter } from './jsonWhere.ts';
import { entryOf } from '../text/nameTable.ts';

export const SITE_FORMAT = 'kvar-ledger-site';
export const SITE_VERSION = 1;

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };
const isObject = (x: unknown): x is Record<string, Json> =>
  typeof x === 'object' && x !== null && !Array.isArray(x);

/** Where a JSON syntax error is, as " at line L, character C". */
function syntaxWhere(text: string): string {
  const at = jsonErrorOffset(text);
  return at === undefined ? '' : ` at ${lineAndCharacter(text, at)}`;
}

function readLimits(r: unknown, problems: Problem[]): Requirement {
  const fallback: Requirement = DEFAULT_REQUIREMENT;
  const bad = (what: string) => {
    problems.push(error({ column: 'settings.requirement' }, `settings.requirement ${what}`));
    return fallback;
  };
  if (!isObject(r))
    return bad('must be {"kind":"cosphi","target":0.95} or {"kind":"tanphi","lagMax":0.4,"leadMax":0.2}');
  if (r.kind === 'cosphi') {
    if (r.lagOnly !== undefined && typeof r.lagOnly !== 'boolean')
      return bad(`lagOnly must be true or false; got ${JSON.stringify(r.lagOnly)}`);
    return typeof r.target === 'number'
      ? { kind: 'cosphi', target: r.target, ...(r.lagOnly === true ? { lagOnly: true } : {}) }
      : bad(`target must be a number in (0, 1]; got ${JSON.stringify(r.target ?? null)}`);
  }
  if (r.kind === 'tanphi') {
    if (typeof r.lagMax !== 'number' || typeof r.leadMax !== 'number') {
      return bad(
        `lagMax and leadMax must be numbers ≥ 0; got ${JSON.stringify(r.lagMax ?? null)} and ${JSON.stringify(r.leadMax ?? null)}`,
      );
    }
    return { kind: 'tanphi', lagMax: r.lagMax, leadMax: r.leadMax };
  }
  return bad(`kind must be "cosphi" or "tanphi"; got ${JSON.stringify(r.kind ?? null)}`);
}

/** The requirement, and the rated power its limits are referred to when it gives one (refKw). */
function readRequirement(r: unknown, problems: Problem[]): Requirement {
  const limits = readLimits(r, problems);
  if (!isObject(r) || r.refKw === undefined || r.refKw === null) return limits;
  if (typeof r.refKw !== 'number' || !(r.refKw > 0)) {
    problems.push(
      error(
        { column: 'settings.requirement' },
        `settings.requirement refKw (the rated power the limits are referred to) must be a number > 0 (kW) or absent; got ${JSON.stringify(r.refKw)}`,
      ),
    );
    return limits;
  }
  return { ...limits, refKw: r.refKw };
}

function readSettings(s: unknown, problems: Problem[]): SiteSettings {
  const at = (key: string, what: string) =>
    problems.push(error({ column: `settings.${key}` }, `settings.${key} ${what}`));
  if (!isObject(s)) {
    problems.push(
      error({ column: 'settings' }, 'settings must be an object with name, hz, cases and requirement'),
    );
    return defaultSettings(UNTITLED_SITE);
  }
  const name =
    typeof s.name === 'string'
      ? s.name
      : (at('name', `must be text; got ${JSON.stringify(s.name ?? null)}`), 'Untitled site');
  let hz: 50 | 60 = 50;
  if (s.hz === 50 || s.hz === 60) hz = s.hz;
  else at('hz', `must be 50 or 60; got ${JSON.stringify(s.hz ?? null)}`);
  let cases: string[] = [DEFAULT_CASE];
  if (
    Array.isArray(s.cases) &&
    s.cases.length > 0 &&
    s.cases.every((c) => typeof c === 'string' && c.trim() !== '')
  ) {
    cases = (s.cases as string[]).map((c) => c.trim());
    const dup = cases.find((c, i) => cases.indexOf(c) !== i);
    if (dup !== undefined) at('cases', `lists "${dup}" twice; case names must be unique`);
  } else
    at(
      'cases',
      `must be a list of case names, the first being the default case; got ${JSON.stringify(s.cases ?? null)}`,
    );
  const out: { -readonly [K in keyof SiteSettings]: SiteSettings[K] } = {
    name,
    hz,
    cases,
    requirement: readRequirement(s.requirement, problems),
  };
  if (s.sscMva !== undefined && s.sscMva !== null) {
    if (typeof s.sscMva === 'number' && s.sscMva > 0) out.sscMva = s.sscMva;
    else at('sscMva', `must be a number > 0 (MVA); got ${JSON.stringify(s.sscMva)}`);
  }
  if (s.notes !== undefined) {
    if (Array.isArray(s.notes) && s.notes.every((n) => typeof n === 'string'))
      out.notes = s.notes as string[];
    else at('notes', 'must be a list of text lines');
  }
  return out;
}

/** Equipment objects → a text table (header = union of keys) for parseEquipmentTable. */
function equipmentTable(items: readonly Json[], problems: Problem[]): string[][] {
  // tag, bus and kind always head the table, so a row without them gets validate's row message.
  const header: string[] = ['tag', 'bus', 'kind'];
  items.forEach((it, i) => {
    if (!isObject(it)) {
      problems.push(
        error(
          { row: i + 1 },
          `an equipment row must be an object like {"tag":"M1","bus":"LV1","kind":"motor",...}; got ${JSON.stringify(it)}`,
        ),
      );
      return;
    }
    for (const k of Object.keys(it)) if (!header.includes(k)) header.push(k);
  });
  const rows = items.map((it, i) =>
    header.map((k) => {
      const v = isObject(it) ? entryOf(it, k) : undefined;
      if (v === undefined || v === null) return '';
      if (typeof v === 'number' || typeof v === 'string') return String(v);
      problems.push(error({ row: i + 1, column: k }, `must be a number or text; got ${JSON.stringify(v)}`));
      return '';
    }),
  );
  return [header, ...rows];
}

const BANK_KEYS = ['fixed_kvar', 'step_kvar', 'steps', 'p_pct', 'u_rated_kv', 'reactor_kvar'] as const;

/** The banks chosen per bus, when the file gives them ("banks": [{"bus": ..., "step_kvar": ...}, ...]). */
function readBanks(v: unknown, problems: Problem[]): BankChoice[] | undefined {
  if (v === undefined) return undefined;
  const bad = (i: number, what: string) => problems.push(error({ column: 'banks' }, `banks[${i}] ${what}`));
  if (!Array.isArray(v)) {
    problems.push(
      error({ column: 'banks' }, 'banks must be a list of {"bus": ..., "step_kvar": ..., "steps": ...}'),
    );
    return undefined;
  }
  const out: BankChoice[] = [];
  v.forEach((b: unknown, i) => {
    if (!isObject(b) || typeof b.bus !== 'string' || b.bus.trim() === '') return void bad(i, 'needs a bus');
    const c: { -readonly [K in keyof BankChoice]: BankChoice[K] } = { bus: b.bus.trim() };
    for (const k of BANK_KEYS) {
      const x = b[k];
      if (x === undefined || x === null) continue;
      if (typeof x !== 'number' || !(x >= 0) || !Number.isFinite(x))
        bad(i, `${k} must be a number ≥ 0; got ${JSON.stringify(x)}`);
      else c[k] = x;
    }
    if (b.series !== undefined && b.series !== null) {
      const why =
        typeof b.series === 'string'
          ? seriesProblem(b.series.trim(), c.steps)
          : `must be one of ${STEP_SERIES_ALLOWED}; got ${JSON.stringify(b.series)}`;
      if (why !== undefined) bad(i, `series ${why}`);
      else c.series = (b.series as string).trim() as StepSeries;
    }
    if (typeof b.note === 'string') c.note = b.note;
    out.push(c);
  });
  return out;
}

export function readSiteFile(text: string): { site: Site; problems: Problem[]; banks?: BankChoice[] } {
  const problems: Problem[] = [];
  const empty: Site = {
    settings: defaultSettings(UNTITLED_SITE),
    equipment: [],
  };
  let doc: unknown;
  try {
    doc = JSON.parse(text.startsWith('\uFEFF') ? text.slice(1) : text);
  } catch (e) {
    problems.push(
      error(
        {},
        `the site file is not valid JSON${syntaxWhere(text.startsWith('\uFEFF') ? text.slice(1) : text)}: ${e instanceof Error ? e.message : String(e)}`,
      ),
    );
    return { site: empty, problems };
  }
  if (!isObject(doc) || doc.format !== SITE_FORMAT) {
    problems.push(error({}, `not a site file: expected "format": "${SITE_FORMAT}" at the top level`));
    return { site: empty, problems };
  }
  if (doc.version !== SITE_VERSION) {
    problems.push(
      error(
        {},
        `site file version ${JSON.stringify(doc.version ?? null)} is not supported; this program reads version ${SITE_VERSION}`,
      ),
    );
    return { site: empty, problems };
  }
  const settings = readSettings(doc.settings, problems);
  if (!Array.isArray(doc.equipment)) {
    problems.push(error({ column: 'equipment' }, 'equipment must be a list of rows'));
    return { site: { settings, equipment: [] }, problems };
  }
  const banks = readBanks(doc.banks, problems);
  const withBanks = banks ? { banks } : {};
  if (doc.equipment.length === 0) return { site: { settings, equipment: [] }, problems, ...withBanks };
  const table = equipmentTable(doc.equipment, problems);
  const parsed = parseEquipmentTable(table, {
    headerRow: 0,
    defaultCase: settings.cases[0] as string,
    knownCases: settings.cases,
  });
  // Row 0 is the synthetic header: its problems concern keys, not a row of the file.
  problems.push(
    ...parsed.problems.map((p) =>
      p.row === 0 ? { ...withoutRow(p), message: p.message.replace(/^row 0, /, '') } : p,
    ),
  );
  return { site: { settings, equipment: parsed.equipment }, problems, ...withBanks };
}

function withoutRow(p: Problem): Problem {
  const { row: _row, ...rest } = p;
  return rest;
}

/** Key order of a written row: identity, then the numeric columns in their fixed order, then cases. */
function rowObject(row: EquipmentRow, cases: readonly string[]): Record<string, string | number> {
  const o: Record<string, string | number> = { tag: row.tag };
  if (row.description !== undefined) o.description = row.description;
  o.bus = row.bus;
  o.kind = row.kind;
  if (row.to_bus !== undefined) o.to_bus = row.to_bus;
  if (row.supply !== undefined) o.supply = row.supply;
  for (const c of NUMERIC_COLUMNS) {
    const v = row.values[c];
    if (v !== undefined) o[c] = v;
  }
  const names = [...cases, ...Object.keys(row.loads).filter((c) => !cases.includes(c))];
  for (const c of names) {
    const v = entryOf(row.loads, c);
    if (v !== undefined) o[CASE_PREFIX + c] = v;
  }
  return o;
}

/** A bank as one line of the file, keys in a fixed order. */
function bankObject(b: BankChoice): Record<string, string | number> {
  const o: Record<string, string | number> = { bus: b.bus };
  for (const k of BANK_KEYS) if (b[k] !== undefined) o[k] = b[k] as number;
  if (b.series !== undefined) o.series = b.series;
  if (b.note !== undefined) o.note = b.note;
  return o;
}

export function writeSiteFile(site: Site, banks?: readonly BankChoice[]): string {
  const s = site.settings;
  const settings: Record<string, unknown> = {
    name: s.name,
    hz: s.hz,
    cases: s.cases,
    requirement: s.requirement,
  };
  if (s.sscMva !== undefined) settings.sscMva = s.sscMva;
  if (s.notes !== undefined) settings.notes = s.notes;
  // One setting per line; notes one per line; everything else compact.
  const settingsText =
    '{\n' +
    Object.entries(settings)
      .map(([k, v]) => {
        const value =
          k === 'notes' && Array.isArray(v) && v.length > 0
            ? '[\n' + v.map((n) => '      ' + JSON.stringify(n)).join(',\n') + '\n    ]'
            : JSON.stringify(v);
        return `    ${JSON.stringify(k)}: ${value}`;
      })
      .join(',\n') +
    '\n  }';
  const rows = site.equipment.map((r) => '    ' + JSON.stringify(rowObject(r, s.cases)));
  const bankText =
    banks === undefined
      ? ''
      : `,\n  "banks": [\n${banks.map((b) => '    ' + JSON.stringify(bankObject(b))).join(',\n')}\n  ]`;
  return `{\n  "format": "${SITE_FORMAT}",\n  "version": ${SITE_VERSION},\n  "settings": ${settingsText},\n  "equipment": [\n${rows.join(',\n')}\n  ]${bankText}\n}\n`;
}
