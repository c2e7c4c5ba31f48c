// `kvar-ledger quote`: the schedule and its cost from a template, a workbook with its own Rates
// sheet, and a rates CSV; costs recomputed here as quantity × rate and the surcharges by hand
// (installation and engineering on the equipment, contingency on equipment plus both).
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import { RATES_SHEET, TARIFF_SHEET, type Saving } from '../../src/core/quote/index.ts';
import { QC, QUANTITIES_SHEET, savingRowOf } from '../../src/core/workbook/quantitiesLayout.ts';
import { renderWorkbook } from '../../src/core/workbook/render.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';
import { readSiteFile } from '../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../src/core/workbook/build.ts';
import { OPTIONS_SHEET, planOptionColumns } from '../../src/core/workbook/optionsLayout.ts';
import { sheetOptions } from '../core/workbook/optionFaces.ts';

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'kvar-quote-'));
});

async function cli(...argv: string[]) {
  let out = '';
  let err = '';
  const code = await main(['quote', ...argv], { out: (s) => (out += s), err: (s) => (err += s) });
  return { code, out, err };
}

interface Line {
  code: string;
  quantity: number | null;
  rate: number | null;
  cost: number | null;
}
interface Json {
  rates_from: string;
  banks_from: string;
  buses: { bus: string; items: Line[]; subtotal: number | null }[];
  equipment: number | null;
  total: number | null;
  unpriced: string[];
  tariff_from: string;
  saving: Saving | null;
}

const TEMPLATE = 'templates/cold-store.json';

