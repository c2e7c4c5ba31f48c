// How a tab keeps the workbook: every edit in the journal at once, full saves that never erase
// another tab's work (the later tab turns to a copy), and a save issued as the page goes away.
import 'fake-indexeddb/auto';
import { IDBFactory } from 'fake-indexeddb';
import { afterEach, describe, expect, it } from 'vitest';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';
import { LAST_GOOD, WorkbookStore } from '../../src/ui/storage/idbStore.ts';
import { copies } from '../../src/ui/storage/storedSlots.ts';
import { TabStorage } from '../../src/ui/storage/tabStorage.ts';

const book = (title: string): WorkbookDoc => ({
  format: 'kvar-ledger-workbook',
  version: 1,
  title,
  sheets: [
    {
      name: 'Loads',
      cells: [
        ['tag', 'P (kW)'],
        ['M1', 10],
        ['M2', 20],
        ['total', '=SUM(B2:B3)'],
      ],
    },
    { name: 'Notes', cells: [['remember']] },
  ],
});

let open: WorkbookStore[] = [];
async function storeOn(factory: IDBFactory): Promise<WorkbookStore> {
  const s = await WorkbookStore.open(factory);
  open.push(s);
  return s;
}
afterEach(() => {
  open.forEach((s) => s.close());
  open = [];
});

/** A tab: a session on the stored workbook (or `doc`), its storage, and the edit wiring of the app. */
async function tab(factory: IDBFactory, name: string, mode: 'main' | 'copy' = 'main', doc = book('Plant')) {
  const store = await storeOn(factory);
  const loaded = await store.load();
  const session = WorkbookSession.fromDoc(loaded.found ? loaded.doc : doc);
  const copies: string[] = [];
  const storage = new TabStorage(store, {
    mode,
    tab: name,
    ...(loaded.found ? { opened: loaded } : {}),
    onCopy: (m) => copies.push(m),
  });
  const urgent: boolean[] = [];
  session.onChange((c) => urgent.push(storage.record(c, session)));
  const settle = () => storage.written();
  return { store, session, storage, copies, urgent, settle };
}

const loadsSheet = (s: WorkbookSession) => s.sheetIds()[0] as number;

