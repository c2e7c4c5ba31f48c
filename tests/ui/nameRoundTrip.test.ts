// Arbitrary unicode names (sheets, cases, buses, tags, the site name, any text in a cell) survive
// every way a workbook travels: the native file, the browser store, a reload into the engine,
// the xlsx hand-off and its import. A name that cannot make the trip is refused with a message
// where it is typed, never altered on the way.
// The browser's IndexedDB globals (IDBKeyRange and friends), in memory.
import 'fake-indexeddb/auto';
import { IDBFactory } from 'fake-indexeddb';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Site } from '../../src/core/site/model.ts';
import { readSiteFile, writeSiteFile } from '../../src/core/site/siteFile.ts';
import { validateSite } from '../../src/core/site/validate.ts';
import { textContent } from '../../src/core/text/cellText.ts';
import { nameTable } from '../../src/core/text/nameTable.ts';
import { unstorableCharacter } from '../../src/core/text/storable.ts';
import { buildWorkbook } from '../../src/core/workbook/build.ts';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { siteFromWorkbook } from '../../src/core/workbook/readSite.ts';
import { exportWorkbookXlsx, importKvarXlsx } from '../../src/io/xlsx/index.ts';
import { parseWorkbookText } from '../../src/ui/model/docValidate.ts';
import { SessionError, WorkbookSession } from '../../src/ui/model/session.ts';
import { serializeForStorage, WorkbookStore } from '../../src/ui/storage/idbStore.ts';

/** Names people type, names that are also object keys or spreadsheet syntax, and any unicode. */
const OBJECT_WORDS = ['__proto__', 'constructor', 'toString', 'hasOwnProperty', 'valueOf'];
const SPECIAL = [
  ...OBJECT_WORDS,
  'History',
  'A1',
  'R1C1',
  'TRUE',
  '007',
  '1/2/2020',
  '#REF!',
  '=1+1',
  "'x",
  "it's",
  'a"b',
  'load:x',
  'a;b=c',
  '*',
  '<5',
  'ß',
  'İ',
  'Pumps \u{1F6B0}',
  'a\u0007b',
  'x\uD800',
];
const anyName = fc.oneof(
  fc.constantFrom(...SPECIAL),
  fc.string({ unit: 'grapheme', minLength: 1, maxLength: 31 }),
  fc.string({ unit: 'binary', minLength: 1, maxLength: 31 }),
);

const RUNS = 20;

/** The document through the native file, the browser store and a reload into the engine. */
async function throughStorage(doc: WorkbookDoc): Promise<WorkbookDoc> {
  const ser = serializeForStorage(doc);
  if (!ser.ok) throw new Error(ser.message);
  const file = parseWorkbookText(ser.text);
  if (!file.ok) throw new Error(file.message);
  expect(file.doc).toEqual(doc);
  const factory = new IDBFactory();
  const store = await WorkbookStore.open(factory);
  expect((await store.save(file.doc)).ok).toBe(true);
  store.close();
  const again = await WorkbookStore.open(factory);
  const loaded = await again.load();
  again.close();
  if (!loaded.found) throw new Error('nothing stored');
  return WorkbookSession.fromDoc(loaded.doc).toDoc();
}

async function throughXlsx(doc: WorkbookDoc): Promise<WorkbookDoc> {
  const r = await importKvarXlsx(await exportWorkbookXlsx(doc));
  if (!r.ok) throw new Error(r.problem.message);
  return r.doc;
}

