// Browser storage of the open workbook, in IndexedDB: the last good state and the one before it,
// a workbook set aside when another replaced it, copies kept by a second tab, and the
// write-ahead record of edits since the last full save (journal.ts).
//
// A state is written only after it passed the workbook check, and a stored state is checked
// again when read, so a broken workbook can never replace the last good one. Each state carries
// a save number: a save that expects another number than the slot holds (another tab saved in
// between) is refused instead of erasing that tab's work.
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { workbookProblems } from '../model/docValidate.ts';
import { commitNow, done, openDatabase, request, STORE } from './idbRequests.ts';
import { replay, type JournalRecord } from './journal.ts';
import { describeStorageError } from './storageErrors.ts';

export const DB_NAME = 'kvar-ledger';
export const LAST_GOOD = 'last-good';
export const PREVIOUS = 'previous';
/** The workbook that was open before a template, file or import replaced it. */
export const SET_ASIDE = 'set-aside';
/** Slots of copies kept by tabs that found the workbook open in another tab: 'copy:<tab>'. */
export const COPY_PREFIX = 'copy:';
export const JOURNAL = 'journal';

export interface StoredState {
  readonly text: string;
  readonly savedAt: string;
  readonly title: string;
  /** Save number of the slot (absent in states saved before numbers were kept: read as 0). */
  readonly rev?: number;
  /** Whose journal entries follow this state. */
  readonly writer?: string;
  /** The last of the writer's journal entries this state already holds. */
  readonly through?: number;
}

export type SaveResult =
  | { readonly ok: true; readonly savedAt: string; readonly unchanged: boolean }
  | { readonly ok: false; readonly reason: 'invalid' | 'storage' | 'conflict'; readonly message: string };

/** A readable state of a slot, with its journal replayed. */
export interface SlotContent {
  readonly doc: WorkbookDoc;
  readonly savedAt: string;
  /** The slot's save number (null: the slot holds nothing, as when only the previous state was read). */
  readonly rev: number | null;
  readonly writer: string | undefined;
  /** The last journal entry the doc holds (the state's own, or the last one replayed). */
  readonly lastSeq: number;
  /** Journal entries replayed on top of the saved state. */
  readonly recovered: number;
}

export type LoadResult =
  | ({
      readonly found: true;
      readonly from: typeof LAST_GOOD | typeof PREVIOUS;
      readonly note?: string;
    } & SlotContent)
  | { readonly found: false; readonly note?: string };

/** One save of a slot. */
export interface SlotWrite {
  readonly slot: string;
  readonly writer: string;
  /** The journal entries the workbook holds: the store drops them. */
  readonly through: number;
  /** The save number to write; default one more than the slot holds. */
  readonly rev?: number;
  /** Refuse unless the slot holds this save number (null: unless the slot is empty). */
  readonly expectRev?: number | null;
  /** Keep the state it replaces as PREVIOUS. */
  readonly rotate?: boolean;
  /** For a page going away: issue every write at once and commit (no check, no rotation). */
  readonly immediate?: boolean;
  readonly now?: Date;
}

export interface StoreHooks {
  /**
   * A newer copy of the page (another tab) needs the database: write what is pending now, the
   * connection closes right after.
   */
  readonly beforeClose?: () => void;
  /** The connection was closed for that reason; further saves fail with `message`. */
  readonly onClosed?: (message: string) => void;
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

export function readState(value: unknown): (StoredState & { doc: WorkbookDoc }) | undefined {
  const s = value as Partial<StoredState> | undefined;
  if (!s || typeof s.text !== 'string') return undefined;
  try {
    const doc: unknown = JSON.parse(s.text);
    return workbookProblems(doc).length === 0
      ? { ...(s as StoredState), savedAt: String(s.savedAt), doc: doc as WorkbookDoc }
      : undefined;
  } catch {
    return undefined;
  }
}

/** The save number of a stored value: null for an empty slot, 0 for a state without one. */
const revOf = (v: unknown): number | null =>
  v === undefined
    ? null
    : typeof (v as StoredState).rev === 'number'
      ? ((v as StoredState).rev as number)
      : 0;

const journalKey = (slot: string, writer: string, seq: number) => [JOURNAL, slot, writer, seq];
const journalRange = (slot: string, writer: string, from: number, to: number) =>
  IDBKeyRange.bound(journalKey(slot, writer, from), journalKey(slot, writer, to));

/**
 * The journal entries a full save by `writer` through `through` makes unnecessary: its own up to
 * there, and every entry of other writers of the slot (they follow states this save replaces).
 */
function journalBefore(slot: string, writer: string, through: number): IDBKeyRange[] {
  return [
    IDBKeyRange.bound([JOURNAL, slot], [JOURNAL, slot, writer], false, true),
    journalRange(slot, writer, 0, through),
    IDBKeyRange.bound([JOURNAL, slot, writer, []], [JOURNAL, slot, []], true, false),
  ];
}

export class WorkbookStore {
  private closedBecause: string | undefined;

  private constructor(private readonly db: IDBDatabase) {}

  static async open(factory: IDBFactory, name = DB_NAME, hooks: StoreHooks = {}): Promise<WorkbookStore> {
    const store = new WorkbookStore(await openDatabase(factory, name));
    store.db.onversionchange = () => {
      hooks.beforeClose?.();
      const message =
        'Kvar Ledger was opened in a newer version in another tab, so this tab no longer saves in the browser. Reload it to go on; save the workbook to a file first to keep changes made here since.';
      store.closedBecause = message;
      store.db.close();
      hooks.onClosed?.(message);
    };
    return store;
  }

  /** Why this store no longer saves, once its connection was closed for a newer page. */
  get closed(): string | undefined {
    return this.closedBecause;
  }