describe('TabStorage', () => {
  it('keeps every edit made after the last full save, without another full save', async () => {
    const factory = new IDBFactory();
    const a = await tab(factory, 'a');
    expect((await a.storage.save(a.session.toDoc())).ok).toBe(true);
    expect(a.storage.atRisk).toBe(false);
    a.session.setCells(loadsSheet(a.session), [{ row: 1, col: 1, content: 11 }]);
    a.session.setCells(loadsSheet(a.session), [{ row: 4, col: 0, content: 'M3' }]);
    a.session.setTitle('Plant after edits');
    expect(a.urgent).toEqual([false, false, false]);
    // The journal writes are under way as soon as the edits are made.
    expect(a.storage.atRisk).toBe(true);
    await a.settle();
    expect(a.storage.atRisk).toBe(false);
    a.store.close();
    const reopened = await (await storeOn(factory)).load();
    expect(reopened.found && reopened.recovered).toBe(3);
    expect(reopened.found && reopened.doc).toEqual(a.session.toDoc());
  });

  it('saves in full at once after an edit the journal cannot describe, and replays nothing across it', async () => {
    const factory = new IDBFactory();
    const a = await tab(factory, 'a');
    await a.storage.save(a.session.toDoc());
    a.session.setCells(loadsSheet(a.session), [{ row: 1, col: 1, content: 11 }]);
    a.session.insertRows(loadsSheet(a.session), 1, 1);
    a.session.setCells(loadsSheet(a.session), [{ row: 1, col: 0, content: 'new' }]);
    expect(a.urgent).toEqual([false, true, true]);
    await a.settle();
    a.store.close();
    // No full save since the rows were inserted: the entry after it must not land on the old rows.
    const reopened = await (await storeOn(factory)).load();
    expect(reopened.found && reopened.recovered).toBe(1);
    expect(reopened.found && reopened.doc.sheets[0]?.cells[1]).toEqual(['M1', 11]);
    expect(reopened.found && reopened.doc.sheets[0]?.cells[2]).toEqual(['M2', 20]);
  });

  it('never lets a later tab overwrite an earlier one: the later tab turns to a copy', async () => {
    const factory = new IDBFactory();
    const first = await tab(factory, 'first');
    await first.storage.save(first.session.toDoc());
    // A second tab opens the same workbook without knowing of the first (no Web Locks).
    const second = await tab(factory, 'second');
    first.session.setCells(loadsSheet(first.session), [{ row: 1, col: 1, content: 111 }]);
    expect((await first.storage.save(first.session.toDoc())).ok).toBe(true);
    second.session.setCells(loadsSheet(second.session), [{ row: 2, col: 1, content: 222 }]);
    const r = await second.storage.save(second.session.toDoc());
    expect(r.ok).toBe(true);
    expect(second.storage.mode).toBe('copy');
    expect(second.copies[0]).toMatch(/this tab now works on a copy/);
    const store = await storeOn(factory);
    const main = await store.load();
    expect(main.found && main.doc.sheets[0]?.cells[1]).toEqual(['M1', 111]);
    expect(main.found && main.doc.sheets[0]?.cells[2]).toEqual(['M2', 20]);
    const kept = await copies(store);
    expect(kept.map((c) => c.slot)).toEqual(['copy:second']);
    expect((await store.loadSlot('copy:second'))?.doc.sheets[0]?.cells[2]).toEqual(['M2', 222]);
    // Later edits of the second tab keep going to its copy, journal included.
    second.session.setCells(loadsSheet(second.session), [{ row: 3, col: 1, content: 333 }]);
    await second.settle();
    expect((await store.loadSlot('copy:second'))?.doc.sheets[0]?.cells[3]).toEqual(['total', 333]);
    expect(((await store.load()) as { doc: WorkbookDoc }).doc.sheets[0]?.cells[3]).toEqual([
      'total',
      '=SUM(B2:B3)',
    ]);
  });

  it('a tab that starts as the copy saves into a slot of its own', async () => {
    const factory = new IDBFactory();
    const first = await tab(factory, 'first');
    await first.storage.save(first.session.toDoc());
    const later = await tab(factory, 'later', 'copy');
    later.session.setTitle('Edited in the later tab');
    expect(later.urgent).toEqual([true]);
    expect((await later.storage.save(later.session.toDoc())).ok).toBe(true);
    const store = await storeOn(factory);
    expect(((await store.load()) as { doc: WorkbookDoc }).doc.title).toBe('Plant');
    expect((await store.loadSlot('copy:later'))?.doc.title).toBe('Edited in the later tab');
  });

  it('issues the save as the page goes away before anything is awaited', async () => {
    const factory = new IDBFactory();
    const a = await tab(factory, 'a');
    await a.storage.save(a.session.toDoc());
    a.session.insertRows(loadsSheet(a.session), 1, 1);
    const pending = a.storage.saveNow(a.session.toDoc());
    // The page is gone: its connection closes at once. The write issued before still lands.
    a.store.close();
    expect((await pending).ok).toBe(true);
    const reopened = await (await storeOn(factory)).load();
    expect(reopened.found && reopened.doc.sheets[0]?.cells).toHaveLength(5);
  });

  it('stores and compares the save number it expects', async () => {
    const factory = new IDBFactory();
    const a = await tab(factory, 'a');
    for (let i = 0; i < 3; i++) {
      a.session.setTitle(`Plant ${i}`);
      expect((await a.storage.save(a.session.toDoc())).ok).toBe(true);
    }
    const loaded = await (await storeOn(factory)).load();
    expect(loaded.found && [loaded.from, loaded.rev, loaded.writer, loaded.doc.title]).toEqual([
      LAST_GOOD,
      3,
      'a',
      'Plant 2',
    ]);
  });
});
