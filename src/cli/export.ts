// `kvar-ledger export <file> <out.xlsx> [site options]`: the full workbook in its portable form
// (catalogue and classic functions only) as the hand-off xlsx. A workbook (saved by the app, or
// our own xlsx) goes out whole, as the page exports it; a site file or a list is built first. The file is read by
// the command line's one loader (loadSite.ts), as `balance` reads it. Bad input exits 1 with
// every problem on one line with its row and column, and nothing is written; a wrong command
// line exits 2.
import { writeFileSync } from 'node:fs';
import { extname } from 'node:path';
import type { Problem } from '../core/site/problems.ts';
import { buildWorkbook } from '../core/workbook/build.ts';
import type { WorkbookDoc } from '../core/workbook/document.ts';
import type { XlsxExportReport } from '../io/xlsx/export.ts';
import { optionDrafts } from '../core/workbook/optionDrafts.ts';
import { parseArgs } from './args.ts';
import type { CliIo } from './io.ts';
import { loadSite } from './loadSite.ts';
import { EXIT_HELP, EXIT_OK, inputError, problemLines, refuseErrors, usageError } from './report.ts';
import {
  SITE_FLAGS,
  SITE_LIST_OPTIONS,
  SITE_OPTIONS_HELP,
  SITE_VALUE_OPTIONS,
  readSiteOptions,
} from './siteOptions.ts';
import { reportAssumed } from './assumed.ts';

const USAGE = `usage: kvar-ledger export <file> <out.xlsx> [site options]
Builds the whole workbook (site settings, one sheet per equipment class, buses, compensation)
and writes it as an xlsx whose formulas stay live in any spreadsheet program: catalogue
functions written out as classic functions, results cached, a cover and a functions sheet.
<file> is a workbook saved by the app (*.kvar.json; the banks typed on its Compensation sheet
are kept), an xlsx exported by Kvar Ledger, a site file (templates/*.json), or an equipment
list (CSV, or the first sheet of an xlsx).
${SITE_OPTIONS_HELP}
${EXIT_HELP}
`;

export async function run(argv: string[], io: CliIo): Promise<number> {
  const parsed = parseArgs(argv, {
    command: 'export',
    flags: [...SITE_FLAGS],
    values: [...SITE_VALUE_OPTIONS],
    lists: [...SITE_LIST_OPTIONS],
  });
  if (!parsed.ok) return usageError(io, 'export', parsed.message);
  if (parsed.args.flags.has('--help')) {
    io.out(USAGE);
    return EXIT_OK;
  }
  const [input, output, ...extra] = parsed.args.positional;
  if (input === undefined || output === undefined || extra.length > 0)
    return usageError(
      io,
      'export',
      `export: give an input file and an output .xlsx; got ${parsed.args.positional.length} argument(s)`,
    );
  if (extname(output).toLowerCase() !== '.xlsx')
    return usageError(
      io,
      'export',
      `export: the output file must end in .xlsx; got "${output}" (argument 2)`,
    );
  const options = readSiteOptions(parsed.args);
  if (!options.ok) return usageError(io, 'export', `export: ${options.message}`);
  const loaded = await loadSite(input, options.options);
  if (!loaded.ok)
    return loaded.usage
      ? usageError(io, 'export', `export: ${loaded.message}`)
      : inputError(io, 'export', loaded.message);
  const { site, problems, banks } = loaded.loaded;
  // Values assumed now and those the workbook already held as assumed are marked alike.
  const assumed = [...loaded.loaded.held, ...loaded.loaded.assumed];
  reportAssumed(io, input, site, loaded.loaded);
  if (problems.some((p) => p.severity === 'error'))
    return refuseErrors(io, 'export', input, problems, 'nothing was written');
  // A workbook goes out whole, as the page exports it: its Rates and Tariff, its own sheets,
  // notes and typed-over cells, rendered in the portable flavour.
  const own = loaded.loaded.doc;
  if (own) {
    const { renderWorkbook } = await import('../core/workbook/render.ts');
    const { draftOptionsOfDoc, optionsForExport } = await import('../core/options/index.ts');
    const render = (flavour: 'live' | 'portable') =>
      renderWorkbook(own, { flavour, draftOptions: draftOptionsOfDoc }).doc;
    const live = render('live');
    const { exportWorkbookXlsxWithReport } = await import('../io/xlsx/export.ts');
    const doc = render('portable');
    const report = await exportWorkbookXlsxWithReport(doc, {
      settings: site.settings,
      valuesFrom: live,
      ...optionsForExport(live),
    });
    return written(io, input, output, { ...report, doc }, problems);
  }
  // Values assumed for blanks are marked in their cells, as the page's export marks them.
  // A workbook's own design options stay; a site file or a list gets the standard ones.
  const optionSheet = loaded.loaded.optionSheet;
  const drafts = optionSheet ? optionDrafts(optionSheet, site.settings.cases) : undefined;
  const keep = {
    ...(banks ? { banks } : {}),
    ...(assumed.length > 0 ? { assumed } : {}),
    ...(drafts ? { options: drafts } : {}),
  };
  // The workbook is rebuilt from its site here (the options given changed it): an option input
  // that cannot be read does not come along, and the user is told which.
  const leftOut = (drafts ?? []).flatMap((d) =>
    d.problems.map((p) => ({
      ...p,
      severity: 'warning' as const,
      message: `${p.message}; left out of the export (option "${d.name}")`,
    })),
  );
  const doc = buildWorkbook(site, { flavour: 'portable', ...keep });
  // The xlsx library loads only for this command.
  const { exportWorkbookXlsxWithReport } = await import('../io/xlsx/export.ts');
  // Cached results come from the live flavour (same layout, same values, one fast roll-up).
  const live = buildWorkbook(site, { flavour: 'live', ...keep });
  const { optionsForExport } = await import('../core/options/index.ts');
  const report = await exportWorkbookXlsxWithReport(doc, {
    settings: site.settings,
    valuesFrom: live,
    ...optionsForExport(live),
  });
  return written(io, input, output, { ...report, doc }, [...problems, ...leftOut]);
}

/** Write the exported file and say what it holds; notes and cells written as values go to stderr. */
function written(
  io: CliIo,
  input: string,
  output: string,
  report: XlsxExportReport & { doc: WorkbookDoc },
  problems: readonly Problem[],
): number {
  const doc = report.doc;
  try {
    writeFileSync(output, report.bytes);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why =
      code === 'ENOENT'
        ? 'its folder does not exist'
        : code === 'EACCES' || code === 'EPERM'
          ? 'permission denied'
          : code === 'EISDIR'
            ? 'it is a directory'
            : e instanceof Error
              ? e.message
              : String(e);
    return inputError(io, 'export', `cannot write ${output}: ${why}`);
  }
  const notes = problemLines(
    input,
    problems.filter((p) => p.severity !== 'error'),
  );
  for (const line of notes) io.err(`${line}\n`);
  for (const i of report.issues) io.err(`${output}: note: ${i.where}: ${i.message}\n`);
  let cells = 0;
  for (const s of doc.sheets)
    for (const r of s.cells) for (const c of r) if (typeof c === 'string' && c.startsWith('=')) cells++;
  io.out(
    `wrote ${output}: ${doc.sheets.length} sheets, ${cells} live formulas, ${report.catalogueFunctions.length} catalogue functions written out\n`,
  );
  return EXIT_OK;
}
