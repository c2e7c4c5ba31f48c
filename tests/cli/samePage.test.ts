// The same file gives the same figures in the page and on the command line: each file is opened
// the way the page opens it (a site file as a template, a saved workbook, a list through the
// import), and for every case each bus's P and Q before and after compensation and whether the
// requirement is met after, as the page's engine computes them, equal `kvar-ledger balance --json`
// on the same file to 1e-9 relative. The banks are the file's own (a site file's "banks", those
// typed on a workbook's Compensation sheet) or, for a file without any, the design's proposal in
// both.
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { run } from '../../src/cli/balance.ts';
import { blankSiteWorkbook } from '../../src/core/workbook/blankSite.ts';
import { siteFromWorkbook } from '../../src/core/workbook/readSite.ts';
import { planCompensationColumns } from '../../src/core/workbook/compensationColumns.ts';
import { equipmentPlans } from '../../src/core/workbook/structure.ts';
import { applyImport, previewImport, proposeMapping, tableFromCsvText } from '../../src/io/import/index.ts';
import { parseWorkbookText } from '../../src/ui/model/docValidate.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';
import { workbookOf } from '../../src/ui/templates/templateBuild.ts';
import { pageFaces, relDiff } from '../ui/living/faces.ts';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const tmp = mkdtempSync(join(tmpdir(), 'kvar-same-'));
const TOL = 1e-9;

interface BusJson {
  bus: string;
  p_kw: number;
  q_kvar: number;
}
interface BalanceJson {
  case: string;
  cases: string[];
  buses: BusJson[];
  compensation: { banks_from: string; met_after: boolean; buses_after: BusJson[] };
}

async function balance(file: string, caseName: string, extra: readonly string[] = []): Promise<BalanceJson> {
  let out = '';
  let err = '';
  const args = [...(caseName ? [file, '--case', caseName, '--json'] : [file, '--json']), ...extra];
  const code = await run(args, {
    out: (t) => void (out += t),
    err: (t) => void (err += t),
  });
  expect(code, err).toBe(0);
  return JSON.parse(out) as BalanceJson;
}

/** Every bus of every case: page against CLI. Returns how many figures were compared. */
async function expectSameFigures(
  s: WorkbookSession,
  file: string,
  banksFrom: 'file' | 'proposed',
  extra: readonly string[] = [],
) {
  const first = await balance(file, '', extra);
  const cases = first.cases;
  const page = pageFaces(s, cases, first.buses.length);
  let compared = 0;
  for (const [k, c] of cases.entries()) {
    const cli = await balance(file, c, extra);
    expect(cli.compensation.banks_from).toBe(banksFrom);
    expect(page.within[k], `${file} case ${c}: within after`).toBe(cli.compensation.met_after);
    for (const b of cli.buses) {
      const p = page.buses.find((x) => x.bus === b.bus)?.cases[k];
      const after = cli.compensation.buses_after.find((x) => x.bus === b.bus);
      if (!p || !after) throw new Error(`${file}: bus ${b.bus} missing in case ${c}`);
      const pairs: Array<[string, number, number]> = [
        ['P before', p[0], b.p_kw],
        ['Q before', p[1], b.q_kvar],
        ['P after', p[3], after.p_kw],
        ['Q after', p[4], after.q_kvar],
      ];
      for (const [what, pageValue, cliValue] of pairs) {
        expect(
          relDiff(pageValue, cliValue),
          `${file} case ${c} bus ${b.bus} ${what}: page ${pageValue}, CLI ${cliValue}`,
        ).toBeLessThan(TOL);
        compared++;
      }
    }
  }
  expect(compared).toBeGreaterThan(0);
  return compared;
}

const TEMPLATES = ['cold-store', 'pumping-station', 'solar-collector'];

