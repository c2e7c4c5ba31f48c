// How the page keeps the open workbook in the browser: each edit goes to the journal at once
// (tabStorage.ts), a full save follows a moment later (autosave.ts), the save is issued at once
// when the page goes away, and the page knows whether closing now would lose a change.
import type { WorkbookSession, SessionChange } from '../model/session.ts';
import { Autosaver, type AutosaveStatus } from '../storage/autosave.ts';
import type { WorkbookStore } from '../storage/idbStore.ts';
import type { TabStorage } from '../storage/tabStorage.ts';

const NO_STORAGE =
  'Browser storage is not available here, so changes are NOT kept when the page closes. Save the workbook to a file to keep it.';

export class Keeping {
  private readonly autosaver: Autosaver | undefined;
  /** Without browser storage (or since it was closed): something was changed. */
  private changedUnkept = false;
  /** Why the browser storage no longer saves (a newer page took it over). */
  private gone: string | undefined;

  constructor(
    store: WorkbookStore | undefined,
    private readonly storage: TabStorage | undefined,
    snapshot: () => ReturnType<WorkbookSession['toDoc']>,
    private readonly status: (s: AutosaveStatus) => void,
  ) {
    if (store)
      this.autosaver = new Autosaver(storage ?? store, snapshot, {
        // Once the storage is gone, the status stays NOT SAVED (a last write may still report).
        onStatus: (s) => status(this.gone ? { state: 'failed', message: this.gone } : s),
      });
    else status({ state: 'failed', message: NO_STORAGE });
  }

  /** A workbook is shown; `fresh`: it replaced another (saved in full at once). */
  opened(session: WorkbookSession, fresh: boolean): void {
    if (fresh) this.storage?.restart();
    this.storage?.follow(session.toDoc());
    if (fresh) this.touched(true);
  }

  /** An edit of the open workbook: first of all into the journal (the write is issued here). */
  edited(change: SessionChange, session: WorkbookSession): void {
    this.touched(this.storage?.record(change, session) ?? false);
  }

  private touched(urgent: boolean): void {
    this.autosaver?.changed(urgent);
    if (!this.autosaver || this.gone) this.changedUnkept = true;
  }

  /** Save what is pending and wait for it (before the workbook is replaced). */
  flush(): Promise<void> {
    return this.autosaver?.flush() ?? Promise.resolve();
  }

  /** The page is being hidden or closed: issue the pending save now, synchronously. */
  flushNow(): void {
    this.autosaver?.flushNow();
  }

  /** The browser storage was closed for a newer page: say so, and keep saying it. */
  storeClosed(message: string): void {
    this.gone = message;
    this.status({ state: 'failed', message });
  }

  /** Would closing the page now lose a change? */
  get unsafeToClose(): boolean {
    if (!this.autosaver || this.gone) return this.changedUnkept || (this.autosaver?.hasUnsaved ?? false);
    return this.autosaver.hasUnsaved && (this.storage?.atRisk ?? true);
  }
}