describe('kvar-ledger quote', () => {
  it('prices the template’s banks at the invented demo rates and says they are invented', async () => {
    const text = await cli(TEMPLATE);
    expect(text.code).toBe(0);
    expect(text.out).toMatch(/INVENTED demo rates/);
    expect(text.out).toMatch(/bus LV-REF\n/);
    expect(text.out).toMatch(/Estimate only/);
    const r = await cli(TEMPLATE, '--json');
    const j = JSON.parse(r.out) as Json;
    expect([j.rates_from, j.banks_from]).toEqual(['demo', 'file']);
    let equipment = 0;
    for (const b of j.buses) {
      let sub = 0;
      for (const l of b.items) {
        expect(l.cost).toBeCloseTo((l.quantity as number) * (l.rate as number), 9);
        sub += l.cost as number;
      }
      expect(b.subtotal).toBeCloseTo(sub, 9);
      equipment += sub;
    }
    expect(j.equipment).toBeCloseTo(equipment, 9);
    // Demo surcharges: installation 15 %, engineering 8 %, contingency 10 %.
    expect(j.total).toBeCloseTo(equipment * 1.23 * 1.1, 6);
  });

  it('takes a rates CSV; an item it does not price stays unpriced, and so does the total', async () => {
    const rates = join(dir, 'rates.csv');
    writeFileSync(
      rates,
      'Item,Unit,Rate,Currency,Source and date\nLV capacitor,kvar,10,CHF,offer A 2026-10\nContingency,%,5,,\n',
    );
    const r = await cli(TEMPLATE, '--rates', rates, '--json');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out) as Json;
    expect(j.rates_from).toBe('option');
    const caps = j.buses.flatMap((b) => b.items).filter((l) => l.code === 'LV capacitor');
    for (const l of caps) expect(l.cost).toBeCloseTo((l.quantity as number) * 10, 9);
    expect(j.total).toBeNull();
    expect(j.unpriced).toContainEqual(expect.stringMatching(/bus LV-REF: .*no rate for "LV section"/));
    expect((await cli(TEMPLATE, '--rates', rates)).out).toMatch(/total CHF\s+unpriced/);
  });

  it('refuses a rates CSV with a bad row, naming the file, row and column', async () => {
    const rates = join(dir, 'bad-rates.csv');
    writeFileSync(rates, 'Item,Unit,Rate\nLV section,pc,lots\n');
    const r = await cli(TEMPLATE, '--rates', rates);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/bad-rates\.csv: rates row 2, column Rate: must be a number ≥ 0; got "lots"/);
    expect(r.out).toBe('');
    expect((await cli(TEMPLATE, '--rates', join(dir, 'none.csv'))).err).toMatch(/none\.csv: no such file/);
  });

  it('a saved workbook is priced with its own Rates sheet', async () => {
    const { site } = readSiteFile(readFileSync(TEMPLATE, 'utf8'));
    const doc = buildWorkbook(site, { flavour: 'live' });
    const sheets = doc.sheets.map((s) =>
      s.name === RATES_SHEET
        ? {
            ...s,
            cells: s.cells.map((row) =>
              row[0] === 'LV section' ? ['LV section', 'pc', 4000, 'EUR', 'offer B'] : row,
            ),
          }
        : s,
    );
    const file = join(dir, 'cold.kvar.json');
    writeFileSync(file, JSON.stringify({ ...doc, sheets }));
    const j = JSON.parse((await cli(file, '--json')).out) as Json;
    expect(j.rates_from).toBe('workbook');
    const sections = j.buses.flatMap((b) => b.items).filter((l) => l.code === 'LV section');
    expect(sections.length).toBeGreaterThan(0);
    for (const l of sections) expect(l.cost).toBe((l.quantity as number) * 4000);
  });

  it('a workbook without a Rates sheet is not priced at invented rates: every item is unpriced', async () => {
    const { site } = readSiteFile(readFileSync(TEMPLATE, 'utf8'));
    const doc = buildWorkbook(site, { flavour: 'live' });
    const file = join(dir, 'no-rates.kvar.json');
    writeFileSync(file, JSON.stringify({ ...doc, sheets: doc.sheets.filter((s) => s.name !== RATES_SHEET) }));
    const j = JSON.parse((await cli(file, '--json')).out) as Json;
    expect(j.rates_from).toBe('none');
    expect(j.total).toBeNull();
    expect(j.buses.flatMap((b) => b.items).every((l) => l.cost === null)).toBe(true);
    expect((await cli(file)).out).toMatch(/the workbook has no Rates sheet/);
  });

  it('a saved workbook: the saving from its Tariff sheet, the same as its Quantities and cost sheet', async () => {
    const { site, banks } = readSiteFile(readFileSync(TEMPLATE, 'utf8'));
    const doc = buildWorkbook(site, { flavour: 'live', ...(banks ? { banks } : {}) });
    const sheets = doc.sheets.map((s) =>
      s.name === TARIFF_SHEET
        ? {
            ...s,
            cells: s.cells.map((row) =>
              row[0] === 'Reactive demand penalty'
                ? ['Reactive demand penalty', 4, 'per kvar', 'offer']
                : row,
            ),
          }
        : s,
    );
    const file = join(dir, 'tariff.kvar.json');
    writeFileSync(file, JSON.stringify({ ...doc, sheets }));
    const j = JSON.parse((await cli(file, '--json')).out) as Json;
    expect(j.tariff_from).toBe('workbook');
    const saving = j.saving as Saving;
    expect(saving.charge_before).toBeGreaterThan(0);
    // The page's sheet for the same workbook (one model): the same payback and annual saving.
    const s = WorkbookSession.fromDoc({ ...doc, sheets });
    const n = renderWorkbook({ ...doc, sheets }, { flavour: 'live' }).structure.buses.length;
    const id = s.engine.getSheetId(QUANTITIES_SHEET) as number;
    const at = (line: Parameters<typeof savingRowOf>[2]) =>
      s.engine.getCellValue({ sheet: id, row: savingRowOf(n, saving.cases.length, line), col: QC.cost });
    expect(at('Annual saving') as number).toBeCloseTo(saving.annual_saving, 6);
    expect(at('Simple payback (years)') as number).toBeCloseTo(saving.payback_years as number, 9);
    // payback = total / annual saving, recomputed from the printed figures
    expect(saving.payback_years as number).toBeCloseTo((j.total as number) / saving.annual_saving, 12);
    expect((await cli(file)).out).toMatch(/what it saves per year; tariff from the workbook's Tariff sheet/);
  });

  it('a workbook without a Tariff sheet prints no saving and says why', async () => {
    const { site } = readSiteFile(readFileSync(TEMPLATE, 'utf8'));
    const doc = buildWorkbook(site, { flavour: 'live' });
    const file = join(dir, 'no-tariff.kvar.json');
    writeFileSync(
      file,
      JSON.stringify({ ...doc, sheets: doc.sheets.filter((s) => s.name !== TARIFF_SHEET) }),
    );
    const j = JSON.parse((await cli(file, '--json')).out) as Json;
    expect(j.tariff_from).toBe('none');
    expect(j.saving).toBeNull();
    expect((await cli(file)).out).toMatch(/no saving: the workbook has no Tariff sheet/);
  });

  it('a wrong command line exits 2; help documents --rates', async () => {
    expect((await cli()).code).toBe(2);
    expect((await cli(TEMPLATE, '--rates')).code).toBe(2);
    expect((await cli('--help')).out).toMatch(/--rates FILE/);
  });
});

describe('kvar-ledger quote --compare', () => {
  interface Option {
    id: string;
    name: string;
    same_as: string | null;
    banks: { bus: string; p_pct?: number }[];
    total: number | null;
    annual_saving: number;
    payback_years: number | null;
    meets_every_case: boolean;
    errors: number;
    warnings: number;
  }

  it('lists the design options, the first being the quote itself, in text and JSON', async () => {
    const r = await cli(TEMPLATE, '--compare', '--json');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out) as Json & { options: Option[] };
    expect(j.options.map((o) => o.id)).toEqual(['current', 'proposal', 'plain', 'detuned', 'central']);
    // The banks as given are what the quote above priced, with the same saving.
    const first = j.options[0] as Option;
    expect(first.total).toBeCloseTo(j.total as number, 9);
    expect(first.annual_saving).toBeCloseTo(j.saving?.annual_saving as number, 9);
    expect(j.options[1]?.same_as).toBe('Banks as given');
    expect(j.options.find((o) => o.id === 'plain')?.banks.every((b) => (b.p_pct ?? 0) === 0)).toBe(true);
    const text = await cli(TEMPLATE, '--compare');
    expect(text.out).toMatch(/design options side by side/);
    expect(text.out).toMatch(/^Plain capacitors +\d/m);
    expect(text.out).toMatch(/One bank at the connection: a single bank on MV-11/);
    const plain = await cli(TEMPLATE);
    expect(plain.out).not.toMatch(/design options/);
  });
});

