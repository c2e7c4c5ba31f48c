// `kvar-ledger <command> [options]`: dispatch to a subcommand from the table in commands.ts.
// Run directly (tsx src/cli/main.ts ...) or through the package bin (bin.mjs).
import { readFileSync, realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { COMMANDS } from './commands.ts';
import type { CliIo } from './io.ts';

function usage(): string {
  const width = Math.max(...Object.keys(COMMANDS).map((n) => n.length));
  const lines = Object.entries(COMMANDS).map(([name, c]) => `  ${name.padEnd(width)}  ${c.summary}`);
  return `usage: kvar-ledger <command> [options]\ncommands:\n${lines.join('\n')}\nkvar-ledger <command> --help shows a command's options.\n`;
}

function version(): string {
  const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as {
    version?: string;
  };
  return `kvar-ledger ${pkg.version ?? 'unknown'}\n`;
}

export async function main(argv: string[], io: CliIo): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined) {
    io.err(`no command given\n${usage()}`);
    return 1;
  }
  if (name === '--help' || name === '-h' || name === 'help') {
    io.out(usage());
    return 0;
  }
  if (name === '--version') {
    io.out(version());
    return 0;
  }
  const entry = Object.hasOwn(COMMANDS, name) ? COMMANDS[name] : undefined;
  if (!entry) {
    io.err(`unknown command "${name}"; commands: ${Object.keys(COMMANDS).join(', ')}\n${usage()}`);
    return 1;
  }
  try {
    const { run } = await entry.load();
    return await run(rest, io);
  } catch (e) {
    // A failure inside a command is a defect, not bad input: say so, with the stack for a report.
    io.err(
      `kvar-ledger ${name}: internal error: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}\n`,
    );
    return 2;
  }
}

export const processIo: CliIo = {
  out: (text) => void process.stdout.write(text),
  err: (text) => void process.stderr.write(text),
};

/** True when this module is the program being run (tsx src/cli/main.ts), not an import. */
function isEntryPoint(): boolean {
  const script = process.argv[1];
  if (!script) return false;
  try {
    return realpathSync(script) === realpathSync(fileURLToPath(import.meta.url));
  } catch {
    return false;
  }
}

if (isEntryPoint()) process.exitCode = await main(process.argv.slice(2), processIo);
