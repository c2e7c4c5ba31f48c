// Browser-storage logic against an in-memory IndexedDB (fake-indexeddb).
// The browser's IndexedDB globals (IDBKeyRange and friends), in memory.
import 'fake-indexeddb/auto';
import { IDBFactory, IDBObjectStore } from 'fake-indexeddb';
import { afterEach, describe, expect, it } from 'vitest';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { LAST_GOOD, PREVIOUS, WorkbookStore } from '../../src/ui/storage/idbStore.ts';
import { copies, dropSlot, loadPrevious, loadSetAside } from '../../src/ui/storage/storedSlots.ts';

const book = (title: string, value: number): WorkbookDoc => ({
  format: 'kvar-ledger-workbook',
  version: 1,
  title,
  sheets: [
    {
      name: 'Site',
      cells: [
        ['frequency (Hz)', value],
        ['=B1*2', null],
      ],
    },
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

describe('WorkbookStore', () => {
  it('finds nothing in a fresh browser', async () => {
    const store = await storeOn(new IDBFactory());
    expect(await store.load()).toEqual({ found: false });
  });

  it('restores the last saved state after the page is reopened', async () => {
    const factory = new IDBFactory();
    const first = await storeOn(factory);
    const r = await first.save(book('Cold store', 50), new Date('2026-01-02T03:04:05Z'));
    expect(r).toEqual({ ok: true, savedAt: '2026-01-02T03:04:05.000Z', unchanged: false });
    first.close();
    const again = await storeOn(factory);
    const loaded = await again.load();
    expect(loaded.found && loaded.doc).toEqual(book('Cold store', 50));
    expect(loaded.found && loaded.from).toBe(LAST_GOOD);
  });

  it('keeps the state before the last one as "previous"', async () => {
    const store = await storeOn(new IDBFactory());
    await store.save(book('A', 50));
    await store.save(book('A', 60));
    expect((await loadPrevious(store))?.doc).toEqual(book('A', 50));
    expect(((await store.load()) as { doc: WorkbookDoc }).doc).toEqual(book('A', 60));
  });

  it('does not rotate when nothing changed, so "previous" stays useful', async () => {
    const store = await storeOn(new IDBFactory());
    await store.save(book('A', 50));
    await store.save(book('A', 60));
    const again = await store.save(book('A', 60));
    expect(again.ok && again.unchanged).toBe(true);
    expect((await loadPrevious(store))?.doc).toEqual(book('A', 50));
  });

  it('refuses a broken workbook and leaves the last good state alone', async () => {
    const store = await storeOn(new IDBFactory());
    await store.save(book('Good', 50));
    const broken = { ...book('Bad', 1), sheets: [{ name: 'Site', cells: [[Number.NaN]] }] } as WorkbookDoc;
    const r = await store.save(broken);
    expect(r.ok).toBe(false);
    expect(!r.ok && r.reason).toBe('invalid');
    expect(!r.ok && r.message).toMatch(/cell A1/);
    const loaded = await store.load();
    expect(loaded.found && loaded.doc.title).toBe('Good');
    expect(await loadPrevious(store)).toBeUndefined();
  });

  it('falls back to the previous state when the last one is unreadable', async () => {
    const factory = new IDBFactory();
    const store = await storeOn(factory);
    await store.save(book('Older', 50));
    await store.save(book('Newer', 60));
    // Corrupt the last-good record behind the store's back (a crash mid-write, a bad extension...).
    await new Promise<void>((resolve, reject) => {
      const req = factory.open('kvar-ledger', 1);
      req.onsuccess = () => {
        const tx = req.result.transaction('workbooks', 'readwrite');
        tx.objectStore('workbooks').put(
          { text: '{"format":"kvar-ledger-workbook", trunc', savedAt: 'x', title: 'x' },
          LAST_GOOD,
        );
        tx.oncomplete = () => {
          req.result.close();
          resolve();
        };
        tx.onerror = () => reject(tx.error ?? new Error('the write failed'));
      };
    });
    const loaded = await store.load();
    expect(loaded.found && loaded.from).toBe(PREVIOUS);
    expect(loaded.found && loaded.doc.title).toBe('Older');
    expect(loaded.note).toMatch(/could not be read/);
    // The next good save must not rotate the unreadable record into "previous".
    await store.save(book('Fixed', 70));
    expect((await loadPrevious(store))?.doc.title).toBe('Older');
  });

  it('reports a full storage in plain words, and keeps the old state', async () => {
    const store = await storeOn(new IDBFactory());
    await store.save(book('Kept', 50));
    const proto = IDBObjectStore.prototype;
    const realPut = proto.put;
    proto.put = function () {
      throw new DOMException('The quota has been exceeded.', 'QuotaExceededError');
    };
    try {
      const r = await store.save(book('Too big', 60));
      expect(r.ok).toBe(false);
      expect(!r.ok && r.reason).toBe('storage');
      expect(!r.ok && r.message).toMatch(/storage for this page is full/);
      expect(!r.ok && r.message).toMatch(/Save the workbook to a file/);
    } finally {
      proto.put = realPut;
    }
    const loaded = await store.load();
    expect(loaded.found && loaded.doc.title).toBe('Kept');
  });

  it('sets a replaced workbook aside apart from the autosaved states', async () => {
    const store = await storeOn(new IDBFactory());
    expect(await loadSetAside(store)).toBeUndefined();
    await store.save(book('Open one', 50));
    expect((await store.setAside(book('Replaced', 60))).ok).toBe(true);
    await store.save(book('Open one', 70));
    await store.save(book('Open one', 80));
    expect((await loadSetAside(store))?.doc).toEqual(book('Replaced', 60));
    const bad = await store.setAside({ ...book('Broken', 1), sheets: [] });
    expect(!bad.ok && bad.message).toMatch(/at least one sheet/);
    expect((await loadSetAside(store))?.doc.title).toBe('Replaced');
  });
});

describe('WorkbookStore: journal, save numbers, a newer page', () => {
  it('replays the journal entries made after the last full save when the page comes back', async () => {
    const factory = new IDBFactory();
    const tab = await storeOn(factory);
    await tab.saveSlot(book('Plant', 50), { slot: LAST_GOOD, writer: 'tab-1', through: 2, rev: 1 });
    // Two edits recorded, then the page is gone before the next full save.
    await tab.appendJournal(LAST_GOOD, 'tab-1', {
      seq: 3,
      entry: { kind: 'rows', sheet: 'Site', length: 2, rows: [[0, ['frequency (Hz)', 60]]] },
    });
    await tab.appendJournal(LAST_GOOD, 'tab-1', { seq: 4, entry: { kind: 'title', title: 'Plant 2' } });
    // An entry of the same writer already held by the save, and one of another writer: not replayed.
    await tab.appendJournal(LAST_GOOD, 'tab-1', {
      seq: 2,
      entry: { kind: 'rows', sheet: 'Site', length: 2, rows: [[0, ['stale', 1]]] },
    });
    await tab.appendJournal(LAST_GOOD, 'tab-0', { seq: 5, entry: { kind: 'title', title: 'Other' } });
    tab.close();
    const again = await storeOn(factory);
    const loaded = await again.load();
    expect(loaded.found && loaded.recovered).toBe(2);
    expect(loaded.found && loaded.lastSeq).toBe(4);
    expect(loaded.found && loaded.doc).toEqual({ ...book('Plant 2', 60) });
  });

  it('a full save drops the entries it holds and those of other writers, and keeps later ones', async () => {
    const factory = new IDBFactory();
    const tab = await storeOn(factory);
    const title = (seq: number, t: string) => ({ seq, entry: { kind: 'title' as const, title: t } });
    await tab.appendJournal(LAST_GOOD, 'old-tab', title(1, 'old'));
    await tab.appendJournal(LAST_GOOD, 'tab', title(1, 'one'));
    await tab.appendJournal(LAST_GOOD, 'tab', title(2, 'two'));
    await tab.saveSlot(book('one', 50), { slot: LAST_GOOD, writer: 'tab', through: 1, rev: 1 });
    const loaded = await tab.load();
    expect(loaded.found && [loaded.doc.title, loaded.recovered]).toEqual(['two', 1]);
    await tab.saveSlot(book('two', 50), { slot: LAST_GOOD, writer: 'tab', through: 2, rev: 2 });
    const all = await new Promise<unknown[]>((resolve) => {
      const req = factory.open('kvar-ledger');
      req.onsuccess = () => {
        const r = req.result.transaction('workbooks').objectStore('workbooks').getAllKeys();
        r.onsuccess = () => (req.result.close(), resolve(r.result));
      };
    });
    expect(all.filter((k) => Array.isArray(k))).toEqual([]);
  });

  it('refuses a save that expects another save number: a second tab cannot erase the first', async () => {
    const factory = new IDBFactory();
    const first = await storeOn(factory);
    const second = await storeOn(factory);
    await first.saveSlot(book('Start', 50), { slot: LAST_GOOD, writer: 'a', through: 0, expectRev: null });
    // Both tabs open save number 1; the first saves its edit as number 2.
    expect(
      (
        await first.saveSlot(book('First tab', 60), {
          slot: LAST_GOOD,
          writer: 'a',
          through: 0,
          expectRev: 1,
        })
      ).ok,
    ).toBe(true);
    const late = await second.saveSlot(book('Second tab', 70), {
      slot: LAST_GOOD,
      writer: 'b',
      through: 0,
      expectRev: 1,
    });
    expect(late).toEqual({
      ok: false,
      reason: 'conflict',
      message: 'Another tab saved this workbook after this tab opened it; its work is not overwritten.',
    });
    const loaded = await second.load();
    expect(loaded.found && [loaded.doc.title, loaded.rev]).toEqual(['First tab', 2]);
    // An empty slot is expected as null; a stored one without a number counts as 0.
    expect(
      (await second.saveSlot(book('x', 1), { slot: 'copy:b', writer: 'b', through: 0, expectRev: null })).ok,
    ).toBe(true);
    expect(
      (await second.saveSlot(book('x', 2), { slot: 'copy:b', writer: 'b', through: 0, expectRev: null })).ok,
    ).toBe(false);
  });

  it('lists the copies kept by other tabs, newest first, and drops one with its journal', async () => {
    const store = await storeOn(new IDBFactory());
    await store.saveSlot(book('Copy A', 1), {
      slot: 'copy:a',
      writer: 'a',
      through: 0,
      now: new Date('2026-01-01T00:00:00Z'),
    });
    await store.saveSlot(book('Copy B', 2), {
      slot: 'copy:b',
      writer: 'b',
      through: 0,
      now: new Date('2026-01-02T00:00:00Z'),
    });
    await store.appendJournal('copy:b', 'b', { seq: 1, entry: { kind: 'title', title: 'Copy B2' } });
    await store.save(book('Main', 3));
    expect((await copies(store)).map((c) => [c.slot, c.title])).toEqual([
      ['copy:b', 'Copy B'],
      ['copy:a', 'Copy A'],
    ]);
    expect((await store.loadSlot('copy:b'))?.doc.title).toBe('Copy B2');
    await dropSlot(store, 'copy:b');
    expect((await copies(store)).map((c) => c.slot)).toEqual(['copy:a']);
    expect(await store.loadSlot('copy:b')).toBeUndefined();
  });

  it('lets a newer page upgrade the database: writes what is pending, closes, then says why it no longer saves', async () => {
    const factory = new IDBFactory();
    const events: string[] = [];
    const store: WorkbookStore | undefined = await WorkbookStore.open(factory, 'kvar-ledger', {
      beforeClose: () => {
        events.push('before close');
        void store?.saveSlot(book('Last edit', 99), {
          slot: LAST_GOOD,
          writer: 't',
          through: 0,
          rev: 9,
          immediate: true,
        });
      },
      onClosed: (m) => events.push(m),
    });
    await store.save(book('Saved', 1));
    const version = await new Promise<number>((resolve, reject) => {
      const req = factory.open('kvar-ledger', 2);
      req.onblocked = () => reject(new Error('blocked by the open page'));
      req.onsuccess = () => {
        const v = req.result.version;
        req.result.close();
        resolve(v);
      };
    });
    expect(version).toBe(2);
    expect(events[0]).toBe('before close');
    expect(events[1]).toMatch(/newer version in another tab/);
    const late = await store.save(book('Too late', 2));
    expect(!late.ok && late.message).toMatch(/Reload it to go on/);
    // The write issued before closing is there, and the store opens at the newer version.
    const next = await storeOn(factory);
    const loaded = await next.load();
    expect(loaded.found && loaded.doc.title).toBe('Last edit');
  });
});
