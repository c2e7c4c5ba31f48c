// The rates live in the workbook as a sheet of the user's: a new site workbook starts with the
// invented demo rates, which read back as the same table, and what the user types there is kept.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  DEMO_SOURCE,
  RATES_SHEET,
  demoRateTable,
  rateRowsOf,
  readRateTable,
} from '../../../src/core/quote/index.ts';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { renderWorkbook } from '../../../src/core/workbook/render.ts';

const { site } = readSiteFile(readFileSync('templates/cold-store.json', 'utf8'));

describe('the Rates sheet', () => {
  it('a built workbook holds the demo rates, marked invented on every row, and they read back', () => {
    const doc = buildWorkbook(site, { flavour: 'live' });
    const sheet = doc.sheets.find((s) => s.name === RATES_SHEET);
    expect(sheet?.purpose).toMatch(/INVENTED demo rates/);
    const { table, problems } = readRateTable(rateRowsOf(doc) ?? []);
    expect(problems).toEqual([]);
    expect(table).toEqual(demoRateTable());
    for (const row of (sheet?.cells ?? []).slice(1)) expect(row[4]).toBe(DEMO_SOURCE);
  });
  it('is the user’s: a rate typed there survives opening the workbook again', () => {
    const doc = buildWorkbook(site, { flavour: 'live' });
    const edited = {
      ...doc,
      sheets: doc.sheets.map((s) =>
        s.name === RATES_SHEET
          ? { ...s, cells: [...s.cells, ['MV frame 2', 'pc', 123, 'EUR', 'offer 42, 2026-11']] }
          : s,
      ),
    };
    const again = renderWorkbook(edited, { flavour: 'live' }).doc;
    const { table } = readRateTable(rateRowsOf(again) ?? []);
    expect(table.rates.at(-1)).toEqual({
      item: 'MV frame 2',
      unit: 'pc',
      rate: 123,
      currency: 'EUR',
      source: 'offer 42, 2026-11',
    });
  });
});
