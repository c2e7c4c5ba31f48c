// Accepting an import: the only step that produces a changed workbook, and only as a NEW document.
// The open site is read back from its workbook, the imported rows replace or follow its equipment,
// the merged site is validated as a whole (a tag already in use is an error here), and the
// workbook is rebuilt. The caller swaps documents only when `ok` is true.
import type { EquipmentRow, Site, SiteSettings } from '../../core/site/model.ts';
import { DEFAULT_CASE, defaultSettings } from '../../core/site/defaults.ts';
import { error, type Problem } from '../../core/site/problems.ts';
import { validateSite } from '../../core/site/validate.ts';
import { buildWorkbook, type Flavour } from '../../core/workbook/build.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { siteFromWorkbook } from '../../core/workbook/readSite.ts';
import { assumedInWorkbook } from '../../core/workbook/assumedIn.ts';
import type { ImportPreview } from './preview.ts';

export interface ApplyOptions {
  /** 'replace': the list becomes the equipment; 'append': it follows the current equipment. */
  readonly mode: 'replace' | 'append';
  /** Leave rows with errors out (the user chose so in the dialog); otherwise errors refuse. */
  readonly dropRowsWithErrors?: boolean;
  /** Which workbook to build; the app uses 'live' (default). */
  readonly flavour?: Flavour;
  /**
   * With 'replace': keep the open site's settings (frequency, requirement, short-circuit power,
   * cases, notes; the default) or take the defaults of a new site. The site name stays either way,
   * and every case the list's rows name is kept.
   */
  readonly settings?: 'keep' | 'defaults';
}

export type ApplyResult =
  | {
      readonly ok: true;
      readonly doc: WorkbookDoc;
      readonly site: Site;
      readonly added: number;
      readonly dropped: number;
      /** How many typical values the imported rows took for blanks (marked as assumed). */
      readonly assumed: number;
      readonly problems: readonly Problem[];
    }
  | { readonly ok: false; readonly message: string; readonly problems: readonly Problem[] };

function errorRows(preview: ImportPreview): Set<number> {
  return new Set(
    preview.problems.filter((p) => p.severity === 'error' && p.row !== undefined).map((p) => p.row as number),
  );
}

/** The site settings after the import: the open site's, or with 'defaults' a new site's under its name. */
function settingsAfter(
  current: SiteSettings,
  preview: ImportPreview,
  incoming: readonly EquipmentRow[],
  opts: ApplyOptions,
): SiteSettings {
  if (opts.mode === 'replace' && opts.settings === 'defaults') {
    const named = new Set(incoming.flatMap((e) => Object.keys(e.loads)));
    const cases = [DEFAULT_CASE, ...preview.cases.filter((c) => named.has(c) && c !== DEFAULT_CASE)];
    return defaultSettings(current.name, cases);
  }
  const cases = [...current.cases];
  for (const c of preview.cases) if (!cases.includes(c)) cases.push(c);
  return { ...current, cases };
}

/** Merge an accepted preview into the site of `current` and rebuild; `current` is not modified. */
export function applyImport(current: WorkbookDoc, preview: ImportPreview, opts: ApplyOptions): ApplyResult {
  const missing = preview.proposal.missing;
  if (missing.length > 0)
    return {
      ok: false,
      message: `map a column to ${missing.join(', ')} first; these columns are required`,
      problems: [],
    };
  const bad = errorRows(preview);
  const tableErrors = preview.problems.filter((p) => p.severity === 'error' && p.row === undefined);
  if (tableErrors.length > 0)
    return {
      ok: false,
      message: `the list cannot be imported: ${tableErrors[0]?.message}`,
      problems: tableErrors,
    };
  if (bad.size > 0 && !opts.dropRowsWithErrors) {
    return {
      ok: false,
      message: `${bad.size} row(s) of the list have errors (first: ${preview.problems.find((p) => p.severity === 'error')?.message}); fix them or choose to leave them out`,
      problems: preview.problems,
    };
  }
  const incoming = preview.equipment.filter((e) => !bad.has(e.row));
  const dropped = preview.counts.rows - incoming.length;
  if (incoming.length === 0)
    return { ok: false, message: 'no row of the list can be imported', problems: preview.problems };

  const open = siteFromWorkbook(current);
  const settings = settingsAfter(open.site.settings, preview, incoming, opts);
  const kept = opts.mode === 'append' ? open.site.equipment : [];
  const used = new Set(kept.map((e) => e.tag));
  const clashes = incoming
    .filter((e) => used.has(e.tag))
    .map((e) =>
      error(
        { row: e.row, column: 'tag', tag: e.tag },
        `tag "${e.tag}" is already used in the workbook; rename it or replace the equipment instead of adding`,
      ),
    );
  if (clashes.length > 0)
    return {
      ok: false,
      message: `${clashes.length} tag(s) of the list are already in the workbook (first: ${clashes[0]?.message}); nothing was changed`,
      problems: clashes,
    };
  // Rows are numbered as one list again: the workbook, not the client's file, is now the source.
  const equipment: EquipmentRow[] = [...kept, ...incoming].map((e, i) => ({ ...e, row: i + 2 }));
  const site: Site = { settings, equipment };
  const problems = validateSite(site);
  const errors = problems.filter((p) => p.severity === 'error');
  if (errors.length > 0) {
    return {
      ok: false,
      message: `the site would not be valid after the import (first: ${errors[0]?.message}); nothing was changed`,
      problems: errors,
    };
  }
  // Typical values assumed for the imported rows follow them to their place in the workbook.
  // The open workbook's own assumed values stay marked when the list is added to it.
  const placed = new Map(incoming.map((e, k) => [preview.equipment.indexOf(e), kept.length + k]));
  const arriving = preview.assumed.flatMap((a) => {
    const index = placed.get(a.index);
    return index === undefined ? [] : [{ ...a, index }];
  });
  const assumed = [...(opts.mode === 'append' ? assumedInWorkbook(current, open) : []), ...arriving];
  const doc = buildWorkbook(site, {
    flavour: opts.flavour ?? 'live',
    ...(assumed.length > 0 ? { assumed } : {}),
    ...(opts.mode === 'append' && open.banks.length > 0 ? { banks: open.banks } : {}),
  });
  return {
    ok: true,
    doc: { ...doc, title: current.title },
    site,
    added: incoming.length,
    dropped,
    assumed: arriving.length,
    problems,
  };
}