describe('the same file gives the same figures in the page and the CLI', () => {
  it.each(TEMPLATES)('%s.json, a site file with its banks', async (id) => {
    const file = join(ROOT, 'templates', `${id}.json`);
    const s = WorkbookSession.fromDoc(await workbookOf(id, readFileSync(file, 'utf8')));
    await expectSameFigures(s, file, 'file');
  });

  it('a site file without banks: both propose the same ones', async () => {
    const site = JSON.parse(readFileSync(join(ROOT, 'templates/cold-store.json'), 'utf8')) as {
      banks?: unknown;
    };
    delete site.banks;
    const file = join(tmp, 'no-banks.json');
    const text = JSON.stringify(site);
    writeFileSync(file, text);
    const s = WorkbookSession.fromDoc(await workbookOf('no-banks', text));
    await expectSameFigures(s, file, 'proposed');
  });

  it('a workbook saved after edits: a motor typed, a bank changed, another cleared', async () => {
    const id = 'pumping-station';
    const s = WorkbookSession.fromDoc(
      await workbookOf(id, readFileSync(join(ROOT, 'templates', `${id}.json`), 'utf8')),
    );
    const sheet = (name: string) => s.engine.getSheetId(name) as number;
    const col = (name: string, header: string) => {
      const c = (s.sheetContents(sheet(name))[0] ?? []).indexOf(header);
      if (c < 0) throw new Error(`${name} has no column ${header}`);
      return c;
    };
    const motors = sheet('Motors');
    const row = s.sheetContents(motors).length;
    const bus = String(s.sheetContents(motors)[1]?.[col('Motors', 'Bus')]);
    s.setCells(motors, [
      { row, col: col('Motors', 'Tag'), content: 'M-EXTRA' },
      { row, col: col('Motors', 'Bus'), content: bus },
      { row, col: col('Motors', 'Rated output (kW)'), content: 160 },
      { row, col: col('Motors', 'Efficiency'), content: 0.95 },
      { row, col: col('Motors', 'cos φ'), content: 0.84 },
    ]);
    const comp = sheet('Compensation');
    const plan = planCompensationColumns(siteCases(s));
    const rows = s.sheetContents(comp);
    const withBank = rows.findIndex((r, i) => i > 0 && typeof r[plan.input.steps] === 'number');
    expect(withBank).toBeGreaterThan(0);
    s.setCells(comp, [{ row: withBank, col: plan.input.steps, content: 2 }]);
    const other = rows.findIndex((r, i) => i > withBank && typeof r[plan.input.steps] === 'number');
    if (other > 0)
      s.setCells(comp, [
        { row: other, col: plan.input.steps, content: null },
        { row: other, col: plan.input.step_kvar, content: null },
        { row: other, col: plan.input.fixed_kvar, content: null },
      ]);
    const file = join(tmp, 'edited.kvar.json');
    writeFileSync(file, JSON.stringify(s.toDoc()));
    // The page opens the saved file the way it opens any workbook file.
    const opened = parseWorkbookText(readFileSync(file, 'utf8'));
    if (!opened.ok) throw new Error(opened.message);
    await expectSameFigures(WorkbookSession.fromDoc(opened.doc), file, 'file');
  });

  it("a site file with blanks: the page's fill and --assume-typical agree", async () => {
    const site = JSON.parse(readFileSync(join(ROOT, 'templates/pumping-station.json'), 'utf8')) as {
      equipment: Array<Record<string, unknown>>;
    };
    // Clear the nameplate values of the motors and transformers inside the typical-value tables
    // (motors up to 1 000 kW, transformer losses up to 3 150 kVA): only their ratings remain.
    let cleared = 0;
    for (const e of site.equipment) {
      const gone =
        e.kind === 'motor' && Number(e.p_kw) <= 1000
          ? ['eff', 'cos_phi', 'i0_pct']
          : e.kind === 'transformer' && Number(e.s_kva) <= 3150
            ? ['uk_pct', 'p0_kw', 'pk_kw', 'i0_pct']
            : [];
      for (const k of gone) {
        delete e[k];
        cleared++;
      }
    }
    expect(cleared).toBeGreaterThan(5);
    const file = join(tmp, 'blanks.json');
    const text = JSON.stringify(site);
    writeFileSync(file, text);
    const s = WorkbookSession.fromDoc(await workbookOf('blanks', text));
    const filled = await s.fillTypicalValues();
    expect(filled.filled).toBe(cleared);
    await expectSameFigures(s, file, 'file', ['--assume-typical']);
    // The same values at the same cells: the page's marks against the CLI's list.
    const doc = s.toDoc();
    // The assumed values' marks (the design options' proposed values are marked too, apart).
    const page = doc.sheets.flatMap((sh) =>
      (sh.marks ?? [])
        .filter((m) => m.kind === 'assumed')
        .map((m) => `${sh.name}!${m.row + 1}:${String(sh.cells[0]?.[m.col])}=${String(m.value)}`),
    );
    const cli = (await balance(file, '', ['--assume-typical'])) as unknown as {
      assumed: Array<{ sheet: string; row: number; field: string; value: number }>;
    };
    const header = (sheet: string, field: string) =>
      String(doc.sheets.find((x) => x.name === sheet)?.cells[0]?.[columnOf(sheet, field)]);
    const columnOf = (sheet: string, field: string) =>
      equipmentPlans(siteCases(s))
        .find((p) => p.sheet.name === sheet)
        ?.input.get(field) ?? -1;
    const listed = cli.assumed.map((a) => `${a.sheet}!${a.row}:${header(a.sheet, a.field)}=${a.value}`);
    expect(listed.sort()).toEqual(page.sort());
  });

  it('a tender list imported with typical values for blanks, and --assume-typical', async () => {
    const csv =
      'Tag,Bus,Kind,Rated output (kW),Efficiency,cos phi,u_kv,sn_kva,to_bus\n' +
      'T1,MV,transformer,,,,0.4,1000,LV\n' +
      'M1,LV,motor,90,,,0.4,,\n' +
      'M2,LV,motor,45,0.93,,0.4,,\n' +
      'M3,LV,motor,132,,0.87,0.4,,\n';
    const file = join(tmp, 'tender.csv');
    writeFileSync(file, csv);
    const table = tableFromCsvText('tender.csv', csv);
    if (!table.ok) throw new Error('the list does not read');
    const preview = previewImport(proposeMapping(table.value), { fillTypical: true });
    expect(preview.assumed.length).toBeGreaterThan(0);
    const r = applyImport(blankSiteWorkbook('tender'), preview, { mode: 'replace' });
    if (!r.ok) throw new Error(r.message);
    // Both propose the banks from the filled site.
    await expectSameFigures(WorkbookSession.fromDoc(r.doc), file, 'proposed', ['--assume-typical']);
  });

  it('an equipment list imported into a blank site', async () => {
    const csv =
      'Tag,Bus,Kind,Rated output (kW),Efficiency,cos phi,u_kv,sn_kva,uk_pct,i0_pct,p0_kw,pk_kw,to_bus\n' +
      'T1,MV,transformer,,,,0.4,1000,6,1.2,1.1,10.5,LV\n' +
      'M1,LV,motor,90,0.95,0.86,0.4,,,,,,\n' +
      'M2,LV,motor,45,0.93,0.83,0.4,,,,,,\n' +
      'M3,LV,motor,132,0.955,0.87,0.4,,,,,,\n';
    const file = join(tmp, 'list.csv');
    writeFileSync(file, csv);
    const table = tableFromCsvText('list.csv', csv);
    if (!table.ok) throw new Error('the list does not read');
    const blank = blankSiteWorkbook('list');
    const preview = previewImport(proposeMapping(table.value));
    const r = applyImport(blank, preview, { mode: 'replace' });
    if (!r.ok) throw new Error(r.message);
    await expectSameFigures(WorkbookSession.fromDoc(r.doc), file, 'proposed');
  });
});

/** The cases named on the Site sheet, read back from the session's document. */
function siteCases(s: WorkbookSession): readonly string[] {
  return siteFromWorkbook(s.toDoc()).site.settings.cases;
}
