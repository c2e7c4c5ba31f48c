// The subcommands of `kvar-ledger`, one line each. A command lives in its own file exporting
// `run(argv, io)`; it is loaded only when used, so `eval` does not load the xlsx library.
import type { RunCommand } from './io.ts';

export interface CommandEntry {
  /** One line for the usage text. */
  readonly summary: string;
  readonly load: () => Promise<{ run: RunCommand }>;
}

export const COMMANDS: Readonly<Record<string, CommandEntry>> = {
  eval: { summary: 'evaluate formulas with the function catalogue', load: () => import('./eval.ts') },
  functions: {
    summary: 'list the function catalogue (signatures, units, sources)',
    load: () => import('./functions.ts'),
  },
  balance: {
    summary: 'bus balance of a site for one operating case, with compensation and warnings',
    load: () => import('./balance.ts'),
  },
  quote: {
    summary: 'the items of the compensation per bus and their cost at your rates',
    load: () => import('./quote.ts'),
  },
  export: {
    summary: 'write the whole workbook as an xlsx whose formulas stay live elsewhere',
    load: () => import('./export.ts'),
  },
};
