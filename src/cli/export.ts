// `kvar-ledger export <list.csv|list.xlsx|template.json> <out.xlsx>`: build the full workbook in
// its portable form (catalogue and classic functions only) and write the hand-off xlsx. Bad input
// exits 1 with every problem said with its row and column; nothing is written then.
import { readFileSync, writeFileSync } from 'node:fs';
import { basename, extname } from 'node:path';
import type { Site } from '../core/site/model.ts';
import { parseEquipmentTable } from '../core/site/parse.ts';
import type { Problem } from '../core/site/problems.ts';
import { readSiteFile } from '../core/site/siteFile.ts';
import { mergeProblems, validateSite } from '../core/site/validate.ts';
import { buildWorkbook } from '../core/workbook/build.ts';
import { readEquipmentFile } from '../io/import/table.ts';
import { describeProblem } from '../io/xlsx/fileProblem.ts';
import { parseArgs } from './args.ts';
import type { CliIo } from './io.ts';

const USAGE = `usage: kvar-ledger export <list.csv|list.xlsx|template.json> <out.xlsx>
Builds the whole workbook (site settings, one sheet per equipment class, buses, compensation)
and writes it as an xlsx whose formulas stay live in any spreadsheet program: catalogue
functions written out as classic functions, results cached, a cover and a functions sheet.
A CSV or xlsx list carries no settings: 50 Hz and cos φ ≥ 0.95 are then assumed.
`;

/** Requirement assumed for a bare equipment list (common practice: many tariffs start at 0.95). */
const LIST_REQUIREMENT = { kind: 'cosphi', target: 0.95 } as const;

type Loaded = { ok: true; site: Site; problems: Problem[] } | { ok: false; message: string };

function readBytes(file: string): Uint8Array | string {
  try {
    return readFileSync(file);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    return code === 'ENOENT'
      ? 'no such file'
      : code === 'EISDIR'
        ? 'it is a directory'
        : e instanceof Error
          ? e.message
          : String(e);
  }
}

async function loadSite(file: string): Promise<Loaded> {
  const bytes = readBytes(file);
  if (typeof bytes === 'string') return { ok: false, message: `cannot read ${file}: ${bytes}` };
  if (extname(file).toLowerCase() === '.json') {
    const { site, problems } = readSiteFile(new TextDecoder().decode(bytes));
    return { ok: true, site, problems };
  }
  const table = await readEquipmentFile(basename(file), bytes);
  if (!table.ok) return { ok: false, message: describeProblem(table.problem) };
  const rows = table.value.rows.map((r) =>
    r.map((c) => (c === null ? '' : typeof c === 'boolean' ? (c ? 'TRUE' : 'FALSE') : String(c))),
  );
  const parsed = parseEquipmentTable(rows, { decimalComma: table.value.decimalComma });
  const name = basename(file, extname(file));
  return {
    ok: true,
    site: {
      settings: { name, hz: 50, cases: parsed.cases, requirement: LIST_REQUIREMENT },
      equipment: parsed.equipment,
    },
    problems: parsed.problems,
  };
}

export async function run(argv: string[], io: CliIo): Promise<number> {
  const parsed = parseArgs(argv, { command: 'export' });
  if (!parsed.ok) {
    io.err(`${parsed.message}\n${USAGE}`);
    return 1;
  }
  if (parsed.args.flags.has('--help')) {
    io.out(USAGE);
    return 0;
  }
  const [input, output, ...extra] = parsed.args.positional;
  if (input === undefined || output === undefined || extra.length > 0) {
    io.err(
      `export: give an input file and an output .xlsx; got ${parsed.args.positional.length} argument(s)\n${USAGE}`,
    );
    return 1;
  }
  if (extname(output).toLowerCase() !== '.xlsx') {
    io.err(`export: the output file must end in .xlsx; got "${output}" (argument 2)\n`);
    return 1;
  }
  const loaded = await loadSite(input);
  if (!loaded.ok) {
    io.err(`export: ${loaded.message}\n`);
    return 1;
  }
  const unreadable =
    loaded.site.equipment.length === 0 && loaded.problems.some((p) => p.severity === 'error');
  const problems = mergeProblems(loaded.problems, unreadable ? [] : validateSite(loaded.site));
  const errors = problems.filter((p) => p.severity === 'error');
  if (errors.length > 0) {
    io.err(
      `export: ${input} has ${errors.length} error${errors.length === 1 ? '' : 's'}; nothing was written:\n` +
        errors.map((p) => `  error: ${p.message}\n`).join(''),
    );
    return 1;
  }
  const doc = buildWorkbook(loaded.site, { flavour: 'portable' });
  // The xlsx library loads only for this command.
  const { exportWorkbookXlsxWithReport } = await import('../io/xlsx/export.ts');
  // Cached results come from the live flavour (same layout, same values, one fast roll-up).
  const live = buildWorkbook(loaded.site, { flavour: 'live' });
  const report = await exportWorkbookXlsxWithReport(doc, {
    settings: loaded.site.settings,
    valuesFrom: live,
  });
  try {
    writeFileSync(output, report.bytes);
  } catch (e) {
    io.err(`export: cannot write ${output}: ${e instanceof Error ? e.message : String(e)}\n`);
    return 1;
  }
  for (const w of problems.filter((p) => p.severity === 'warning')) io.err(`  warning: ${w.message}\n`);
  for (const i of report.issues) io.err(`  note: ${i.where}: ${i.message}\n`);
  const cells = doc.sheets.reduce(
    (n, s) =>
      n + s.cells.reduce((m, r) => m + r.filter((c) => typeof c === 'string' && c.startsWith('=')).length, 0),
    0,
  );
  io.out(
    `wrote ${output}: ${doc.sheets.length} sheets, ${cells} live formulas, ${report.catalogueFunctions.length} catalogue functions written out\n`,
  );
  return 0;
}