  /** Validate, then move last-good to previous and write the new state, in one transaction. */
  save(doc: WorkbookDoc, now: Date = new Date()): Promise<SaveResult> {
    return this.saveSlot(doc, { slot: LAST_GOOD, writer: '', through: 0, rotate: true, now });
  }

  /** Validate, then write one slot (see SlotWrite). */
  async saveSlot(doc: WorkbookDoc, w: SlotWrite): Promise<SaveResult> {
    if (this.closedBecause) return { ok: false, reason: 'storage', message: this.closedBecause };
    const ser = serializeForStorage(doc);
    if (!ser.ok) return { ok: false, reason: 'invalid', message: ser.message };
    const savedAt = (w.now ?? new Date()).toISOString();
    const state = (rev: number): StoredState => ({
      text: ser.text,
      savedAt,
      title: doc.title,
      rev,
      writer: w.writer,
      through: w.through,
    });
    try {
      const tx = this.db.transaction(STORE, 'readwrite');
      const finished = done(tx);
      const store = tx.objectStore(STORE);
      const dropJournal = () => {
        for (const range of journalBefore(w.slot, w.writer, w.through)) store.delete(range);
      };
      if (w.immediate) {
        store.put(state(w.rev ?? 0), w.slot);
        dropJournal();
        commitNow(tx);
        await finished;
        return { ok: true, savedAt, unchanged: false };
      }
      const current: unknown = await request(store.get(w.slot));
      if (w.expectRev !== undefined && revOf(current) !== w.expectRev) {
        tx.abort();
        await finished.catch(() => undefined);
        return {
          ok: false,
          reason: 'conflict',
          message: 'Another tab saved this workbook after this tab opened it; its work is not overwritten.',
        };
      }
      const unchanged = (current as StoredState | undefined)?.text === ser.text;
      if (w.rotate && !unchanged && current !== undefined && readState(current)) store.put(current, PREVIOUS);
      store.put(state(w.rev ?? (revOf(current) ?? 0) + 1), w.slot);
      dropJournal();
      await finished;
      return { ok: true, savedAt, unchanged };
    } catch (e) {
      return { ok: false, reason: 'storage', message: describeStorageError(e) };
    }
  }

  /** Append one journal entry; the write is issued and committed before this returns its promise. */
  appendJournal(slot: string, writer: string, record: JournalRecord): Promise<void> {
    if (this.closedBecause) return Promise.reject(new Error(this.closedBecause));
    try {
      const tx = this.db.transaction(STORE, 'readwrite');
      const finished = done(tx);
      tx.objectStore(STORE).put(record, journalKey(slot, writer, record.seq));
      commitNow(tx);
      return finished;
    } catch (e) {
      return Promise.reject(e instanceof Error ? e : new Error(String(e)));
    }
  }

  /** A slot's state with the journal entries that follow it, or undefined when unreadable. */
  private async readSlot(
    store: IDBObjectStore,
    value: unknown,
    slot: string,
  ): Promise<SlotContent | undefined> {
    const base = readState(value);
    if (!base) return undefined;
    const through = base.through ?? 0;
    const records =
      base.writer === undefined
        ? []
        : ((await request(
            store.getAll(journalRange(slot, base.writer, through + 1, Number.POSITIVE_INFINITY)),
          )) as JournalRecord[]);
    const r = replay(base.doc, through, records);
    // A replay that does not pass the workbook check is not used; the full save still is.
    const doc = r.applied > 0 && workbookProblems(r.doc).length > 0 ? base.doc : r.doc;
    const applied = doc === base.doc ? 0 : r.applied;
    return {
      doc,
      savedAt: base.savedAt,
      rev: revOf(value),
      writer: base.writer,
      lastSeq: through + applied,
      recovered: applied,
    };
  }

  /** The last good state with its journal; the previous one when the last is unreadable. */
  async load(): Promise<LoadResult> {
    const tx = this.db.transaction(STORE, 'readonly');
    const store = tx.objectStore(STORE);
    const last: unknown = await request(store.get(LAST_GOOD));
    const good = await this.readSlot(store, last, LAST_GOOD);
    if (good) return { found: true, from: LAST_GOOD, ...good };
    const older = readState(await request(store.get(PREVIOUS)));
    const note =
      last !== undefined
        ? 'The last saved state could not be read; the one before it was restored.'
        : undefined;
    if (older)
      return {
        found: true,
        from: PREVIOUS,
        doc: older.doc,
        savedAt: older.savedAt,
        rev: revOf(last),
        writer: undefined,
        lastSeq: 0,
        recovered: 0,
        ...(note ? { note } : {}),
      };
    return {
      found: false,
      ...(last !== undefined ? { note: 'The saved workbook in this browser could not be read.' } : {}),
    };
  }

  /** A slot's workbook with its journal (e.g. a copy kept by another tab). */
  async loadSlot(slot: string): Promise<SlotContent | undefined> {
    const store = this.db.transaction(STORE, 'readonly').objectStore(STORE);
    return this.readSlot(store, await request(store.get(slot)), slot);
  }

  /** Keep a workbook that is about to be replaced, so it can be brought back. */
  setAside(doc: WorkbookDoc, now: Date = new Date()): Promise<SaveResult> {
    return this.saveSlot(doc, { slot: SET_ASIDE, writer: '', through: 0, now });
  }

  /** One object store of a new transaction, for the slot browsing in storedSlots.ts. */
  objectStore(mode: IDBTransactionMode): IDBObjectStore {
    return this.db.transaction(STORE, mode).objectStore(STORE);
  }

  close(): void {
    this.db.close();
  }
}
