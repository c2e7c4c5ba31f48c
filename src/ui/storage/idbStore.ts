// Browser storage of the open workbook: the last good state and the one before it, in IndexedDB.
// A state is written only after it passed the workbook check, and a stored state is checked
// again when read, so a broken workbook can never replace the last good one.
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { workbookProblems } from '../model/docValidate.ts';
import { describeStorageError } from './storageErrors.ts';

export const DB_NAME = 'kvar-ledger';
const STORE = 'workbooks';
export const LAST_GOOD = 'last-good';
export const PREVIOUS = 'previous';
/** The workbook that was open before a template, file or import replaced it. */
export const SET_ASIDE = 'set-aside';

export interface StoredState {
  readonly text: string;
  readonly savedAt: string;
  readonly title: string;
}

export type SaveResult =
  | { readonly ok: true; readonly savedAt: string; readonly unchanged: boolean }
  | { readonly ok: false; readonly reason: 'invalid' | 'storage'; readonly message: string };

export type LoadResult =
  | {
      readonly found: true;
      readonly doc: WorkbookDoc;
      readonly from: typeof LAST_GOOD | typeof PREVIOUS;
      readonly savedAt: string;
      readonly note?: string;
    }
  | { readonly found: false; readonly note?: string };

function request<T>(req: IDBRequest<T>): Promise<T> {
  return new Promise((resolve, reject) => {
    req.onsuccess = () => resolve(req.result);
    req.onerror = () => reject(req.error);
  });
}

function done(tx: IDBTransaction): Promise<void> {
  return new Promise((resolve, reject) => {
    tx.oncomplete = () => resolve();
    tx.onerror = () => reject(tx.error);
    tx.onabort = () => reject(tx.error ?? new DOMException('The write was aborted', 'AbortError'));
  });
}

/**
 * Check, then serialize a workbook; the text is what gets stored. The check admits only finite
 * numbers, text, TRUE/FALSE and blanks, which JSON writes and reads back exactly.
 */
export function serializeForStorage(
  doc: WorkbookDoc,
): { ok: true; text: string } | { ok: false; message: string } {
  const problems = workbookProblems(doc);
  if (problems.length > 0)
    return {
      ok: false,
      message: `Not saved, the workbook failed its check: ${problems.slice(0, 3).join(' ')}`,
    };
  try {
    return { ok: true, text: JSON.stringify(doc) };
  } catch (e) {
    return {
      ok: false,
      message: `Not saved, the workbook could not be written out: ${e instanceof Error ? e.message : String(e)}`,
    };
  }
}

function readState(value: unknown): { doc: WorkbookDoc; savedAt: string } | undefined {
  const s = value as Partial<StoredState> | undefined;
  if (!s || typeof s.text !== 'string') return undefined;
  try {
    const doc: unknown = JSON.parse(s.text);
    return workbookProblems(doc).length === 0
      ? { doc: doc as WorkbookDoc, savedAt: String(s.savedAt) }
      : undefined;
  } catch {
    return undefined;
  }
}

export class WorkbookStore {
  private constructor(private readonly db: IDBDatabase) {}

  static async open(factory: IDBFactory, name = DB_NAME): Promise<WorkbookStore> {
    const req = factory.open(name, 1);
    req.onupgradeneeded = () => {
      if (!req.result.objectStoreNames.contains(STORE)) req.result.createObjectStore(STORE);
    };
    return new WorkbookStore(await request(req));
  }

  /** Validate, then in one transaction move last-good to previous and write the new state. */
  save(doc: WorkbookDoc, now: Date = new Date()): Promise<SaveResult> {
    return this.write(LAST_GOOD, doc, now, async (store, text) => {
      const current = (await request(store.get(LAST_GOOD))) as StoredState | undefined;
      if (current?.text === text) return { ok: true, savedAt: current.savedAt, unchanged: true };
      if (current && readState(current)) store.put(current, PREVIOUS);
      return undefined;
    });
  }

  /**
   * Validate, then write one state under `key` in one transaction. `before` runs in that
   * transaction first and may answer instead (nothing is then written).
   */
  private async write(
    key: string,
    doc: WorkbookDoc,
    now: Date,
    before?: (store: IDBObjectStore, text: string) => Promise<SaveResult | undefined>,
  ): Promise<SaveResult> {
    const ser = serializeForStorage(doc);
    if (!ser.ok) return { ok: false, reason: 'invalid', message: ser.message };
    const savedAt = now.toISOString();
    try {
      const tx = this.db.transaction(STORE, 'readwrite');
      const finished = done(tx);
      const store = tx.objectStore(STORE);
      const answer = await before?.(store, ser.text);
      if (!answer) store.put({ text: ser.text, savedAt, title: doc.title } satisfies StoredState, key);
      await finished;
      return answer ?? { ok: true, savedAt, unchanged: false };
    } catch (e) {
      return { ok: false, reason: 'storage', message: describeStorageError(e) };
    }
  }

  /** The last good state; the previous one when the last is unreadable. */
  async load(): Promise<LoadResult> {
    const tx = this.db.transaction(STORE, 'readonly');
    const store = tx.objectStore(STORE);
    const [last, prev] = await Promise.all([request(store.get(LAST_GOOD)), request(store.get(PREVIOUS))]);
    const good = readState(last);
    if (good) return { found: true, doc: good.doc, from: LAST_GOOD, savedAt: good.savedAt };
    const older = readState(prev);
    const note =
      last !== undefined
        ? 'The last saved state could not be read; the one before it was restored.'
        : undefined;
    if (older)
      return {
        found: true,
        doc: older.doc,
        from: PREVIOUS,
        savedAt: older.savedAt,
        ...(note ? { note } : {}),
      };
    return {
      found: false,
      ...(last !== undefined ? { note: 'The saved workbook in this browser could not be read.' } : {}),
    };
  }

  /** The state before the last one (what load() falls back to). */
  async loadPrevious(): Promise<{ doc: WorkbookDoc; savedAt: string } | undefined> {
    const tx = this.db.transaction(STORE, 'readonly');
    return readState(await request(tx.objectStore(STORE).get(PREVIOUS)));
  }

  /** Keep a workbook that is about to be replaced, so it can be brought back. */
  setAside(doc: WorkbookDoc, now: Date = new Date()): Promise<SaveResult> {
    return this.write(SET_ASIDE, doc, now);
  }

  async loadSetAside(): Promise<{ doc: WorkbookDoc; savedAt: string } | undefined> {
    const tx = this.db.transaction(STORE, 'readonly');
    return readState(await request(tx.objectStore(STORE).get(SET_ASIDE)));
  }

  close(): void {
    this.db.close();
  }
}
