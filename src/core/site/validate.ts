// Every rule a site must meet before it can be balanced. Each problem names the row and the
// column, says what is wrong, and gives the allowed range and the value where there is one.
// Bad rows are reported here and never dropped quietly: the roll-up refuses a site with errors.
import { findKind, kindNames, type KindSpec } from '../kinds/index.ts';
import type { EquipmentRow, Site } from './model.ts';
import { loadFactor } from './cases.ts';
import { branchPower, shuntPower, unitRatingKva } from './rowPower.ts';
import { buildBusGraph } from './graph.ts';
import { error, info, say, warning, type Problem } from './problems.ts';
import { busVoltages } from './voltages.ts';
import { magnitudeProblems, siteSizeProblems } from './limits.ts';
import { plausibilityProblems } from './plausibility.ts';
import { lineResistanceProblems } from './lineResistance.ts';
import { supplyProblems } from './supplyCheck.ts';
import { formatNumber } from '../registry/messages.ts';
import { unstorableCharacter } from '../text/storable.ts';

/** push(...items) without spreading: a spread of a list of 100,000+ problems overflows the stack. */
function append<T>(target: T[], items: readonly T[]): void {
  for (const x of items) target.push(x);
}

export function validateSite(site: Site): Problem[] {
  const problems: Problem[] = [];
  if (site.equipment.length === 0) {
    problems.push(error({}, 'the equipment list has no rows; add at least one item'));
    return problems;
  }
  // A site beyond the supported size is refused as a whole, before 100,000s of rows are checked.
  const size = siteSizeProblems(site);
  if (size.length > 0) return size;
  append(problems, validateSettings(site));
  const firstByTag = new Map<string, EquipmentRow>();
  for (const row of site.equipment) {
    append(problems, validateRow(row, site));
    if (row.tag !== '') {
      const first = firstByTag.get(row.tag);
      if (first)
        problems.push(
          error({ row: row.row, column: 'tag', tag: row.tag }, say.duplicateTag(row.tag, first.row)),
        );
      else firstByTag.set(row.tag, row);
    }
  }
  const okRows = site.equipment.filter((r) => findKind(r.kind) !== undefined && r.bus !== '');
  append(problems, buildBusGraph(okRows).problems);
  append(problems, busVoltages(okRows).problems);
  return dedupe(problems);
}

function validateSettings(site: Site): Problem[] {
  const out: Problem[] = [];
  const s = site.settings;
  if (s.hz !== 50 && s.hz !== 60)
    out.push(error({ column: 'hz' }, `settings: frequency must be 50 or 60 Hz; got ${String(s.hz)}`));
  if (s.cases.length === 0) out.push(error({}, 'settings: at least one operating case is needed'));
  const seen = new Set<string>();
  const bad = unstorableCharacter(s.name);
  if (bad) out.push(error({}, `settings: ${say.unstorable('the site name', bad)}`));
  for (const c of s.cases) {
    if (c.trim() === '') out.push(error({}, 'settings: a case name is blank'));
    const badCase = unstorableCharacter(c);
    if (badCase)
      out.push(error({}, `settings: ${say.unstorable(`case name ${JSON.stringify(c)}`, badCase)}`));
    if (seen.has(c)) out.push(error({}, `settings: case "${c}" is listed twice`));
    seen.add(c);
  }
  const r = s.requirement;
  if (r.kind === 'cosphi' && !(r.target > 0 && r.target <= 1)) {
    out.push(error({}, `settings: target cos φ must be in (0, 1]; got ${formatNumber(r.target)}`));
  }
  if (r.kind === 'tanphi') {
    if (!(r.lagMax >= 0))
      out.push(error({}, `settings: lagging tan φ limit must be ≥ 0; got ${formatNumber(r.lagMax)}`));
    if (!(r.leadMax >= 0))
      out.push(error({}, `settings: leading tan φ limit must be ≥ 0; got ${formatNumber(r.leadMax)}`));
  }
  if (r.refKw !== undefined && !(r.refKw > 0))
    out.push(
      error(
        {},
        `settings: the rated power the requirement is referred to must be > 0 kW or blank; got ${formatNumber(r.refKw)}`,
      ),
    );
  if (s.sscMva !== undefined && !(s.sscMva > 0))
    out.push(
      error({}, `settings: supply short-circuit power must be > 0 MVA; got ${formatNumber(s.sscMva)}`),
    );
  return out;
}

