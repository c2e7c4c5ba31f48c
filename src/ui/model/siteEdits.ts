// What a user's cell writes mean in a site workbook, decided before they reach the engine:
// inputs and notes are written as typed; a value typed over a generated cell is kept and marked
// (an override), and clearing such a cell brings Kvar Ledger's formula back; a name typed over a
// bus on the Buses sheet renames the bus everywhere it is used; header rows stay as they are.
// `follow` then says what the living model writes to keep everything in step.
import type { CellContent } from '../../core/workbook/document.ts';
import { busKey } from '../../core/site/busNames.ts';
import { readSettingsInputs, type SettingsInputs } from '../../core/workbook/renderSettings.ts';
import { casesOf } from '../../core/workbook/render.ts';
import type { EquipmentColumns } from '../../core/workbook/equipmentColumns.ts';
import type { ContentStore } from './contentStore.ts';
import type { SiteModel, Write } from './siteModel.ts';
import { SessionError } from './sessionError.ts';
import { shownText, textContent } from '../../core/text/cellText.ts';

export interface FollowUp {
  readonly writes: readonly Write[];
  /** Something beyond the written cells changed (computed rows, buses, sheets written anew). */
  readonly structural: boolean;
  /** The cases or the Site sheet's lists changed: every built-in sheet is written anew. */
  readonly rebuild?: { readonly caseRenames: ReadonlyMap<string, string> };
}

export interface EditPlan {
  readonly writes: readonly Write[];
  follow(): FollowUp;
}

type Cell = { row: number; col: number; content: CellContent };

const TEXT_KEYS = new Set(['tag', 'bus', 'to_bus', 'kind']);

/** Text in tag, bus, fed-bus and kind cells is taken without surrounding spaces (names must match exactly). */
function trimmed(cols: EquipmentColumns, col: number, v: CellContent): CellContent {
  if (typeof v !== 'string' || v.startsWith('=')) return v;
  for (const [key, c] of cols.input)
    if (c === col && TEXT_KEYS.has(key)) return v.trim() === '' ? null : v.trim();
  return v;
}

/** A step series typed as 1:2:2 is text, not the time of day the engine would read it as. */
function seriesText(v: CellContent): CellContent {
  if (typeof v !== 'string' || v.startsWith('=') || v.startsWith("'")) return v;
  return v.trim() === '' ? null : textContent(v.trim());
}

function settingsFrom(contents: ContentStore, sheet: number, name: string): SettingsInputs {
  return readSettingsInputs({ name, cells: contents.get(sheet).map((r) => [...r]) });
}

export function siteEdit(
  site: SiteModel,
  contents: ContentStore,
  sheet: number,
  cells: readonly Cell[],
): EditPlan {
  const role = site.role(sheet);
  const writes: Write[] = [];
  const restores: Cell[] = [];
  const touched = new Map<number, Set<number>>();
  const renamed = new Map<string, string>();
  const header = (name: string) =>
    new SessionError(
      `The header row of ${name} names the columns that formulas, the CLI and the export rely on; it stays as it is.`,
    );

  for (const c of cells) {
    if (role.kind !== 'user' && role.kind !== 'site' && c.row === 0) {
      if (
        c.content === null ||
        c.content === site.generatedContent(sheet, 0, c.col, settingsFrom(contents, site.ids.site, ''))
      )
        continue;
      throw header(
        role.kind === 'equipment'
          ? (site.plans().plans[role.index] as EquipmentColumns).sheet.name
          : role.kind === 'buses'
            ? 'Buses'
            : 'Compensation',
      );
    }
    if (role.kind === 'buses' && c.col === 0 && c.row <= site.state.rendered.buses.length) {
      renameBus(site, contents, c, writes, touched, renamed);
      continue;
    }
    if (role.kind === 'compensation' && c.col === 0 && c.row <= site.state.rendered.buses.length) {
      throw new SessionError(
        'The Bus column of the Compensation sheet follows the Buses sheet: rename a bus there, where the name is typed over.',
      );
    }
    if (site.isGenerated(sheet, c.row, c.col)) {
      const blank = c.content === null || (typeof c.content === 'string' && c.content.trim() === '');
      site.setOverride(sheet, c.row, c.col, !blank);
      if (blank) restores.push(c);
      else writes.push({ sheet, ...c });
      continue;
    }
    if (role.kind === 'equipment') {
      const cols = site.plans().plans[role.index] as EquipmentColumns;
      writes.push({ sheet, row: c.row, col: c.col, content: trimmed(cols, c.col, c.content) });
      if (c.col < cols.firstComputed) {
        const set = touched.get(role.index) ?? new Set<number>();
        set.add(c.row);
        touched.set(role.index, set);
      }
      continue;
    }
    if (role.kind === 'compensation' && c.col === site.plans().comp.input.series) {
      writes.push({ sheet, row: c.row, col: c.col, content: seriesText(c.content) });
      continue;
    }
    writes.push({ sheet, ...c });
  }

  return {
    writes,
    follow(): FollowUp {
      if (role.kind === 'site') {
        const before = site.state.cases;
        const inputs = settingsFrom(contents, sheet, 'Site');
        const cases = casesOf(inputs);
        checkCases(inputs);
        if (cases.join('\u0000') !== before.join('\u0000') || inputs.notes.length !== site.state.notes) {
          return { writes: [], structural: true, rebuild: { caseRenames: renamesOf(before, cases) } };
        }
      }
      const out: Write[] = [];
      // One by one: rewriting the derived sheets runs to 100,000 writes and more, beyond a spread.
      if (touched.size > 0) for (const w of site.afterEquipmentWrites(touched, renamed)) out.push(w);
      const settings = settingsFrom(contents, site.ids.site, 'Site');
      for (const c of restores) {
        if (out.some((w) => w.sheet === sheet && w.row === c.row && w.col === c.col)) continue;
        out.push({
          sheet,
          row: c.row,
          col: c.col,
          content: site.generatedContent(sheet, c.row, c.col, settings),
        });
      }
      return { writes: out, structural: touched.size > 0 && out.length > 0 };
    },
  };
}

