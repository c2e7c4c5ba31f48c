// `kvar-ledger eval "<formula>" [...] [--json]`: evaluate formulas with the function catalogue.
// Every formula is read by our parser first, so a typing error is reported with its position
// (exit 1) before anything is evaluated; a formula that evaluates to an error value is a result.
import { createEngine, evaluateFormula, type ScalarValue } from '../engine/index.ts';
import { parseFormula } from '../io/formula/parse.ts';
import { parseArgs } from './args.ts';
import type { CliIo } from './io.ts';

const USAGE = `usage: kvar-ledger eval "<formula>" ["<formula>" ...] [--json]
Evaluates each formula with the function catalogue and the standard spreadsheet functions.
The leading "=" may be left out. Cell references point into an empty sheet (blank cells).
  --json   print an array of {formula, value} or {formula, error, message}
`;

export type EvalResult =
  { formula: string; value: ScalarValue } | { formula: string; error: string; message: string };

function valueText(v: ScalarValue): string {
  if (v === null) return '(blank)';
  if (typeof v === 'boolean') return v ? 'TRUE' : 'FALSE';
  return String(v);
}

function asFormula(text: string): string {
  return text.trimStart().startsWith('=') ? text : `=${text}`;
}

/** Problems that make the input unusable: an empty formula or one our parser cannot read. */
function readProblems(formulas: readonly string[]): string[] {
  const problems: string[] = [];
  formulas.forEach((f, i) => {
    if (f.trim() === '' || f.trim() === '=') {
      problems.push(`eval: formula ${i + 1} is empty`);
      return;
    }
    const parsed = parseFormula(f);
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
  if (!parsed.ok) {
    io.err(`${parsed.message}\n${USAGE}`);
    return 1;
  }
  const { positional: formulas, flags } = parsed.args;
  if (flags.has('--help')) {
    io.out(USAGE);
    return 0;
  }
  if (formulas.length === 0) {
    io.err(`eval: no formula given\n${USAGE}`);
    return 1;
  }
  const problems = readProblems(formulas);
  const results = problems.length === 0 ? evaluateAll(formulas) : [];
  // The engine's own parse errors (syntax our parser accepts but the engine does not).
  results.forEach((r, i) => {
    if ('error' in r && r.error === '#ERROR!')
      problems.push(`eval: formula ${i + 1} (${r.formula}): ${r.message}`);
  });
  if (problems.length > 0) {
    io.err(problems.join('\n') + '\n');
    return 1;
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
  return 0;
}
