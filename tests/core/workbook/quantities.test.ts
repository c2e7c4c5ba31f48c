// The "Quantities and cost" sheet: live formulas over the Compensation and Rates sheets that count
// and price the items of each bus's bank. Expected figures are worked by hand here (circuit theory
// for the nameplate: a detuned step's nameplate for an output Q is Q·(1 − p)·(Ur/U)²; line current
// I = Q/(√3·U); 1.43 × for switching devices, IEC 60831-1's 1.3 In times the 1.1 capacitance
// tolerance as IEC 61921 states; current classes from the R10 series of IEC 60059; unit, section
// and controller sizes are common practice, from memory, as itemRules.ts says). The rates are
// invented for the test; each cost is recomputed here as quantity × rate.
import { describe, expect, it } from 'vitest';
import { ratesSheetDoc, readRateTable, RATES_SHEET, type Rate } from '../../../src/core/quote/index.ts';
import type { BankChoice } from '../../../src/core/site/bankChoice.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import type { WorkbookDoc } from '../../../src/core/workbook/document.ts';
import {
  QC,
  QUANTITIES_SHEET,
  SLOTS,
  busLineRow,
  slotRow,
  summaryRowOf,
} from '../../../src/core/workbook/quantitiesLayout.ts';
import { WorkbookSession } from '../../../src/ui/model/session.ts';
import { collectChecks } from '../../../src/ui/panels/checksModel.ts';
import { siteFromCsv } from '../site/fixtures.ts';
import { coreQuote, pageQuote } from '../../ui/living/quoteFaces.ts';
import { planCompensationColumns } from '../../../src/core/workbook/compensationColumns.ts';

const { site } = siteFromCsv(
  [
    'tag,bus,kind,qty,p_kw,cos_phi,u_kv,load',
    'L1,LV1,load,1,400,0.8,0.4,1',
    'L2,MV,load,1,2000,0.85,11,1',
    'L3,MV2,load,1,1500,0.85,6.6,1',
  ].join('\n'),
);

const rate = (item: string, unit: Rate['unit'], value: number): Rate => ({
  item,
  unit,
  rate: value,
  currency: 'EUR',
  source: 'invented for this test',
});
const RATES: Rate[] = [
  rate('LV capacitor', 'kvar', 10),
  rate('LV detuning reactor 7 %', 'kvar', 12),
  rate('LV contactor 125 A', 'pc', 250),
  rate('Step controller 6 outputs', 'pc', 800),
  rate('LV section', 'pc', 3000),
  rate('LV fuse-switch 630 A', 'pc', 1000),
];
const SURCHARGES = { Installation: 10, Engineering: 5, Contingency: 10 };

function open(banks: BankChoice[], rates = RATES): WorkbookSession {
  const doc = buildWorkbook(site, { flavour: 'live', banks });
  const withRates: WorkbookDoc = {
    ...doc,
    sheets: doc.sheets.map((s) =>
      s.name === RATES_SHEET ? ratesSheetDoc({ rates, surcharges: SURCHARGES }) : s,
    ),
  };
  return WorkbookSession.fromDoc(withRates);
}

function reader(s: WorkbookSession) {
  const id = s.engine.getSheetId(QUANTITIES_SHEET) as number;
  const v = (row: number, col: number) => s.engine.getCellValue({ sheet: id, row, col });
  const buses = ['LV1', 'MV', 'MV2'];
  const bus = (name: string) => {
    const i = buses.indexOf(name);
    expect(v(busLineRow(i), QC.bus)).toBe(name);
    return i;
  };
  /** The item lines of a bus that hold an item: [item, count, quantity, cost]. */
  const lines = (name: string) => {
    const i = bus(name);
    return SLOTS.map((slot) => slotRow(i, slot))
      .filter((r) => v(r, QC.item) !== '')
      .map((r) => [v(r, QC.item), v(r, QC.count), v(r, QC.quantity), v(r, QC.cost)]);
  };
  const total = (line: Parameters<typeof summaryRowOf>[1]) => v(summaryRowOf(3, line), QC.cost);
  return { v, bus, lines, total, id };
}

const LV_BANK: BankChoice = { bus: 'LV1', step_kvar: 50, steps: 6, p_pct: 7, u_rated_kv: 0.48 };