/** A bus name typed over on the Buses sheet: every bus and fed-bus cell naming the old bus gets the new name. */
function renameBus(
  site: SiteModel,
  contents: ContentStore,
  c: Cell,
  writes: Write[],
  touched: Map<number, Set<number>>,
  renamed: Map<string, string>,
): void {
  const old = site.state.rendered.buses[c.row - 1];
  if (!old) return;
  const name =
    c.content === null
      ? ''
      : (typeof c.content === 'string' ? shownText(c.content) : String(c.content)).trim();
  if (name === '') {
    throw new SessionError(
      `Bus ${old.name} keeps a name: to remove a bus, move or delete the equipment on it.`,
    );
  }
  if (name.startsWith('=')) throw new SessionError('A bus name is text, not a formula.');
  const clash = site.state.rendered.buses.find((b) => b.key === busKey(name) && b.key !== old.key);
  if (clash)
    throw new SessionError(
      `There is already a bus called ${clash.name}; choose another name (to merge buses, move their equipment).`,
    );
  if (name === old.name) return;
  renamed.set(old.key, busKey(name));
  site.plans().plans.forEach((cols, index) => {
    const sheet = site.ids.equipment[index] as number;
    site.state.rows[index]?.forEach((_info, i) => {
      const row = i + 1;
      for (const key of ['bus', 'to_bus'] as const) {
        const col = cols.input.get(key);
        const v = col === undefined ? null : contents.cell(sheet, row, col);
        if (
          col === undefined ||
          v === null ||
          busKey((typeof v === 'string' ? shownText(v) : String(v)).trim()) !== old.key
        )
          continue;
        writes.push({ sheet, row, col, content: textContent(name) });
        const set = touched.get(index) ?? new Set<number>();
        set.add(row);
        touched.set(index, set);
      }
    });
  });
}

/** Cases must have distinct names; at least one stays. */
function checkCases(inputs: SettingsInputs): void {
  const seen = new Set<string>();
  for (const c of inputs.cases) {
    const t = (typeof c === 'string' ? shownText(c) : String(c)).trim();
    if (seen.has(t.toLowerCase()))
      throw new SessionError(`There is already a case called ${t}; case names must differ.`);
    seen.add(t.toLowerCase());
  }
  if (inputs.cases.length === 0)
    throw new SessionError('A site keeps at least one operating case; rename it instead of clearing it.');
}

/** Cases renamed in place: same count, same position, another name. */
function renamesOf(before: readonly string[], after: readonly string[]): Map<string, string> {
  const out = new Map<string, string>();
  if (before.length !== after.length) return out;
  before.forEach((c, i) => {
    if (after[i] !== c) out.set(c, after[i] as string);
  });
  return out;
}
