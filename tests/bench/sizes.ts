// What the bench measures: the site sizes, the time each phase of a size may take, and the
// command-line options of `npm run bench`. A phase that runs past its budget is stopped and
// reported as "exceeded N s", so the whole bench stays within about fifteen minutes.

export interface BenchSize {
  readonly rows: number;
  readonly buses: number;
  /** Seconds each child-process phase may take (see phases.ts) and the whole-process steps. */
  readonly budget: {
    readonly core: number;
    readonly engine: number;
    readonly edits: number;
    readonly model: number;
    readonly xlsx: number;
    readonly cli: number;
    readonly cliExport: number;
    readonly peer: number;
  };
}

export const SIZES: readonly BenchSize[] = [
  {
    rows: 1_000,
    buses: 30,
    budget: { core: 60, engine: 90, edits: 60, model: 90, xlsx: 60, cli: 60, cliExport: 60, peer: 60 },
  },
  {
    rows: 10_000,
    buses: 300,
    budget: { core: 120, engine: 180, edits: 120, model: 180, xlsx: 120, cli: 90, cliExport: 120, peer: 120 },
  },
  {
    rows: 50_000,
    buses: 1_000,
    budget: { core: 150, engine: 180, edits: 150, model: 180, xlsx: 90, cli: 60, cliExport: 120, peer: 60 },
  },
];

/** The size the targets of the issue are stated for. */
export const TARGET_ROWS = 10_000;

export function sizeLabel(s: { rows: number; buses: number }): string {
  return `${s.rows.toLocaleString('en-GB')} rows / ${s.buses.toLocaleString('en-GB')} buses`;
}

export interface BenchOptions {
  readonly sizes: readonly BenchSize[];
  readonly browser: boolean;
  readonly peer: boolean;
  readonly cli: boolean;
  /** Where results.json and results.md go. */
  readonly outDir: string;
}

export const USAGE = `usage: npm run bench -- [--sizes 1000,10000,50000] [--no-browser] [--no-peer] [--no-cli] [--out DIR]
  --sizes     equipment rows of the sites to measure (of ${SIZES.map((s) => s.rows).join(', ')})
  --no-browser  skip the page measurements (headless chromium)
  --no-peer     skip LibreOffice
  --no-cli      skip the command line as a process
  --out DIR     write results.json and results.md there (default tests/bench)`;

export function parseOptions(argv: readonly string[], defaultOut: string): BenchOptions {
  let sizes: readonly BenchSize[] = SIZES;
  let browser = true;
  let peer = true;
  let cli = true;
  let outDir = defaultOut;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i] as string;
    const value = (): string => {
      const v = argv[++i];
      if (v === undefined) throw new Error(`${a} needs a value\n${USAGE}`);
      return v;
    };
    if (a === '--no-browser') browser = false;
    else if (a === '--no-peer') peer = false;
    else if (a === '--no-cli') cli = false;
    else if (a === '--out') outDir = value();
    else if (a === '--sizes') {
      const wanted = value()
        .split(',')
        .map((t) => Number(t.trim()));
      sizes = wanted.map((rows) => {
        const found = SIZES.find((s) => s.rows === rows);
        if (!found)
          throw new Error(
            `--sizes: ${rows} is not a bench size; allowed: ${SIZES.map((s) => s.rows).join(', ')}`,
          );
        return found;
      });
    } else throw new Error(`unknown option "${a}"\n${USAGE}`);
  }
  return { sizes, browser, peer, cli, outDir };
}
