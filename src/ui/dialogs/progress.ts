// Long work (opening a large file, importing, exporting) in steps, with a dialog that says what
// is happening and a Cancel button. Work is cut into steps; between steps the page repaints
// and a click on Cancel is seen. A step that is already running finishes, then the work stops
// and nothing it made is used: the open workbook stays as it was.
import { el } from '../dom.ts';

export class Cancelled extends Error {
  constructor() {
    super('cancelled');
  }
}

export interface Task {
  readonly signal: AbortSignal;
  /** Say what comes next (with how far along, 0..1, when known), let the page breathe, stop if cancelled. */
  step(text: string, fraction?: number): Promise<void>;
}

/** Let the page repaint and handle input (a Cancel click) before the next step. */
function breathe(): Promise<void> {
  return new Promise((resolve) => {
    if (typeof requestAnimationFrame === 'function') requestAnimationFrame(() => setTimeout(resolve, 0));
    else setTimeout(resolve, 0);
  });
}

/**
 * Run `work` with a progress dialog; undefined when the user cancelled. The dialog shows at
 * once (or after `showAfterMs`), before the first step's work starts, so Cancel is there to
 * click while a long step runs.
 */
export async function withProgress<T>(
  title: string,
  work: (task: Task) => Promise<T>,
  opts: { showAfterMs?: number } = {},
): Promise<T | undefined> {
  const controller = new AbortController();
  const text = el('p', { className: 'kl-progress-step', attrs: { 'data-testid': 'progress-step' } });
  const bar = el('progress', { className: 'kl-progress-bar', attrs: { max: '1' } });
  const cancel = el('button', {
    className: 'kl-btn',
    text: 'Cancel',
    attrs: { type: 'button', 'data-testid': 'progress-cancel' },
  });
  const dialog = el('dialog', { className: 'kl-dialog kl-progress', attrs: { 'data-testid': 'progress' } }, [
    el('header', { className: 'kl-dialog-head' }, [el('h2', { text: title })]),
    el('div', { className: 'kl-dialog-body' }, [
      text,
      bar,
      el('p', {
        className: 'kl-muted',
        text: 'Cancel stops after the step under way; the open workbook stays as it is.',
      }),
    ]),
    el('footer', { className: 'kl-dialog-actions' }, [cancel]),
  ]);
  cancel.addEventListener('click', () => {
    controller.abort();
    cancel.disabled = true;
    text.textContent = 'Cancelling after this step…';
  });
  // Escape cancels too, instead of only hiding the dialog.
  dialog.addEventListener('cancel', (e) => {
    e.preventDefault();
    cancel.click();
  });
  const timer = setTimeout(() => {
    document.body.append(dialog);
    dialog.showModal();
    cancel.focus();
  }, opts.showAfterMs ?? 0);
  const task: Task = {
    signal: controller.signal,
    async step(what: string, fraction?: number) {
      if (controller.signal.aborted) throw new Cancelled();
      text.textContent = what;
      if (fraction === undefined) bar.removeAttribute('value');
      else bar.value = Math.max(0, Math.min(1, fraction));
      await breathe();
      if (controller.signal.aborted) throw new Cancelled();
    },
  };
  try {
    const result = await work(task);
    return controller.signal.aborted ? undefined : result;
  } catch (e) {
    if (e instanceof Cancelled) return undefined;
    throw e;
  } finally {
    clearTimeout(timer);
    if (dialog.open) dialog.close();
    dialog.remove();
  }
}