describe('names through save, reload, export and import', () => {
  it('a sheet of any accepted name keeps its name, its contents and the formulas that reach it', async () => {
    await fc.assert(
      fc.asyncProperty(anyName, async (name) => {
        const s = WorkbookSession.fromDoc({
          format: 'kvar-ledger-workbook',
          version: 1,
          title: 'names',
          sheets: [{ name: 'Base', cells: [[1]] }],
        });
        let id: number;
        try {
          id = s.addSheet(name);
        } catch (e) {
          // Refused with a message; the names refused are exactly those a file cannot carry.
          expect(e).toBeInstanceOf(SessionError);
          expect((e as Error).message).not.toBe('');
          return;
        }
        s.setCells(id, [{ row: 0, col: 0, content: 7 }]);
        const base = s.sheetIds()[0] as number;
        s.setCells(base, [{ row: 0, col: 1, content: `='${name.replace(/'/g, "''")}'!A1*2` }]);
        expect(s.engine.getCellValue({ sheet: base, row: 0, col: 1 })).toBe(14);
        const doc = s.toDoc();
        const stored = await throughStorage(doc);
        expect(stored).toEqual(doc);
        const handedOff = await throughXlsx(stored);
        expect(handedOff).toEqual(doc);
        const reopened = WorkbookSession.fromDoc(handedOff);
        expect(
          reopened.engine.getCellValue({ sheet: reopened.sheetIds()[0] as number, row: 0, col: 1 }),
        ).toBe(14);
      }),
      // The object property names and the reserved name are always tried, then random ones.
      { numRuns: RUNS, examples: [...OBJECT_WORDS, 'History', "it's", '007'].map((n) => [n] as [string]) },
    );
  });

  it('any text in a cell shows as itself after every step', async () => {
    const storable = anyName.filter((t) => unstorableCharacter(t) === undefined);
    await fc.assert(
      fc.asyncProperty(fc.array(storable, { minLength: 1, maxLength: 8 }), async (texts) => {
        const doc: WorkbookDoc = {
          format: 'kvar-ledger-workbook',
          version: 1,
          title: texts[0] as string,
          sheets: [{ name: 'Names', cells: [texts.map(textContent)] }],
        };
        for (const step of [doc, await throughStorage(doc), await throughXlsx(doc)]) {
          const s = WorkbookSession.fromDoc(step);
          expect(texts.map((_, col) => s.engine.getCellValue({ sheet: 0, row: 0, col }))).toEqual(texts);
          expect(step.title).toBe(texts[0]);
        }
      }),
      { numRuns: RUNS },
    );
  });

  /** A small site: a transformer feeding a motor, two cases, every name chosen by the test. */
  function site(cases: string[], buses: string[], tags: string[], name: string): Site {
    const [c1, c2] = cases as [string, string];
    const [b1, b2] = buses as [string, string];
    const [t1, t2, t3] = tags as [string, string, string];
    return {
      settings: { name, hz: 50, cases, requirement: { kind: 'cosphi', target: 0.95 } },
      equipment: [
        {
          row: 2,
          tag: t1,
          bus: b1,
          kind: 'transformer',
          to_bus: b2,
          values: { s_kva: 1000, uk_pct: 6, i0_pct: 1, p0_kw: 1, pk_kw: 10, u_kv: 0.4 },
          loads: nameTable(),
        },
        {
          row: 3,
          tag: t2,
          bus: b2,
          kind: 'motor',
          description: t3,
          values: { p_kw: 100, eff: 0.95, cos_phi: 0.85, u_kv: 0.4 },
          loads: nameTable([
            [c1, 0.8],
            [c2, 0.3],
          ]),
        },
      ],
    };
  }

  /** Equipment compared by content: rows sorted, row numbers and key order ignored. */
  const same = (s: Site) =>
    JSON.stringify({
      settings: s.settings,
      equipment: [...s.equipment]
        .sort((a, b) => a.kind.localeCompare(b.kind))
        .map((r) => ({
          ...r,
          row: 0,
          values: Object.fromEntries(Object.entries(r.values).sort()),
          loads: Object.fromEntries(Object.entries(r.loads).sort()),
        })),
    });

  it('case, bus, tag and site names are refused with a message, or come back unchanged', async () => {
    const trimmed = anyName.map((n) => n.trim()).filter((n) => n !== '');
    const two = fc.uniqueArray(trimmed, { minLength: 2, maxLength: 2 });
    await fc.assert(
      fc.asyncProperty(
        two,
        two,
        fc.uniqueArray(trimmed, { minLength: 3, maxLength: 3 }),
        trimmed,
        async (cases, buses, tags, name) => {
          const s = site(cases, buses, tags, name);
          const names = [...cases, ...buses, ...tags, name];
          const errors = validateSite(s).filter((p) => p.severity === 'error');
          const unstorable = names.filter((n) => unstorableCharacter(n) !== undefined);
          // Refused exactly when a name cannot be carried, each time with where and which character.
          expect(errors.length > 0).toBe(unstorable.length > 0);
          if (errors.length > 0) {
            for (const e of errors) expect(e.message).toMatch(/contains the character U\+[0-9A-F]{4}/);
            return;
          }
          const file = readSiteFile(writeSiteFile(s));
          expect(file.problems).toEqual([]);
          expect(same(file.site)).toBe(same(s));
          const live = WorkbookSession.fromDoc(buildWorkbook(s, { flavour: 'live' })).toDoc();
          expect(same(siteFromWorkbook(await throughStorage(live)).site)).toBe(same(s));
          const portable = await throughXlsx(buildWorkbook(s, { flavour: 'portable' }));
          expect(same(siteFromWorkbook(portable).site)).toBe(same(s));
        },
      ),
      {
        numRuns: RUNS,
        examples: [
          [['toString', '__proto__'], ['constructor', 'valueOf'], ['T1', 'M1', 'hasOwnProperty'], 'Site'],
          [['day', 'night'], ['MV', 'LV'], ['T1', 'M\u0007', 'x'], 'Site'],
        ],
      },
    );
    // Each run builds and stores two workbooks and round-trips one through xlsx: 10-16 s for all
    // runs on a quiet two-core machine, over the default 30 s beside the living-model property test.
  }, 120_000);
});
