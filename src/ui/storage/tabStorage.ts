// Where this tab keeps the workbook in the browser, and how every edit gets there.
//
// - The tab that opened the workbook first ('main') saves into the workbook's slot; a later tab
//   works on a copy, saved in a slot of its own, so two tabs never overwrite each other. Should a
//   save find the slot holding a save number this tab has not seen (a tab that could not tell it
//   was second), it refuses and this tab turns to a copy there and then.
// - Each edit is appended to the journal the moment it is made (journal.ts); the full save that
//   follows a moment later makes the journal entries before it unnecessary.
// - When the page goes away, the pending full save is issued at once (saveNow).
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import type { SessionChange } from '../model/session.ts';
import type { Saver } from './autosave.ts';
import { COPY_PREFIX, LAST_GOOD, type SaveResult, type SlotContent, type WorkbookStore } from './idbStore.ts';
import { changedRows, type JournalEntry, type Rows } from './journal.ts';
import { describeStorageError } from './storageErrors.ts';

export type StorageMode = 'main' | 'copy';

/** What the journal needs of the open workbook. */
export interface JournalView {
  readonly title: string;
  sheetName(id: number): string;
  sheetContents(id: number): Rows;
}

export interface TabStorageOptions {
  readonly mode: StorageMode;
  /** This tab's name among the writers (a random id). */
  readonly tab: string;
  /** What the tab opened from its slot, if anything (its save number is the one expected). */
  readonly opened?: Pick<SlotContent, 'rev' | 'writer' | 'lastSeq'>;
  /**
   * Go on with the journal of the tab that saved what was opened. Only for a tab that holds the
   * workbook's lock: the tab that wrote it is then gone for sure.
   */
  readonly adopt?: boolean;
  /** The tab turned to a copy because another tab saved first. */
  readonly onCopy?: (message: string) => void;
}

export class TabStorage implements Saver {
  private modeNow: StorageMode;
  private slot: string;
  /** Whose journal this tab writes: its own, or that of the tab it took over from. */
  private writer: string;
  /** The save number the slot should hold now; null for an empty slot. */
  private rev: number | null;
  /** Last journal number used. */
  private seq = 0;
  /** The rows of each sheet as the last journal entry or full save left them. */
  private readonly base = new Map<string, Rows>();
  private baseTitle: string | undefined;
  /** Journal entries only count once a full save of this tab holds the state they follow. */
  private fullSaveNeeded = true;
  /** The number skipped by the last edit the journal cannot describe. */
  private lastGap = 0;
  private readonly pending = new Set<Promise<unknown>>();
  private journalProblem: string | undefined;

  constructor(
    private readonly store: WorkbookStore,
    private readonly opts: TabStorageOptions,
  ) {
    this.modeNow = opts.mode;
    this.slot = opts.mode === 'main' ? LAST_GOOD : COPY_PREFIX + opts.tab;
    this.rev = opts.mode === 'main' ? (opts.opened?.rev ?? null) : null;
    this.writer = opts.tab;
    const from = opts.opened?.writer;
    if (opts.mode === 'main' && opts.adopt && from !== undefined && opts.opened) {
      // What was opened is the saved state plus that tab's entries: this tab's follow on from them.
      this.writer = from;
      this.seq = opts.opened.lastSeq;
      this.fullSaveNeeded = false;
    }
  }

  get mode(): StorageMode {
    return this.modeNow;
  }

  /**
   * True while an edit is not yet safe in the browser: its journal entry is still being written
   * or could not be, or no full save holds the state the entries follow.
   */
  get atRisk(): boolean {
    return this.pending.size > 0 || this.journalProblem !== undefined || this.fullSaveNeeded;
  }

  /**
   * Record an edit in the journal (the write is issued before this returns). Returns true when
   * the journal cannot describe it and the workbook should be saved in full now.
   */
  record(change: SessionChange, view: JournalView): boolean {
    if (change.kind === 'title') {
      if (view.title !== this.baseTitle) this.append({ kind: 'title', title: view.title });
      this.baseTitle = view.title;
      return this.fullSaveNeeded;
    }
    if (change.kind !== 'cells') {
      // Rows, sheets or undo: skip a number, so no later entry is replayed onto a save without it.
      this.gap();
      return true;
    }
    const name = view.sheetName(change.sheetId);
    const rows = view.sheetContents(change.sheetId);
    const changed = changedRows(this.base.get(name), rows);
    this.base.set(name, rows);
    if (changed.length > 0) this.append({ kind: 'rows', sheet: name, length: rows.length, rows: changed });
    return this.fullSaveNeeded;
  }

  private append(entry: JournalEntry): void {
    const seq = ++this.seq;
    const write = this.store
      .appendJournal(this.slot, this.writer, { seq, entry })
      .then(() => (this.journalProblem = undefined))
      .catch((e: unknown) => (this.journalProblem = describeStorageError(e)))
      .finally(() => this.pending.delete(write));
    this.pending.add(write);
  }

  /** Resolves when the journal writes issued so far are done (written or failed). */
  async written(): Promise<void> {
    await Promise.allSettled([...this.pending]);
  }

  /** The open workbook is `doc` (just opened): journal entries describe changes from it. */
  follow(doc: WorkbookDoc): void {
    this.base.clear();
    for (const s of doc.sheets) this.base.set(s.name, s.cells);
    this.baseTitle = doc.title;
  }

  /** Another workbook took the place of the open one: nothing in the journal leads to it. */
  restart(): void {
    this.gap();
  }

  /** After a full snapshot: the journal goes on from it. */
  private snapshotTaken(doc: WorkbookDoc): number {
    this.follow(doc);
    return this.seq;
  }

  async save(doc: WorkbookDoc): Promise<SaveResult> {
    const through = this.snapshotTaken(doc);
    const expectRev = this.rev;
    const rev = (expectRev ?? 0) + 1;
    this.rev = rev;
    const r = await this.store.saveSlot(doc, {
      slot: this.slot,
      writer: this.writer,
      through,
      rev,
      expectRev,
      rotate: this.slot === LAST_GOOD,
    });
    this.settled(r, rev, expectRev, through);
    if (r.ok || r.reason !== 'conflict' || this.modeNow === 'copy') return r;
    this.toCopy(
      'This workbook was saved in another tab after this tab opened it. To keep both, this tab now works on a copy: its changes are saved apart (Workbook → Bring back…) and never over the other tab’s work.',
    );
    return this.save(doc);
  }

  /** The page is going away: issue the full save now, without waiting for anything. */
  saveNow(doc: WorkbookDoc): Promise<SaveResult> {
    const through = this.snapshotTaken(doc);
    const before = this.rev;
    const rev = (before ?? 0) + 1;
    this.rev = rev;
    return this.store
      .saveSlot(doc, { slot: this.slot, writer: this.writer, through, rev, immediate: true })
      .then((r) => (this.settled(r, rev, before, through), r));
  }

  /** Book-keeping once a full save is done: its number stands, or the one before it again. */
  private settled(r: SaveResult, rev: number, before: number | null, through: number): void {
    if (this.rev !== rev) return; // a later save has taken over
    if (!r.ok) this.rev = before;
    else if (this.lastGap <= through) this.fullSaveNeeded = false;
  }

  private gap(): void {
    this.lastGap = ++this.seq;
    this.base.clear();
    this.fullSaveNeeded = true;
  }

  private toCopy(message: string): void {
    this.modeNow = 'copy';
    this.slot = COPY_PREFIX + this.opts.tab;
    this.writer = this.opts.tab;
    this.rev = null;
    this.gap();
    this.opts.onCopy?.(message);
  }
}