function validateRow(row: EquipmentRow, site: Site): Problem[] {
  const out: Problem[] = [];
  const at = (column: string) => ({ row: row.row, column, ...(row.tag ? { tag: row.tag } : {}) });
  if (row.tag === '') out.push(error(at('tag'), say.missingTag()));
  if (row.bus === '') out.push(error(at('bus'), say.missingBus()));
  for (const key of ['tag', 'bus', 'to_bus', 'description', 'supply'] as const) {
    const bad = unstorableCharacter(row[key] ?? '');
    if (bad) out.push(error(at(key), say.unstorable(key, bad)));
  }
  const kind = findKind(row.kind);
  if (!kind) {
    out.push(error(at('kind'), say.unknownKind(String(row.kind), kindNames())));
    return out;
  }
  const isBranch = kind.role === 'branch';
  if (isBranch && !row.to_bus)
    out.push(error(at('to_bus'), `to_bus is blank; a ${row.kind} must name the bus it feeds`));
  if (!isBranch && row.to_bus)
    out.push(
      warning(
        at('to_bus'),
        `to_bus is used only by transformers and lines; ignored for a ${row.kind} (use kind line for a feeder)`,
      ),
    );
  append(out, supplyProblems(row, kind, at));
  append(out, validateQuantity(row, isBranch, at));
  // An absurd magnitude (1e308 kW, a quantity of a million) stops the row here: the catalogue
  // calls below would only repeat it as overflow.
  const absurd = magnitudeProblems(row.values, at);
  if (absurd.length > 0) return [...out, ...absurd];

  const missing = kind.required.filter((c) => row.values[c] === undefined);
  for (const c of missing) out.push(error(at(c), say.missingValue(c, row.kind)));
  if (missing.length > 0) return out;

  if (!kind.load) {
    const given = [row.values.load, ...Object.values(row.loads)].some((x) => x !== undefined && x !== 1);
    if (given)
      out.push(
        info(
          at('load'),
          `load factors are not used for a ${row.kind}; its loading is the apparent power of bus ${row.to_bus ?? '?'}`,
        ),
      );
  }
  append(out, plausibilityProblems(row, at));
  append(out, lineResistanceProblems(row, at));
  out.push(...physicsProblems(row, kind, site, at));
  return out;
}

function validateQuantity(
  row: EquipmentRow,
  isBranch: boolean,
  at: (c: string) => { row: number; column: string },
): Problem[] {
  const out: Problem[] = [];
  const { qty, running } = row.values;
  const whole = (x: number) => Number.isInteger(x) && x >= 0;
  if (qty !== undefined && !whole(qty))
    out.push(error(at('qty'), say.outOfRange('qty', 'a whole number ≥ 0', qty)));
  if (running !== undefined && !whole(running))
    out.push(error(at('running'), say.outOfRange('running', 'a whole number ≥ 0', running)));
  if (qty !== undefined && running !== undefined && running > qty) {
    out.push(
      error(at('running'), `running (${formatNumber(running)}) must not exceed qty (${formatNumber(qty)})`),
    );
  }
  if (isBranch && (running ?? qty ?? 1) === 0) {
    out.push(
      error(
        at(running !== undefined ? 'running' : 'qty'),
        `a ${row.kind} with no unit in service cannot feed bus ${row.to_bus ?? '?'}; running must be ≥ 1`,
      ),
    );
  }
  return out;
}

/**
 * The kind's own physics evaluated the way the roll-up will: at no load and full rating for a
 * branch, and at every case's load factor (once each) for a shunt item, after checking the load
 * factor's own range. The catalogue's message names the argument; it is reported on its column.
 */
function physicsProblems(
  row: EquipmentRow,
  kind: KindSpec,
  site: Site,
  at: (c: string) => { row: number; column: string },
): Problem[] {
  const out: Problem[] = [];
  const hz = site.settings.hz;
  const report = (r: { message: string; column: string | undefined }) =>
    out.push(error(at(r.column ?? kind.required[0] ?? 'kind'), r.message));
  if (kind.role === 'branch') {
    const rating = unitRatingKva(row, kind, hz) ?? 0;
    for (const s of new Set([0, rating])) {
      const r = branchPower(row, kind, s, hz);
      if (!r.ok) return (report(r), out);
    }
    return out;
  }
  const range = kind.load?.range ?? [0, 1];
  const tried = new Set<number>();
  for (const c of site.settings.cases) {
    const lf = loadFactor(row, c);
    if (!(lf.value >= range[0] && lf.value <= range[1])) {
      out.push(
        error(
          at(lf.column),
          say.outOfRange(`load factor of a ${row.kind}`, `in [${range[0]}, ${range[1]}]`, lf.value),
        ),
      );
      continue;
    }
    if (tried.has(lf.value)) continue;
    tried.add(lf.value);
    // Off (load 0, nothing running) evaluates nothing: check the physics of one unit at full load then.
    const probe: EquipmentRow = {
      ...row,
      values: { ...row.values, qty: 1, running: 1 },
      loads: lf.value === 0 ? { ...row.loads, [c]: 1 } : row.loads,
    };
    const r = shuntPower(probe, kind, c, hz);
    if (!r.ok) report(r);
    // Behind a drive the motor's own cos φ is not used, but it is still its nameplate: a value
    // no motor can have is reported as for a motor on the line.
    if (r.ok && probe.supply !== undefined) {
      const { supply: _drive, ...own } = probe;
      const plain = shuntPower(own, kind, c, hz);
      if (!plain.ok) report(plain);
    }
  }
  return out;
}

/** One problem per (severity, row, column, message); repeated case checks say the same thing once. */
function dedupe(problems: readonly Problem[]): Problem[] {
  const seen = new Set<string>();
  return problems.filter((p) => {
    const key = `${p.severity}|${p.row ?? ''}|${p.column ?? ''}|${p.message}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

/**
 * Merge parse and validation problems: when parsing already reported an error in a cell, the
 * validation's follow-on complaint about the same cell (e.g. "required and blank") is dropped.
 */
export function mergeProblems(parsed: readonly Problem[], validated: readonly Problem[]): Problem[] {
  const bad = new Set(
    parsed
      .filter((p) => p.severity === 'error' && p.row !== undefined)
      .map((p) => `${p.row}|${p.column ?? ''}`),
  );
  return [
    ...parsed,
    ...validated.filter((p) => p.row === undefined || !bad.has(`${p.row}|${p.column ?? ''}`)),
  ];
}