describe('a 6-step 300 kvar bank, 7 % detuned, at 400 V with 480 V capacitors', () => {
  const s = open([LV_BANK]);
  const q = reader(s);
  const nameplate = 6 * 50 * (1 - 0.07) * (0.48 / 0.4) ** 2; // 401.76 kvar

  it('counts each item as worked by hand', () => {
    const got = q.lines('LV1');
    expect(got.map((l) => l[0])).toEqual([
      'LV capacitor',
      'LV detuning reactor 7 %',
      'LV contactor 125 A', // 50 kvar: 72.2 A × 1.43 = 103.2 A → 125 A class
      'Step controller 6 outputs',
      'LV section', // 300 kvar detuned, up to 250 kvar a section → 2
      'LV fuse-switch 630 A', // 300 kvar: 433 A × 1.43 = 619 A → 630 A class
    ]);
    expect(got[0]?.[1]).toBe(12); // 66.96 kvar per step: two units of 33.48 kvar (LV units up to 50)
    expect(got[0]?.[2] as number).toBeCloseTo(nameplate, 9);
    expect(got.slice(1).map((l) => [l[1], l[2]])).toEqual([
      [6, 300],
      [6, 6],
      [1, 1],
      [2, 2],
      [1, 1],
    ]);
  });

  it('prices each line at its rate; equipment, surcharges and total as an estimator adds them', () => {
    const costs = q.lines('LV1').map((l) => l[3] as number);
    const byHand = [nameplate * 10, 300 * 12, 6 * 250, 800, 2 * 3000, 1000];
    costs.forEach((c, i) => expect(c).toBeCloseTo(byHand[i] as number, 9));
    const equipment = byHand.reduce((a, b) => a + b, 0); // 16 917.60
    expect(q.total('Equipment') as number).toBeCloseTo(equipment, 9);
    const installation = equipment * 0.1;
    const engineering = equipment * 0.05;
    const contingency = (equipment + installation + engineering) * 0.1;
    expect(q.total('Installation') as number).toBeCloseTo(installation, 9);
    expect(q.total('Contingency') as number).toBeCloseTo(contingency, 9);
    expect(q.total('Total') as number).toBeCloseTo(21400.764, 6);
    expect(q.total('Currency')).toBe('EUR');
  });

  it('buses without a bank have a block with no items', () => {
    expect(q.lines('MV')).toEqual([]);
    expect(q.v(busLineRow(1), QC.what)).toBe('no bank or reactor chosen');
  });
});

