// Cross-engine check: LibreOffice Calc, recalculating our exported xlsx on load, must give every
// formula cell the value Kvar Ledger computed, within 1e-9 relative, errors included. The other
// engine is the source of truth here; a planted wrong cached value proves it really recalculated.
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import {
  BOOK_NAMES,
  compareBook,
  PLANTED_VALUE,
  sameValue,
  writeBooks,
  type Book,
  type Planted,
} from './books.ts';
import { convertToCsv, csvFiles, makeRecalcProfile, sheetCsv } from './libreoffice.ts';
import { QC, QUANTITIES_SHEET, busLineRow, slotRow } from '../../src/core/workbook/quantitiesLayout.ts';
import { COVER_SHEET_NAME } from '../../src/io/xlsx/export.ts';
import { OPTIONS_SHEET, OPTION_BLOCKS, TABLE, tableRow } from '../../src/core/workbook/optionsLayout.ts';
import { COMP_HEADERS } from '../../src/core/workbook/compensationColumns.ts';
import * as chargedSolar from '../core/workbook/chargedSolar.ts';
import { EDITED_COVER_BASE, writeEditedCover, type CoverCheck } from './coverBook.ts';

let books: Book[] = [];
let outDir = '';
let planted: Planted | undefined;
let coverChecks: CoverCheck[] = [];

beforeAll(async () => {
  const work = mkdtempSync(join(tmpdir(), 'kvar-crossengine-'));
  const written = await writeBooks(work);
  books = written.books;
  planted = written.planted;
  outDir = join(work, 'csv');
  const cold = books.find((b) => b.base === 'cold-store');
  if (!cold) throw new Error('no cold-store book');
  const cover = await writeEditedCover(work, cold);
  coverChecks = cover.checks;
  convertToCsv(makeRecalcProfile(join(work, 'profile')), [...written.files, cover.file], outDir);
}, 300_000);

