// Debounced autosave: every change schedules a save; a burst of edits becomes one write, and a
// write never overlaps another. An urgent change is saved at the next turn of the event loop.
// When the page goes away, flushNow issues the write at once, before anything is awaited.
// The status callback drives the status bar.
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import type { SaveResult } from './idbStore.ts';

export type AutosaveStatus =
  | { readonly state: 'pending' }
  | { readonly state: 'saving' }
  | { readonly state: 'saved'; readonly savedAt: string }
  | { readonly state: 'failed'; readonly message: string };

export interface Saver {
  save(doc: WorkbookDoc): Promise<SaveResult>;
  /** Issue a save at once, not waiting for anything (the page is going away); the write is under way on return. */
  saveNow?(doc: WorkbookDoc): Promise<SaveResult>;
}

export interface AutosaveOptions {
  readonly delayMs?: number;
  readonly onStatus?: (s: AutosaveStatus) => void;
  /** Timer functions, replaceable in tests. */
  readonly setTimer?: (fn: () => void, ms: number) => unknown;
  readonly clearTimer?: (handle: unknown) => void;
}

export class Autosaver {
  private timer: unknown;
  private dirty = false;
  private running: Promise<void> | undefined;
  /** Saves issued by flushNow and not finished yet. */
  private inFlight = 0;
  private readonly delay: number;
  private readonly setTimer: (fn: () => void, ms: number) => unknown;
  private readonly clearTimer: (h: unknown) => void;

  constructor(
    private readonly saver: Saver,
    private readonly snapshot: () => WorkbookDoc,
    private readonly opts: AutosaveOptions = {},
  ) {
    this.delay = opts.delayMs ?? 700;
    this.setTimer = opts.setTimer ?? ((fn, ms) => setTimeout(fn, ms));
    this.clearTimer = opts.clearTimer ?? ((h) => clearTimeout(h as ReturnType<typeof setTimeout>));
  }

  /** Call after every change; `urgent`: save at the next turn instead of after the pause. */
  changed(urgent = false): void {
    this.dirty = true;
    this.opts.onStatus?.({ state: 'pending' });
    if (this.timer !== undefined) this.clearTimer(this.timer);
    this.timer = this.setTimer(
      () => {
        this.timer = undefined;
        void this.flush();
      },
      urgent ? 0 : this.delay,
    );
  }

  /**
   * The page is being hidden or closed: issue the save of what changed now, synchronously (a
   * save that waits for the one running, or reads first, would start after the page is gone).
   */
  flushNow(): void {
    // A save under way may still be reading; the page would be gone before it writes.
    if (!this.dirty && !this.running) return;
    if (this.timer !== undefined) {
      this.clearTimer(this.timer);
      this.timer = undefined;
    }
    if (!this.saver.saveNow) return void this.flush();
    this.dirty = false;
    this.opts.onStatus?.({ state: 'saving' });
    this.inFlight++;
    void this.saver
      .saveNow(this.snapshot())
      .catch((e: unknown) => failure(e))
      .then((r) => this.report(r))
      .finally(() => this.inFlight--);
  }

  get hasUnsaved(): boolean {
    return this.dirty || this.running !== undefined || this.inFlight > 0;
  }

  /** Save now if anything changed (also used when the page is hidden or closed). */
  async flush(): Promise<void> {
    if (this.timer !== undefined) {
      this.clearTimer(this.timer);
      this.timer = undefined;
    }
    while (this.running) await this.running;
    if (!this.dirty) return;
    this.dirty = false;
    this.running = this.writeOnce().finally(() => (this.running = undefined));
    await this.running;
  }

  private async writeOnce(): Promise<void> {
    this.opts.onStatus?.({ state: 'saving' });
    let result: SaveResult;
    try {
      result = await this.saver.save(this.snapshot());
    } catch (e) {
      result = failure(e);
    }
    this.report(result);
  }

  private report(result: SaveResult): void {
    if (result.ok) this.opts.onStatus?.({ state: 'saved', savedAt: result.savedAt });
    else this.opts.onStatus?.({ state: 'failed', message: result.message });
  }
}

function failure(e: unknown): SaveResult {
  return {
    ok: false,
    reason: 'storage',
    message: `Saving failed: ${e instanceof Error ? e.message : String(e)}`,
  };
}
