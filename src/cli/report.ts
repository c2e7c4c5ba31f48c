// How every command says that something is wrong: one line per problem, starting with the
// command and the file, then the row and column where known; no stack trace. Exit statuses:
// 0 done, 1 the input cannot be used, 2 the command line is wrong.
import type { Problem } from '../core/site/problems.ts';
import type { CliIo } from './io.ts';

export const EXIT_OK = 0;
export const EXIT_INPUT = 1;
export const EXIT_USAGE = 2;

/** The exit-status paragraph of every command's --help. */
export const EXIT_HELP = `Exit status: 0 done; 1 the input cannot be used (each problem on one line, with the file,
row and column); 2 the command line is wrong (unknown option, missing or bad value, or an
option the file does not fit). Messages go to standard error, never with a stack trace.`;

/** Most problem lines printed; the rest are counted. */
export const MAX_PROBLEM_LINES = 50;

/** One line, control characters and line breaks flattened (a message may quote file content). */
export function oneLine(text: string): string {
  // eslint-disable-next-line no-control-regex -- control characters are what this replaces
  return text.replace(/[\r\n]+/g, ' ').replace(/[\u0000-\u0008\u000b-\u001f\u007f]/g, '·');
}

export function usageError(io: CliIo, command: string, message: string): number {
  io.err(`kvar-ledger ${oneLine(message)} (see kvar-ledger ${command} --help)\n`);
  return EXIT_USAGE;
}

export function inputError(io: CliIo, command: string, message: string): number {
  io.err(`kvar-ledger ${command}: ${oneLine(message)}\n`);
  return EXIT_INPUT;
}

/** "list.csv: row 7, column C (Motor kW): …" per problem; warnings and notes say so. */
export function problemLines(file: string, problems: readonly Problem[]): string[] {
  const shown = problems.slice(0, MAX_PROBLEM_LINES).map((p) => {
    const label = p.severity === 'error' ? '' : `${p.severity}: `;
    return `${file}: ${label}${oneLine(p.message)}`;
  });
  if (problems.length > MAX_PROBLEM_LINES)
    shown.push(`${file}: … and ${problems.length - MAX_PROBLEM_LINES} more`);
  return shown;
}

/** Refuse a file whose rows have errors: a summary line, then one line per error. */
export function refuseErrors(
  io: CliIo,
  command: string,
  file: string,
  problems: readonly Problem[],
  consequence: string,
): number {
  // In the file's order: a reader fixes them top to bottom (file-wide problems first).
  const errors = problems
    .filter((p) => p.severity === 'error')
    .map((p, i) => ({ p, i }))
    .sort((a, b) => (a.p.row ?? 0) - (b.p.row ?? 0) || a.i - b.i)
    .map((x) => x.p);
  const only = errors.length === 1 ? errors[0] : undefined;
  if (only) {
    io.err(`kvar-ledger ${command}: ${file}: ${oneLine(only.message)}; ${consequence}\n`);
    return EXIT_INPUT;
  }
  io.err(
    `kvar-ledger ${command}: ${file} has ${errors.length} errors; ${consequence}\n` +
      problemLines(file, errors)
        .map((l) => `${l}\n`)
        .join(''),
  );
  return EXIT_INPUT;
}
