// What --assume-typical put in, as a command tells it: one line per value on stderr, or the
// "assumed" list of --json. Sheet and row are those of the workbook the site becomes (where an
// export marks the value); the row numbers of the file read are in the loader's messages.
import type { Site } from '../core/site/model.ts';
import type { AssumedInput } from '../core/site/typical/fillSite.ts';
import { assumedPlaces } from '../core/workbook/inputsFromSite.ts';
import type { CliIo } from './io.ts';
import { MAX_PROBLEM_LINES, oneLine } from './report.ts';

export interface AssumedJson {
  readonly sheet: string;
  /** 1-based row of the sheet. */
  readonly row: number;
  readonly tag: string;
  readonly field: string;
  readonly value: number;
  /** Basis and source of the value. */
  readonly source: string;
}

export function assumedJson(site: Site, assumed: readonly AssumedInput[]): AssumedJson[] {
  return assumedPlaces(site, assumed).map((p) => ({
    sheet: p.sheet,
    row: p.mark.row + 1,
    tag: p.item.tag,
    field: p.item.column,
    value: p.item.value,
    source: p.item.note,
  }));
}

/** "list.csv: assumed: Motors row 3 (M-11): eff = 0.914 (11 kW, …)", then the blanks left blank. */
export function reportAssumed(
  io: CliIo,
  file: string,
  site: Site,
  loaded: { readonly assumed: readonly AssumedInput[]; readonly notAssumed: readonly string[] },
): void {
  const items = assumedJson(site, loaded.assumed);
  for (const a of items.slice(0, MAX_PROBLEM_LINES))
    io.err(
      oneLine(`${file}: assumed: ${a.sheet} row ${a.row} (${a.tag}): ${a.field} = ${a.value} (${a.source})`) +
        '\n',
    );
  if (items.length > 0)
    io.err(
      `${file}: ${items.length} typical value(s) assumed for blanks${items.length > MAX_PROBLEM_LINES ? ` (the first ${MAX_PROBLEM_LINES} listed; balance --json lists all)` : ''}; replace them with nameplate or maker's data\n`,
    );
  for (const why of loaded.notAssumed.slice(0, MAX_PROBLEM_LINES))
    io.err(oneLine(`${file}: not assumed: ${why}`) + '\n');
  if (loaded.notAssumed.length > MAX_PROBLEM_LINES)
    io.err(`${file}: …and ${loaded.notAssumed.length - MAX_PROBLEM_LINES} more blanks not assumed\n`);
}
