// A small option parser for the subcommands: flags (--json), options with a value
// (--case NAME or --case=NAME) and positional arguments. Unknown options are an error that says
// which option and what is allowed. Anything not starting with "--" (or exactly "-h") is
// positional, so formulas such as "-5+A1" or "=-2" pass through.

export interface ArgSpec {
  readonly command: string;
  readonly flags?: readonly string[];
  readonly values?: readonly string[];
  /** Options with a value that may be given more than once (--map A=tag --map B=bus). */
  readonly lists?: readonly string[];
}

export interface ParsedArgs {
  readonly positional: string[];
  readonly flags: Set<string>;
  readonly values: Map<string, string>;
  readonly lists: Map<string, string[]>;
}

export type ArgsResult =
  { readonly ok: true; readonly args: ParsedArgs } | { readonly ok: false; readonly message: string };

function allowedText(spec: ArgSpec): string {
  const all = [
    ...(spec.flags ?? []),
    ...[...(spec.values ?? []), ...(spec.lists ?? [])].map((v) => `${v} VALUE`),
    '--help',
  ];
  return all.join(', ');
}

export function parseArgs(argv: readonly string[], spec: ArgSpec): ArgsResult {
  const positional: string[] = [];
  const flags = new Set<string>();
  const values = new Map<string, string>();
  const lists = new Map<string, string[]>();
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i] as string;
    if (a === '--') {
      for (const rest of argv.slice(i + 1)) positional.push(rest);
      break;
    }
    if (a === '-h' || a === '--help') {
      flags.add('--help');
      continue;
    }
    if (!a.startsWith('--')) {
      positional.push(a);
      continue;
    }
    const eq = a.indexOf('=');
    const name = eq < 0 ? a : a.slice(0, eq);
    if (spec.values?.includes(name) || spec.lists?.includes(name)) {
      const position = i + 1;
      const value = eq < 0 ? argv[++i] : a.slice(eq + 1);
      if (value === undefined || value === '') {
        return { ok: false, message: `${spec.command}: option ${name} needs a value (argument ${position})` };
      }
      if (spec.lists?.includes(name)) lists.set(name, [...(lists.get(name) ?? []), value]);
      else if (values.has(name))
        return {
          ok: false,
          message: `${spec.command}: option ${name} is given twice (argument ${position})`,
        };
      else values.set(name, value);
    } else if (spec.flags?.includes(name) && eq < 0) {
      flags.add(name);
    } else {
      return {
        ok: false,
        message: `${spec.command}: unknown option ${a} (argument ${i + 1}); allowed: ${allowedText(spec)}`,
      };
    }
  }
  return { ok: true, args: { positional, flags, values, lists } };
}
