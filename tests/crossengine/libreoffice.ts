// Driving LibreOffice Calc headless as the "other spreadsheet program" of the cross-engine check.
// It does not recalculate xlsx files on load by default; a throwaway profile whose
// registrymodifications.xcu sets the Calc load recalculation modes to 0 ("always") makes it.
import { execFileSync } from 'node:child_process';
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { readCsv } from '../../src/io/csv/read.ts';

/** Comma, double quote, UTF-8, full precision (not "as shown"), every sheet to its own file. */
export const CSV_FILTER = 'csv:Text - txt - csv (StarCalc):44,34,UTF8,1,,0,false,true,false,false,false,-1';

const RECALC_ALWAYS = `<?xml version="1.0" encoding="UTF-8"?>
<oor:items xmlns:oor="http://openoffice.org/2001/registry" xmlns:xs="http://www.w3.org/2001/XMLSchema" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance">
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="OOXMLRecalcMode" oor:op="fuse"><value>0</value></prop></item>
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="ODFRecalcMode" oor:op="fuse"><value>0</value></prop></item>
</oor:items>
`;

export function makeRecalcProfile(dir: string): string {
  mkdirSync(join(dir, 'user'), { recursive: true });
  writeFileSync(join(dir, 'user', 'registrymodifications.xcu'), RECALC_ALWAYS);
  return dir;
}

/** Convert every workbook to CSV (one file per sheet) in ONE soffice start: startup is slow. */
export function convertToCsv(profile: string, files: readonly string[], outDir: string): void {
  mkdirSync(outDir, { recursive: true });
  execFileSync(
    'soffice',
    [
      `-env:UserInstallation=file://${profile}`,
      '--headless',
      '--convert-to',
      CSV_FILTER,
      '--outdir',
      outDir,
      ...files,
    ],
    {
      stdio: 'pipe',
      timeout: 240_000,
    },
  );
}

/** The CSV LibreOffice wrote for one sheet of one workbook (`<base>-<sheet>.csv`). */
export function sheetCsv(outDir: string, base: string, sheet: string): string[][] {
  const file = join(outDir, `${base}-${sheet}.csv`);
  return readCsv(readFileSync(file, 'utf8'), { delimiter: ',' });
}

export function csvFiles(outDir: string): string[] {
  return readdirSync(outDir).filter((f) => f.endsWith('.csv'));
}