describe('a missing rate is shown, not zero', () => {
  it('an item without a rate says "no rate" and the subtotal and total say "unpriced"', () => {
    const s = open(
      [LV_BANK],
      RATES.filter((r) => r.item !== 'LV section'),
    );
    const q = reader(s);
    const section = slotRow(0, 'enclosure');
    expect(q.v(section, QC.rate)).toBe('no rate');
    expect(q.v(section, QC.cost)).toBe('no rate');
    expect(q.v(busLineRow(0), QC.subtotal)).toBe('unpriced');
    expect(q.total('Equipment')).toBe('unpriced');
    expect(q.total('Total')).toBe('unpriced');
  });
  it("a blank capacitor rated voltage takes the design's: 7 % at 400 V gives 480 V units, as if typed", () => {
    // 400/(1 − 0.07) = 430 V across the capacitors, × 1.1 = 473 V → 480 V (makers' IEC ranges, from memory).
    const blank = reader(open([{ ...LV_BANK, u_rated_kv: undefined }]));
    expect(blank.v(busLineRow(0), QC.uRated)).toBe(0.48);
    expect(blank.lines('LV1')).toEqual(reader(open([LV_BANK])).lines('LV1'));
  });
  it('a detuning the catalogue refuses leaves the capacitors without a quantity, and unpriced', () => {
    const s = open([{ ...LV_BANK, u_rated_kv: undefined, p_pct: 100 }]);
    const q = reader(s);
    const caps = slotRow(0, 'stageCapacitors0');
    expect(q.v(caps, QC.quantity)).toBe('');
    expect(q.v(caps, QC.cost)).toBe('quantity unknown');
    expect(String(q.v(caps, QC.what))).toMatch(/rated voltage is unknown/);
    expect(q.total('Total')).toBe('unpriced');
  });
  it('a rate cleared on the Rates sheet says "no rate", not a cost of 0, and the row it came from', () => {
    const s = open([LV_BANK]);
    const q = reader(s);
    const caps = slotRow(0, 'stageCapacitors0');
    // Row 2 of the Rates sheet (index 1) is "LV capacitor": the line names that row.
    expect(q.v(caps, QC.rateRow)).toBe(2);
    s.setCells(s.engine.getSheetId(RATES_SHEET) as number, [{ row: 1, col: 2, content: null }]);
    expect(q.v(caps, QC.rate)).toBe('no rate');
    expect(q.v(caps, QC.cost)).toBe('no rate');
    expect(q.total('Total')).toBe('unpriced');
  });
  it('a rate named with extra spaces prices nothing in the sheet, as the core reads it, and says so', () => {
    const s = open([LV_BANK]);
    const q = reader(s);
    const section = slotRow(0, 'enclosure');
    expect(typeof q.v(section, QC.cost)).toBe('number');
    const rates = s.engine.getSheetId(RATES_SHEET) as number;
    const row = RATES.findIndex((r) => r.item === 'LV section') + 1;
    s.setCells(rates, [{ row, col: 0, content: 'LV section ' }]);
    expect(q.v(section, QC.cost)).toBe('no rate');
    expect(q.total('Total')).toBe('unpriced');
    const { table, problems } = readRateTable(s.sheetContents(rates));
    expect(table.rates.map((r) => r.item)).not.toContain('LV section ');
    expect(problems).toEqual([expect.objectContaining({ row: row + 1, column: 'Item' })]);
    expect(collectChecks(s.toDoc()).items.filter((i) => i.code === 'rates')).toEqual([
      expect.objectContaining({
        where: `Rates row ${row + 1}, column Item`,
        text: expect.stringMatching(/^"LV section " has spaces .* write it as "LV section"$/),
        target: { sheet: 'Rates', row: row + 1, col: 0 },
      }),
    ]);
  });
  it("the quote's currency is the first Rates row's, in the sheet and in the core alike", () => {
    const s = open([LV_BANK]);
    const q = reader(s);
    const rates = s.engine.getSheetId(RATES_SHEET) as number;
    const CURRENCY = 3;
    const coreTotal = () => coreQuote(s).quote.total;
    expect(q.total('Total')).toBeCloseTo(coreTotal() as number, 9);
    // A spreadsheet's <> compares text without regard to case: "eur" is the same currency.
    s.setCells(rates, [{ row: 1, col: CURRENCY, content: 'eur' }]);
    expect(typeof q.total('Total')).toBe('number');
    expect(q.total('Total')).toBeCloseTo(coreTotal() as number, 9);
    expect(collectChecks(s.toDoc()).items.filter((i) => i.code === 'rates')).toEqual([]);
    // The first row's currency left blank: every other rate is in another currency, in both.
    s.setCells(rates, [{ row: 1, col: CURRENCY, content: null }]);
    expect(q.v(slotRow(0, 'stageCapacitors0'), QC.rate)).toBe(10);
    expect(q.v(slotRow(0, 'enclosure'), QC.rate)).toBe('rate in another currency');
    expect(q.total('Total')).toBe('unpriced');
    expect(coreTotal()).toBeNull();
    expect(collectChecks(s.toDoc()).items.filter((i) => i.code === 'rates')).toEqual([
      expect.objectContaining({
        where: 'Rates row 2, column Currency',
        text: expect.stringMatching(
          /^the quote is in the currency of the first row, which is blank, so "LV detuning reactor 7 %" \(in "EUR"\)/,
        ),
      }),
    ]);
  });
  it('without a Rates sheet every item shows "no rate"', () => {
    const doc = buildWorkbook(site, { flavour: 'live', banks: [LV_BANK] });
    const s = WorkbookSession.fromDoc({ ...doc, sheets: doc.sheets.filter((x) => x.name !== RATES_SHEET) });
    expect(reader(s).v(slotRow(0, 'stageCapacitors0'), QC.rate)).toBe('no rate');
  });
});

