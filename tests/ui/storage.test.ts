// Browser-storage logic against an in-memory IndexedDB (fake-indexeddb).
import { IDBFactory, IDBObjectStore } from 'fake-indexeddb';
import { afterEach, describe, expect, it } from 'vitest';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { LAST_GOOD, PREVIOUS, WorkbookStore } from '../../src/ui/storage/idbStore.ts';

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
    expect((await store.loadPrevious())?.doc).toEqual(book('A', 50));
    expect(((await store.load()) as { doc: WorkbookDoc }).doc).toEqual(book('A', 60));
  });

  it('does not rotate when nothing changed, so "previous" stays useful', async () => {
    const store = await storeOn(new IDBFactory());
    await store.save(book('A', 50));
    await store.save(book('A', 60));
    const again = await store.save(book('A', 60));
    expect(again.ok && again.unchanged).toBe(true);
    expect((await store.loadPrevious())?.doc).toEqual(book('A', 50));
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
    expect(await store.loadPrevious()).toBeUndefined();
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
        tx.onerror = () => reject(tx.error);
      };
    });
    const loaded = await store.load();
    expect(loaded.found && loaded.from).toBe(PREVIOUS);
    expect(loaded.found && loaded.doc.title).toBe('Older');
    expect(loaded.note).toMatch(/could not be read/);
    // The next good save must not rotate the unreadable record into "previous".
    await store.save(book('Fixed', 70));
    expect((await store.loadPrevious())?.doc.title).toBe('Older');
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
    expect(await store.loadSetAside()).toBeUndefined();
    await store.save(book('Open one', 50));
    expect((await store.setAside(book('Replaced', 60))).ok).toBe(true);
    await store.save(book('Open one', 70));
    await store.save(book('Open one', 80));
    expect((await store.loadSetAside())?.doc).toEqual(book('Replaced', 60));
    const bad = await store.setAside({ ...book('Broken', 1), sheets: [] });
    expect(!bad.ok && bad.message).toMatch(/at least one sheet/);
    expect((await store.loadSetAside())?.doc.title).toBe('Replaced');
  });
});
