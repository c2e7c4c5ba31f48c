// `kvar-ledger eval "<formula>" [...] [--json]`: evaluate formulas with the function catalogue.
// Every formula is read by our parser first, so a typing error is reported with its position
// (exit 1) before anything is evaluated. A formula that evaluates to an error value is printed
// like any result, and the exit status is then 1, so a script notices.
import { createEngine, evaluateFormula, type ScalarValue } from '../engine/index.ts';
import { commaSeparated, parseFormula } from '../io/formula/index.ts';
import { parseArgs } from './args.ts';
import type { CliIo } from './io.ts';
import { EXIT_HELP, EXIT_INPUT, EXIT_OK, oneLine, usageError } from './report.ts';

const USAGE = `usage: kvar-ledger eval "<formula>" ["<formula>" ...] [--json]
Evaluates each formula with the function catalogue and the standard spreadsheet functions.
The leading "=" may be left out. Cell references point into an empty sheet (blank cells).
Arguments are separated by "," and decimals written with "."; a formula written with ";"
between arguments and no "," at all is read with "," instead.
  --json   print an array of {formula, value} or {formula, error, message}
Every result is printed, errors included (e.g. #N/A with the catalogue's message); when one
or more formulas give an error value, a line on standard error counts them and the exit
status is 1.
${EXIT_HELP}
`;

export type EvalResult =
  { formula: string; value: ScalarValue } | { formula: string; error: string; message: string };

function valueText(v: ScalarValue): string {
  if (v === null) return '(blank)';
  if (typeof v === 'boolean') return v ? 'TRUE' : 'FALSE';
  return String(v);
}

/** With its "=" and with ';' between arguments read as ',' where nothing else can be meant. */
function asFormula(text: string): string {
  return commaSeparated(text.trimStart().startsWith('=') ? text : `=${text}`).text;
}

/** Problems that make the input unusable: an empty formula or one our parser cannot read. */
function readProblems(formulas: readonly string[]): string[] {
  const problems: string[] = [];
  formulas.forEach((f, i) => {
    if (f.trim() === '' || f.trim() === '=') {
      problems.push(`eval: formula ${i + 1} is empty`);
      return;
    }
    const parsed = parseFormula(asFormula(f));
    if (!parsed.ok) problems.push(`eval: formula ${i + 1} (${f}): ${parsed.message}`);
  });
  return problems;
}

export function evaluateAll(formulas: readonly string[]): EvalResult[] {
  const hf = createEngine([{ name: 'Sheet1', cells: [] }]);
  try {
    return formulas.map((formula) => {
      const r = evaluateFormula(hf, asFormula(formula), 'Sheet1');
      return r.ok ? { formula, value: r.value } : { formula, error: r.error, message: r.message };
    });
  } finally {
    hf.destroy();
  }
}

export async function run(argv: string[], io: CliIo): Promise<number> {
  const parsed = parseArgs(argv, { command: 'eval', flags: ['--json'] });
  if (!parsed.ok) return usageError(io, 'eval', parsed.message);
  const { positional: formulas, flags } = parsed.args;
  if (flags.has('--help')) {
    io.out(USAGE);
    return EXIT_OK;
  }
  if (formulas.length === 0) return usageError(io, 'eval', 'eval: no formula given');
  const problems = readProblems(formulas);
  const results = problems.length === 0 ? evaluateAll(formulas) : [];
  // The engine's own parse errors (syntax our parser accepts but the engine does not).
  results.forEach((r, i) => {
    if ('error' in r && r.error === '#ERROR!')
      problems.push(`eval: formula ${i + 1} (${r.formula}): ${r.message}`);
  });
  if (problems.length > 0) {
    io.err(problems.map((p) => `kvar-ledger ${oneLine(p)}\n`).join(''));
    return EXIT_INPUT;
  }
  if (flags.has('--json')) io.out(JSON.stringify(results, null, 2) + '\n');
  else
    io.out(
      results
        .map((r) =>
          'error' in r ? `${r.formula} → ${r.error} ${r.message}` : `${r.formula} → ${valueText(r.value)}`,
        )
        .join('\n') + '\n',
    );
  const failed = results.filter((r) => 'error' in r).length;
  if (failed === 0) return EXIT_OK;
  io.err(
    `kvar-ledger eval: ${failed} of ${results.length} formula${results.length === 1 ? '' : 's'} ${failed === 1 ? 'gives' : 'give'} an error value (shown above)\n`,
  );
  return EXIT_INPUT;
}
