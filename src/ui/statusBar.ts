// The bottom line: whether the work is safe (saved in this browser, or not and why), what the
// selection adds up to, and errors on the sheet with a jump to the next one.
import { el } from './dom.ts';
import type { AutosaveStatus } from './storage/autosave.ts';
import { formatGeneral } from './format/numberFormat.ts';

export class StatusBar {
  readonly root: HTMLElement;
  private readonly save: HTMLElement;
  private readonly summary: HTMLElement;
  readonly errors: HTMLButtonElement;
  private readonly notice: HTMLElement;
  private noticeTimer: ReturnType<typeof setTimeout> | undefined;
  /** This tab works on a copy of the workbook (another tab has it open). */
  private copy = false;

  constructor(onNextError: () => void, onCautions: () => void) {
    this.save = el('span', {
      className: 'kl-status-save',
      attrs: { 'data-testid': 'save-status', role: 'status' },
    });
    this.summary = el('span', { className: 'kl-status-summary', attrs: { 'data-testid': 'sel-summary' } });
    this.errors = el('button', {
      className: 'kl-status-errors',
      attrs: { type: 'button', 'data-testid': 'error-count' },
    });
    this.errors.addEventListener('click', onNextError);
    this.errors.hidden = true;
    this.notice = el('span', {
      className: 'kl-status-notice',
      attrs: { 'data-testid': 'notice', role: 'status' },
    });
    // Always in sight: the figures are estimates; the cautions are one click away.
    const caution = el('button', {
      className: 'kl-status-caution',
      text: 'Estimates only — read the cautions',
      attrs: { type: 'button', 'data-testid': 'cautions' },
    });
    caution.addEventListener('click', onCautions);
    this.root = el('footer', { className: 'kl-status' }, [
      this.save,
      this.notice,
      el('span', { className: 'kl-spacer' }),
      this.errors,
      this.summary,
      caution,
    ]);
  }

  /** Say from now on that this tab saves a copy, not the workbook another tab has open. */
  copyMode(on: boolean): void {
    this.copy = on;
    this.save.classList.toggle('is-copy', on);
    if (on) this.save.textContent = 'Working on a copy';
  }

  saveStatus(s: AutosaveStatus): void {
    this.save.classList.remove('is-failed', 'is-pending');
    if (s.state === 'saved') {
      const at = new Date(s.savedAt).toLocaleTimeString();
      this.save.textContent = this.copy ? `Copy saved in this browser ${at}` : `Saved in this browser ${at}`;
      this.save.title = this.copy
        ? 'Another tab has this workbook open; this tab’s changes are kept apart as a copy (Workbook → Bring back a copy from another tab…). Save a file to keep it elsewhere.'
        : 'Every change is kept in this browser and restored when you come back. Save a file to keep a copy elsewhere.';
    } else if (s.state === 'failed') {
      this.save.classList.add('is-failed');
      this.save.textContent = 'NOT SAVED';
      this.save.title = s.message;
      this.show(s.message, 'error', 0);
    } else {
      this.save.classList.add('is-pending');
      this.save.textContent = s.state === 'saving' ? 'Saving…' : 'Changes not yet saved…';
    }
  }

  /** Sum, count and average of the numbers in the selection. */
  selection(values: readonly number[], cells: number): void {
    if (values.length < 2) {
      this.summary.textContent = cells > 1 ? `${cells} cells` : '';
      return;
    }
    const sum = values.reduce((a, b) => a + b, 0);
    this.summary.textContent = `sum ${formatGeneral(sum)} · mean ${formatGeneral(sum / values.length)} · ${values.length} numbers`;
  }

  errorCount(n: number): void {
    this.errors.hidden = n === 0;
    const text = `${n} cell${n === 1 ? '' : 's'} with errors — next ›`;
    // Only a real change touches the line (no flicker while values are recounted).
    if (this.errors.textContent !== text) this.errors.textContent = text;
    this.errors.title = 'Error cells in the whole workbook; click for the next one, on any sheet.';
  }

  /** A short message; errors stay until replaced (timeout 0). */
  show(text: string, kind: 'info' | 'error' = 'info', ms = 6000): void {
    this.notice.textContent = text;
    this.notice.classList.toggle('is-error', kind === 'error');
    if (this.noticeTimer) clearTimeout(this.noticeTimer);
    if (ms > 0) this.noticeTimer = setTimeout(() => (this.notice.textContent = ''), ms);
  }
}