describe('MV banks and a shunt reactor', () => {
  const s = open([
    { bus: 'MV', fixed_kvar: 1200, u_rated_kv: 12.1, reactor_kvar: 250 },
    { bus: 'MV2', step_kvar: 400, steps: 3, p_pct: 7, u_rated_kv: 7.8 },
  ]);
  const q = reader(s);
  it('1200 kvar fixed at 11 kV: 1452 kvar nameplate in 3 single-phase units, a frame, a 630 A breaker', () => {
    const got = q.lines('MV');
    // 1200 × (12.1/11)² = 1452 kvar; 63 A × 1.43 = 90 A, and MV breakers start at 630 A.
    expect(got.map((l) => [l[0], l[1]])).toEqual([
      ['MV capacitor', 3],
      ['MV frame', 1],
      ['MV breaker 630 A', 1],
      ['MV shunt reactor', 1],
      ['MV contactor 200 A', 1], // 250 kvar at 11 kV: 13.1 A
    ]);
    expect(got[0]?.[2] as number).toBeCloseTo(1200 * (12.1 / 11) ** 2, 9);
  });
  it('3 × 400 kvar at 6.6 kV, 7 %: 200 A contactors (35 A × 1.43 = 50 A), two discharge VTs a step', () => {
    const got = new Map(q.lines('MV2').map((l) => [l[0], l]));
    expect(got.get('MV capacitor')?.[1]).toBe(9);
    expect(got.get('MV capacitor')?.[2] as number).toBeCloseTo(3 * 400 * 0.93 * (7.8 / 6.6) ** 2, 9);
    expect(got.get('MV contactor 200 A')?.[1]).toBe(3);
    expect(got.get('MV discharge VT')?.[1]).toBe(6);
    expect(got.get('MV frame')?.[1]).toBe(3);
  });
});

describe('a 1:2:2 series of 25/50/50 kvar at 400 V, 440 V capacitors: items per stage size', () => {
  // Each stage is its own circuit, sized by its own current I = Q/(√3·U) × 1.43: 25 kvar 51.6 A →
  // 63 A, 50 kvar 103.2 A → 125 A, 100 kvar 206.4 A → 250 A (IEC 60059 R10 classes). Nameplate
  // Q·(Ur/U)² = 30.25 kvar per 25 kvar of output (plain), so one unit for 25 kvar and two for 50.
  const bank: BankChoice = { bus: 'LV1', step_kvar: 25, steps: 3, series: '1:2:2', u_rated_kv: 0.44 };
  const comp = planCompensationColumns(site.settings.cases);
  const lv1Row = 1; // LV1 is the first bus of the Compensation sheet
  const codesCounts = (q: ReturnType<typeof reader>) => q.lines('LV1').map((l) => [l[0], l[1]]);

  it('counts units, contactors and the incomer per stage size, as worked by hand', () => {
    const q = reader(open([bank]));
    expect(codesCounts(q)).toEqual([
      ['LV capacitor', 1], // the 25 kvar stage: 30.25 kvar, one unit
      ['LV capacitor', 4], // two 50 kvar stages of 60.5 kvar: two units each
      ['LV contactor 63 A', 1],
      ['LV contactor 125 A', 2],
      ['Step controller 6 outputs', 1],
      ['LV section', 1], // 125 kvar plain, up to 400 kvar a section
      ['LV fuse-switch 315 A', 1], // 125 kvar: 180.4 A × 1.43 = 258 A
    ]);
    const quantities = q.lines('LV1').map((l) => l[2] as number);
    expect(quantities[0]).toBeCloseTo(30.25, 9);
    expect(quantities[1]).toBeCloseTo(2 * 60.5, 9);
  });

  it('an edit of the steps or the series changes the lines at once, and the core counts the same', () => {
    const s = open([bank]);
    const q = reader(s);
    const compSheet = s.engine.getSheetId('Compensation') as number;
    s.setCells(compSheet, [{ row: lv1Row, col: comp.input.steps, content: 4 }]);
    expect(codesCounts(q)).toEqual([
      ['LV capacitor', 1],
      ['LV capacitor', 6],
      ['LV contactor 63 A', 1],
      ['LV contactor 125 A', 3],
      ['Step controller 6 outputs', 1],
      ['LV section', 1],
      ['LV fuse-switch 400 A', 1], // 175 kvar: 252.6 A × 1.43 = 361.2 A
    ]);
    expect(pageQuote(s, 3)).toEqual(coreQuote(s).face);
    // 1:2:4 with 3 stages: 25/50/100 kvar, three contactor classes.
    s.setCells(compSheet, [
      { row: lv1Row, col: comp.input.steps, content: 3 },
      { row: lv1Row, col: comp.input.series, content: '1:2:4' },
    ]);
    expect(codesCounts(q).filter(([c]) => String(c).startsWith('LV contactor'))).toEqual([
      ['LV contactor 63 A', 1],
      ['LV contactor 125 A', 1],
      ['LV contactor 250 A', 1],
    ]);
    expect(pageQuote(s, 3)).toEqual(coreQuote(s).face);
  });

  it('7 % detuned: a detuning reactor line per stage size, 25 + 2 × 50 kvar carried', () => {
    const q = reader(open([{ ...bank, p_pct: 7, u_rated_kv: 0.48 }]));
    const reactors = q.lines('LV1').filter((l) => l[0] === 'LV detuning reactor 7 %');
    expect(reactors.map((l) => [l[1], l[2]])).toEqual([
      [1, 25],
      [2, 100],
    ]);
  });
});