/** The template's workbook, its Design options sheet, and the title and first stepped bank line of option `label`. */
function optionsWorkbook(label: string) {
  const { site, banks } = readSiteFile(readFileSync(TEMPLATE, 'utf8'));
  const doc = buildWorkbook(site, { flavour: 'live', ...(banks ? { banks } : {}) });
  const sheet = doc.sheets.find((s) => s.name === OPTIONS_SHEET)!;
  const cols = planOptionColumns(site.settings.cases);
  const title = sheet.cells.findIndex((line) => line[1] === label);
  const bankLine = sheet.cells.findIndex(
    (line, r) => r > title && typeof line[cols.input.step_kvar] === 'number',
  );
  return { doc, sheet, cols, title, bankLine };
}

describe("kvar-ledger quote --compare on a workbook's own options", () => {
  it('prices the option blocks of its Design options sheet, as the sheet shows them', async () => {
    // The estimator renames option 3 and gives its first bank a 40 kvar reactor.
    const { doc, sheet, cols, title, bankLine } = optionsWorkbook('Option 3');
    (sheet.cells[title] as unknown[])[0] = 'Detuned, with a reactor';
    (sheet.cells[bankLine] as unknown[])[cols.input.reactor_kvar] = 40;
    const file = join(dir, 'own-options.json');
    writeFileSync(file, JSON.stringify(renderWorkbook(doc, { flavour: 'live' }).doc));
    const r = await cli(file, '--compare', '--json');
    expect(r.code, r.err).toBe(0);
    const j = JSON.parse(r.out) as {
      options: Array<{
        id: string;
        name: string;
        reactor_kvar: number;
        total: number | null;
        annual_saving: number;
      }>;
    };
    expect(j.options.map((o) => o.name)).toEqual([
      'Banks as given',
      'Proposed design',
      'Plain capacitors',
      'Detuned, with a reactor',
      'One bank at the connection',
    ]);
    expect(j.options[3]?.reactor_kvar).toBe(40);
    // The same workbook in the page's engine: the sheet's table shows what the command prints.
    const s = WorkbookSession.fromDoc(
      JSON.parse(readFileSync(file, 'utf8')) as Parameters<typeof WorkbookSession.fromDoc>[0],
    );
    const shown = sheetOptions(
      (name, row, col) => s.engine.getCellValue({ sheet: s.engine.getSheetId(name) as number, row, col }),
      [0, 1, 2, 3],
    );
    s.destroy();
    shown.forEach((o, k) => {
      const printed = j.options[k + 1]!;
      expect(o.name).toBe(printed.name);
      if (printed.total === null) expect(o.total).toBeNull();
      else expect(o.total).toBeCloseTo(printed.total, 6);
      expect(o.saving).toBeCloseTo(printed.annual_saving, 6);
    });
  });
});

describe('kvar-ledger quote --compare with an option input that cannot be read', () => {
  it('lists that option with the cell to mend and prices the others', async () => {
    const { doc, sheet, cols, bankLine } = optionsWorkbook('Option 2');
    (sheet.cells[bankLine] as unknown[])[cols.input.step_kvar] = '40 kvar';
    const file = join(dir, 'unread-option.json');
    writeFileSync(file, JSON.stringify(renderWorkbook(doc, { flavour: 'live' }).doc));
    const where = `sheet ${OPTIONS_SHEET}, row ${bankLine + 1}, column "Step (kvar)": must be a number; got "40 kvar"`;

    const j = await cli(file, '--compare', '--json');
    expect(j.code, j.err).toBe(0);
    const options = (
      JSON.parse(j.out) as { options: Array<{ name: string; unread?: string[]; total?: unknown }> }
    ).options;
    expect(options[2]).toMatchObject({ name: 'Plain capacitors', unread: [where] });
    expect(options[2]).not.toHaveProperty('total');
    expect(options.filter((o) => o.unread !== undefined)).toHaveLength(1);

    const text = await cli(file, '--compare');
    expect(text.code, text.err).toBe(0);
    expect(text.out).toContain(`Plain capacitors: not worked out until its inputs are mended: ${where}`);

    // The balance does not depend on it, and still says it, as Checks does.
    let out = '';
    const code = await main(['balance', file], { out: (x) => (out += x), err: (x) => (out += x) });
    expect(code).toBe(0);
    expect(out).toContain(`${where}; the option "Plain capacitors" is not worked out until this is mended`);
  });
});