describe('LibreOffice Calc recalculating our exports', () => {
  it('exported every template, the invented site and the hand-made workbook', () => {
    expect(books.map((b) => b.base)).toEqual(expect.arrayContaining([...BOOK_NAMES]));
    for (const b of books)
      for (const s of b.doc.sheets) expect(csvFiles(outDir)).toContain(`${b.base}-${s.name}.csv`);
  });

  it('really recalculated: a planted wrong cached value comes back right', () => {
    expect(planted?.cachedInFile).toBe(PLANTED_VALUE);
    const lo = sheetCsv(outDir, 'planted', 'Buses')[planted!.row]?.[planted!.col] ?? '';
    expect(Number(lo)).not.toBe(PLANTED_VALUE);
    expect(sameValue({ ok: true, value: planted!.app }, lo, 'LibreOffice')).toEqual({
      ok: true,
      why: expect.any(String),
    });
  });

  it.each([...BOOK_NAMES])('%s: every formula cell equals the app’s value', (base) => {
    const book = books.find((b) => b.base === base);
    expect(book, `no workbook ${base}`).toBeDefined();
    const { mismatches, compared, errors } = compareBook(
      book!,
      (sheet) => sheetCsv(outDir, base, sheet),
      'LibreOffice',
    );
    expect(mismatches.slice(0, 20)).toEqual([]);
    expect(compared).toBeGreaterThan(base === 'hand-made' ? 15 : 100);
    if (base === 'invented-quarry-fault' || base === 'hand-made') expect(errors).toBeGreaterThan(0);
  });

  it('refers the solar site’s limits to its rated power: no inductive need at night in LibreOffice', () => {
    // Every formula cell was compared above; this says the two books really differ where the
    // rated power enters (hand figure: 0.3287 × 42,000 kW allows 13,805 kvar leading at night).
    const need = (base: string) => {
      const rows = sheetCsv(outDir, base, 'Compensation');
      const col = (rows[0] ?? []).indexOf('Inductive need night (kvar)');
      expect(col, `${base}: no night inductive need column`).toBeGreaterThan(0);
      return Number(rows[1]?.[col]);
    };
    expect(need('solar-collector')).toBeGreaterThan(1000);
    expect(need('solar-collector-rated')).toBe(0);
  });

  it('counts the zone’s cable and line charging in resonance and voltage rise (hand formulas, IEEE Std 1036)', () => {
    // Every formula cell was compared above; this says LibreOffice's own figures are the hand's:
    // h = √(Ssc/(Q + charging)), rise 100·(Q + charging)/Ssc, charging 2πf·C·len·U² at night.
    const [head, ...rows] = sheetCsv(outDir, 'solar-collector-charged', 'Compensation');
    const row = rows.find((r) => r[0] === chargedSolar.bank.bus) ?? [];
    const at = (h: string) => Number(row[head?.indexOf(h) ?? -1]);
    expect(at(COMP_HEADERS.zoneCharging)).toBeCloseTo(chargedSolar.nightCharging, 6);
    expect(at(COMP_HEADERS.orderStep)).toBeCloseTo(chargedSolar.order(300 + chargedSolar.nightCharging), 9);
    expect(at(COMP_HEADERS.orderTotal)).toBeCloseTo(chargedSolar.order(1200 + chargedSolar.nightCharging), 9);
    expect(at(COMP_HEADERS.vriseTotal)).toBeCloseTo(
      (100 * (1200 + chargedSolar.nightCharging)) / (chargedSolar.sscA * 1000),
      9,
    );
  });

  it('prices the demo on the Quantities and cost sheet: total, saving and payback are numbers there', () => {
    // Every formula cell was compared above; this says the comparison covered a priced schedule.
    const rows = sheetCsv(outDir, 'cold-store', QUANTITIES_SHEET);
    const at = (label: string) => Number(rows.find((r) => r[0] === label)?.[QC.cost]);
    expect(at('Equipment')).toBeGreaterThan(0);
    expect(at('Total')).toBeGreaterThan(at('Equipment'));
    // and what it saves with the demo tariff, and the payback of that total
    expect(at('Annual saving')).toBeGreaterThan(0);
    expect(at('Simple payback (years)')).toBeCloseTo(at('Total') / at('Annual saving'), 6);
  });

  it("prices the demo's design options on the Design options sheet: every option a number, payback = total / saving", () => {
    // Every formula cell was compared above; this says the comparison covered live option blocks.
    const rows = sheetCsv(outDir, 'cold-store', OPTIONS_SHEET);
    for (let j = 0; j < OPTION_BLOCKS; j++) {
      const line = rows[tableRow(j)] ?? [];
      const at = (c: { col: number }) => Number(line[c.col]);
      expect(at(TABLE.total), line.join('|')).toBeGreaterThan(0);
      expect(at(TABLE.saving), line.join('|')).toBeGreaterThan(0);
      expect(at(TABLE.payback)).toBeCloseTo(at(TABLE.total) / at(TABLE.saving), 6);
    }
  });

  it('covers a lagging-only requirement: the Site sheet says so and the within-requirement cells agree', () => {
    // Every formula cell was compared above; this says one book ran the lagging-only branch.
    const site = sheetCsv(outDir, 'invented-quarry-lagging', 'Site');
    expect(site.some((r) => r.includes('cos φ lagging only'))).toBe(true);
    const comp = sheetCsv(outDir, 'invented-quarry-lagging', 'Compensation');
    const header = comp[0] ?? [];
    const within = header.flatMap((h, c) => (h.startsWith('Within requirement') ? [c] : []));
    expect(within.length).toBeGreaterThan(0);
    expect(comp.slice(1).some((r) => within.some((c) => r[c] === 'yes' || r[c] === 'no'))).toBe(true);
  });

  it("counts a line's I²R loss: LibreOffice's P loss is 3·I²·R·len at its own S carried (hand formula, I = S/(√3·U))", () => {
    let lines = 0;
    for (const [base, kase] of [
      ['invented-quarry', 'crushing'],
      ['solar-collector', 'noon'],
    ] as const) {
      const [head, ...rows] = sheetCsv(outDir, base, 'Lines');
      const col = (h: string) => head?.indexOf(h) ?? -1;
      for (const r of rows.filter((x) => x[col('Tag')])) {
        const v = (h: string) => Number(r[col(h)]);
        const [u, rKm, len] = [v('U (kV)'), v('R (Ω/km)'), v('Length (km)')];
        const [s, after] = [v(`S carried ${kase} (kVA)`), v(`S carried after ${kase} (kVA)`)];
        const amps = (x: number) => x / (Math.sqrt(3) * u);
        const hand = (x: number) => (3 * amps(x) ** 2 * rKm * len) / 1000;
        expect(hand(s)).toBeGreaterThan(0);
        expect(v(`P loss ${kase} (kW)`)).toBeCloseTo(hand(s), 6);
        expect(v(`P loss after ${kase} (kW)`)).toBeCloseTo(hand(after), 6);
        lines += 1;
      }
    }
    expect(lines).toBe(5);
  });

  it("counts a feeder cable's I²R and I²X and its loading: LibreOffice's losses are 3·I²·R·len and 3·I²·X·len at its own S carried (hand formula, I = S/(√3·U))", () => {
    const [head, ...rows] = sheetCsv(outDir, 'invented-quarry', 'Feeders');
    const col = (h: string) => head?.indexOf(h) ?? -1;
    const feeders = rows.filter((x) => x[col('Tag')]);
    expect(feeders.length).toBe(1);
    for (const r of feeders)
      for (const kase of ['crushing', 'maintenance']) {
        const v = (h: string) => Number(r[col(h)]);
        // R from the section: 185 mm² copper 0.0991 Ω/km at 20 °C (IEC 60228 Table 2, from memory)
        // at 90 °C by 1 + 3.93e-3·70 (IEC 60287-1-1, from memory).
        expect([v('Cu (mm²)'), v('θ conductor (°C)')]).toEqual([185, 90]);
        const rKm = 0.0991 * (1 + 3.93e-3 * 70);
        const [u, xKm, len] = [v('U (kV)'), v('X (Ω/km)'), v('Length (km)')];
        const [s, after] = [v(`S carried ${kase} (kVA)`), v(`S carried after ${kase} (kVA)`)];
        const amps = (x: number) => x / (Math.sqrt(3) * u);
        const hand = (x: number, ohmKm: number) => (3 * amps(x) ** 2 * ohmKm * len) / 1000;
        expect(hand(s, rKm)).toBeGreaterThan(0);
        expect(v(`P loss ${kase} (kW)`)).toBeCloseTo(hand(s, rKm), 6);
        expect(v(`P loss after ${kase} (kW)`)).toBeCloseTo(hand(after, rKm), 6);
        expect(v(`Q absorbed ${kase} (kvar)`)).toBeCloseTo(hand(s, xKm), 6);
        expect(v(`Q absorbed after ${kase} (kvar)`)).toBeCloseTo(hand(after, xKm), 6);
        // and its loading against the rated current, S/(√3·U·I_rated)
        expect(v(`Loading after ${kase} (%)`)).toBeCloseTo((100 * amps(after)) / v('Rated current (A)'), 6);
      }
  });

  it('recalculates banks of the 1:2:2 and 1:2:4 series: controller steps and totals by hand', () => {
    // Every formula cell was compared above; this says the books hold both series (the
    // templates' proposals) and LibreOffice's counts follow the ratio notation: 1:2:2 in n
    // stages is 1 + 2(n − 1) smallest steps, 1:2:4 is 1 + 2 + … + 2^(n − 1) = 2^n − 1.
    const seen = new Set<string>();
    for (const base of ['pumping-station', 'cold-store']) {
      const [head, ...rows] = sheetCsv(outDir, base, 'Compensation');
      const col = (h: string) => head?.indexOf(h) ?? -1;
      for (const r of rows.filter(
        (x) => x[col('Step series')] === '1:2:2' || x[col('Step series')] === '1:2:4',
      )) {
        const series = r[col('Step series')] as string;
        const [n, step, fixed] = [
          Number(r[col('Steps')]),
          Number(r[col('Step (kvar)')]),
          Number(r[col('Fixed (kvar)')] || 0),
        ];
        let positions = 0;
        for (let i = 0; i < n; i++) positions += series === '1:2:2' ? (i === 0 ? 1 : 2) : 2 ** i;
        expect(Number(r[col('Controller steps')])).toBe(positions);
        expect(Number(r[col('Bank total (kvar)')])).toBeCloseTo(fixed + step * positions, 9);
        seen.add(series);
      }
    }
    expect([...seen].sort()).toEqual(['1:2:2', '1:2:4']);
  });

  it('counts the switching devices and capacitor lines of those banks per stage size (hand figures)', () => {
    // Every formula cell was compared above; this says LibreOffice's Quantities sheet has a line
    // per stage size: 1:2:2 in n stages has one stage of 1 smallest step and n − 1 of 2, 1:2:4 one
    // of each 2^g below 2^n; each device is sized by its own stage, I = Q/(√3·U) × 1.43 (the
    // capacitor margin of IEC 60831-1 and IEC 61921), in a class at or above that current.
    const sizes = ['stageSwitching0', 'stageSwitching1', 'stageSwitching2', 'stageSwitching3'] as const;
    let banks = 0;
    for (const base of ['pumping-station', 'cold-store']) {
      const [head, ...rows] = sheetCsv(outDir, base, 'Compensation');
      const col = (h: string) => head?.indexOf(h) ?? -1;
      const quant = sheetCsv(outDir, base, QUANTITIES_SHEET);
      rows.forEach((r, i) => {
        const series = r[col('Step series')];
        if (series !== '1:2:2' && series !== '1:2:4') return;
        const [n, step, u] = [
          Number(r[col('Steps')]),
          Number(r[col('Step (kvar)')]),
          Number(r[col('U (kV)')]),
        ];
        expect(quant[busLineRow(i)]?.[QC.bus]).toBe(r[0]);
        sizes.forEach((slot, g) => {
          const line = quant[slotRow(i, slot)] ?? [];
          const stages = series === '1:2:2' ? (g === 0 ? 1 : g === 1 ? n - 1 : 0) : g < n ? 1 : 0;
          if (stages === 0) return expect(line[QC.item] ?? '').toBe('');
          const amps = ((step * 2 ** g) / (Math.sqrt(3) * u)) * 1.43;
          expect(Number(line[QC.count])).toBe(stages);
          expect(Number(line[QC.amps])).toBeCloseTo(amps, 6);
          const rating = Number(/(\d+(?:\.\d+)?) A$/.exec(line[QC.item] ?? '')?.[1]);
          expect(rating).toBeGreaterThanOrEqual(amps);
        });
        banks += 1;
      });
    }
    expect(banks).toBeGreaterThan(1);
  });

  it('shows no unknown-name error anywhere', () => {
    for (const f of csvFiles(outDir)) {
      if (f.includes('_kvar_ledger') || f.includes('Functions used')) continue;
      const text = readFileSync(join(outDir, f), 'utf8');
      expect({ f, name: text.includes('#NAME?') }).toEqual({ f, name: false });
    }
  });

  it('gives the cover’s figures the values of the sheets they refer to, and follows an edit', () => {
    expect(coverChecks.map((c) => c.figure.label)).toEqual(
      expect.arrayContaining([
        'cos φ before at MV-11, summer-day',
        'cos φ after at MV-11, winter-night',
        'Equipment cost total with surcharges',
        'Annual saving',
        'Simple payback (years)',
      ]),
    );
    const coverValue = (base: string, label: string) =>
      sheetCsv(outDir, base, COVER_SHEET_NAME).find((r) => r[0] === label)?.[1] ?? '(no such row)';
    const sheetValue = (base: string, c: CoverCheck) =>
      sheetCsv(outDir, base, c.figure.sheet)[c.figure.row]?.[c.figure.col] ?? '';
    for (const c of coverChecks) {
      // As exported: the cover equals the app's value and LibreOffice's own sheet cell.
      expect(
        sameValue(c.before, coverValue('cold-store', c.figure.label), 'LibreOffice').ok,
        c.figure.label,
      ).toBe(true);
      expect(coverValue('cold-store', c.figure.label)).toBe(sheetValue('cold-store', c));
      // After 6 → 3 steps typed in the file: the cover equals the app's value for the edited workbook.
      const lo = coverValue(EDITED_COVER_BASE, c.figure.label);
      expect(sameValue(c.after, lo, 'LibreOffice'), c.figure.label).toEqual({
        ok: true,
        why: expect.any(String),
      });
      expect(lo).toBe(sheetValue(EDITED_COVER_BASE, c));
    }
    // The edit moved what it should: less kvar installed gives a smaller total and a lower cos φ after.
    const moved = coverChecks.filter((c) => c.before.ok && c.after.ok && c.before.value !== c.after.value);
    expect(moved.map((c) => c.figure.label)).toEqual(
      expect.arrayContaining(['Equipment cost total with surcharges', 'cos φ after at MV-11, summer-day']),
    );
  });
});