describe('a 60 Hz MV bank with the rating blank: IEEE 18 units in series, in the sheet as in the core', () => {
  it('two 7.96 kV units a phase at 24.9 kV (schedule.test.ts works it by hand): 6 units for 1200 kvar', () => {
    const { site: site60 } = siteFromCsv(
      ['tag,bus,kind,qty,p_kw,cos_phi,u_kv,load', 'L1,MV,load,1,3000,0.8,24.9,1'].join('\n'),
      { hz: 60 },
    );
    const s = WorkbookSession.fromDoc(
      buildWorkbook(site60, { flavour: 'live', banks: [{ bus: 'MV', fixed_kvar: 1200 }] }),
    );
    const id = s.engine.getSheetId(QUANTITIES_SHEET) as number;
    const v = (row: number, col: number) => s.engine.getCellValue({ sheet: id, row, col });
    expect(v(busLineRow(0), QC.uRated) as number).toBeCloseTo(Math.sqrt(3) * 2 * 7.96, 9);
    expect(v(busLineRow(0), QC.inSeries)).toBe(2);
    expect(v(slotRow(0, 'fixedCapacitors'), QC.count)).toBe(6);
    expect(pageQuote(s, 1)).toEqual(coreQuote(s).face);
  });
});

describe('the sheet is generated', () => {
  it('refuses rows inserted or removed, deletion and renaming, saying why', () => {
    const s = open([LV_BANK]);
    const { id } = reader(s);
    expect(() => s.insertRows(id, 3, 1)).toThrow(/follow the buses/);
    expect(() => s.removeRows(id, 3, 1)).toThrow(/follow the buses/);
    expect(() => s.removeSheet(id)).toThrow(/can be emptied but not deleted/);
    expect(() => s.renameSheet(id, 'Prices')).toThrow(/site's own sheets/);
  });
  it('the Rates sheet deleted or renamed: every line says "no rate" (not #REF!), as the CLI reads it', () => {
    const s = open([LV_BANK]);
    const q = reader(s);
    const priced = q.total('Total');
    expect(typeof priced).toBe('number');
    const rates = s.engine.getSheetId(RATES_SHEET) as number;
    s.removeSheet(rates);
    expect(q.v(slotRow(0, 'stageCapacitors0'), QC.rate)).toBe('no rate');
    expect(q.total('Total')).toBe('unpriced');
    s.undo();
    expect(q.total('Total')).toBe(priced);
    s.renameSheet(s.engine.getSheetId(RATES_SHEET) as number, 'Old rates');
    expect(q.total('Total')).toBe('unpriced');
    s.renameSheet(s.engine.getSheetId('Old rates') as number, RATES_SHEET);
    expect(q.total('Total')).toBe(priced);
  });
  it('a rate typed on the Rates sheet reaches the cost and the total in the same step, and undoes', () => {
    const s = open([LV_BANK]);
    const q = reader(s);
    const before = q.total('Total') as number;
    const rates = s.engine.getSheetId(RATES_SHEET) as number;
    // Row 2 of the Rates sheet (index 1) is "LV capacitor"; its rate in column C (index 2).
    s.setCells(rates, [{ row: 1, col: 2, content: 11 }]);
    // +1 per kvar of 401.76 kvar, with installation and engineering (+15 %), then contingency (+10 %).
    const extra = 401.76 * 1 * (1 + 0.1 + 0.05) * 1.1;
    expect(q.total('Total') as number).toBeCloseTo(before + extra, 6);
    s.undo();
    expect(q.total('Total') as number).toBeCloseTo(before, 9);
  });
});
