// Driving Gnumeric's command-line converter as the second "other spreadsheet program" of the
// cross-engine check. `ssconvert --recalc` recalculates every formula after loading (it does not
// trust the cached values); each sheet goes to its own CSV with values at full precision.
import { execFileSync } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import { basename, join } from 'node:path';

/** Text export: comma, quotes where needed, raw values (not as formatted), one file per sheet. */
const EXPORT_OPTIONS = 'format=raw separator=, quoting-mode=auto eol=unix charset=UTF-8';

/** Recalculate one workbook and write `<base>-<sheet>.csv` per sheet into outDir. */
export function recalcToCsv(file: string, outDir: string): void {
  mkdirSync(outDir, { recursive: true });
  const base = basename(file).replace(/\.xlsx$/, '');
  execFileSync(
    'ssconvert',
    [
      '--recalc',
      '-S',
      '-T',
      'Gnumeric_stf:stf_assistant',
      '-O',
      EXPORT_OPTIONS,
      file,
      join(outDir, `${base}-%s.csv`),
    ],
    { stdio: 'pipe', timeout: 240_000 },
  );
}
