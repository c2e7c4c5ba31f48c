// `kvar-ledger <command> [options]`: dispatch to a subcommand from the table in commands.ts.
// Run directly (tsx src/cli/main.ts ...) or through the package bin (bin.mjs).
import { readFileSync, realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { COMMANDS } from './commands.ts';
import type { CliIo } from './io.ts';
import { EXIT_HELP, EXIT_INPUT, EXIT_OK, EXIT_USAGE, oneLine } from './report.ts';

function usage(): string {
  const width = Math.max(...Object.keys(COMMANDS).map((n) => n.length));
  const lines = Object.entries(COMMANDS).map(([name, c]) => `  ${name.padEnd(width)}  ${c.summary}`);
  return `usage: kvar-ledger <command> [options]\ncommands:\n${lines.join('\n')}\nkvar-ledger <command> --help shows a command's options.\n${EXIT_HELP}\n`;
}

function version(): string {
  // src/cli/main.ts or its compiled copy node_modules/.kvar-ledger-cli/cli/main.js: two or three up.
  for (const up of ['../../package.json', '../../../package.json']) {
    try {
      const pkg = JSON.parse(readFileSync(new URL(up, import.meta.url), 'utf8')) as {
        name?: string;
        version?: string;
      };
      if (pkg.name === 'kvar-ledger') return `kvar-ledger ${pkg.version ?? 'unknown'}\n`;
    } catch {
      // not here: look one level further up
    }
  }
  return 'kvar-ledger (version unknown: package.json not found)\n';
}

export async function main(argv: string[], io: CliIo): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined) {
    io.err(
      `kvar-ledger: no command given; commands: ${Object.keys(COMMANDS).join(', ')} (see kvar-ledger --help)\n`,
    );
    return EXIT_USAGE;
  }
  if (name === '--help' || name === '-h' || name === 'help') {
    io.out(usage());
    return EXIT_OK;
  }
  if (name === '--version') {
    io.out(version());
    return EXIT_OK;
  }
  const entry = Object.hasOwn(COMMANDS, name) ? COMMANDS[name] : undefined;
  if (!entry) {
    io.err(
      `kvar-ledger: unknown command "${oneLine(name)}"; commands: ${Object.keys(COMMANDS).join(', ')} (see kvar-ledger --help)\n`,
    );
    return EXIT_USAGE;
  }
  try {
    const { run } = await entry.load();
    return await run(rest, io);
  } catch (e) {
    // A failure inside a command is a defect, not bad input. The user gets one line; the stack
    // only when asked for (KVAR_LEDGER_DEBUG=1), for a report.
    const debug = process.env.KVAR_LEDGER_DEBUG === '1';
    const what = e instanceof Error ? e.message : String(e);
    io.err(
      `kvar-ledger ${name}: internal error: ${oneLine(what)}; nothing was written (please report it; KVAR_LEDGER_DEBUG=1 shows where it happened)\n` +
        (debug && e instanceof Error && e.stack ? `${e.stack}\n` : ''),
    );
    return EXIT_INPUT;
  }
}

/**
 * A closed pipe (kvar-ledger … | head) is not an error to report: stop writing quietly instead
 * of dying with an EPIPE stack trace.
 */
export function guardPipes(): void {
  for (const stream of [process.stdout, process.stderr])
    stream.on('error', (e: NodeJS.ErrnoException) => {
      if (e.code === 'EPIPE') process.exit(process.exitCode ?? 0);
      throw e;
    });
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

if (isEntryPoint()) {
  guardPipes();
  process.exitCode = await main(process.argv.slice(2), processIo);
}
