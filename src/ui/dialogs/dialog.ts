// Modal dialogs on the native <dialog> element: a title, content built from text nodes, and
// buttons. Confirm and prompt are small wrappers that resolve a promise.
import { el } from '../dom.ts';

export interface DialogAction {
  readonly label: string;
  readonly kind?: 'primary' | 'danger' | 'plain';
  /** Return false to keep the dialog open (e.g. a validation message was shown). */
  readonly run?: () => boolean | void | Promise<boolean | void>;
}

export interface OpenDialog {
  readonly dialog: HTMLDialogElement;
  close(): void;
}

export function openDialog(
  title: string,
  body: readonly Node[],
  actions: readonly DialogAction[],
  opts: { wide?: boolean; testId?: string; footer?: readonly Node[] } = {},
): OpenDialog {
  const dialog = el('dialog', {
    className: `kl-dialog${opts.wide ? ' is-wide' : ''}`,
    attrs: opts.testId ? { 'data-testid': opts.testId } : {},
  });
  const close = () => {
    if (dialog.open) dialog.close();
    dialog.remove();
  };
  const buttons = actions.map((a) => {
    const b = el('button', {
      className: `kl-btn kl-btn-${a.kind ?? 'plain'}`,
      text: a.label,
      attrs: { type: 'button' },
    });
    b.addEventListener('click', async () => {
      const keep = (await a.run?.()) === false;
      if (!keep) close();
    });
    return b;
  });
  dialog.append(
    el('header', { className: 'kl-dialog-head' }, [el('h2', { text: title })]),
    el('div', { className: 'kl-dialog-body' }, body),
    el('footer', { className: 'kl-dialog-actions' }, [...(opts.footer ?? []), ...buttons]),
  );
  dialog.addEventListener('cancel', () => dialog.remove());
  document.body.append(dialog);
  dialog.showModal();
  (buttons.find((_, i) => actions[i]?.kind === 'primary') ?? buttons[0])?.focus();
  return { dialog, close };
}

export function confirmDialog(
  title: string,
  lines: readonly string[],
  confirmLabel: string,
  danger = false,
): Promise<boolean> {
  return new Promise((resolve) => {
    const d = openDialog(
      title,
      lines.map((t) => el('p', { text: t })),
      [
        { label: 'Cancel', run: () => resolve(false) },
        { label: confirmLabel, kind: danger ? 'danger' : 'primary', run: () => resolve(true) },
      ],
      { testId: 'confirm' },
    );
    d.dialog.addEventListener('close', () => resolve(false));
  });
}

/** Ask for a text; `check` returns a message to show while the text is not acceptable. */
export function promptDialog(
  title: string,
  label: string,
  initial: string,
  check: (v: string) => string | undefined,
): Promise<string | undefined> {
  return new Promise((resolve) => {
    const input = el('input', {
      className: 'kl-input',
      attrs: { type: 'text', value: initial, 'aria-label': label, spellcheck: 'false' },
    });
    input.value = initial;
    const note = el('p', { className: 'kl-field-problem', attrs: { role: 'alert' } });
    const tryAccept = () => {
      const problem = check(input.value);
      note.textContent = problem ?? '';
      if (problem) return false;
      resolve(input.value);
      return true;
    };
    const d = openDialog(
      title,
      [el('label', { className: 'kl-field' }, [el('span', { text: label }), input]), note],
      [
        { label: 'Cancel', run: () => resolve(undefined) },
        { label: 'OK', kind: 'primary', run: tryAccept },
      ],
      { testId: 'prompt' },
    );
    input.addEventListener('input', () => (note.textContent = check(input.value) ?? ''));
    input.addEventListener('keydown', (e) => {
      if (e.key !== 'Enter') return;
      // The Enter ends here: the grid, listening again once the dialog closes, must not see it.
      e.preventDefault();
      e.stopPropagation();
      if (tryAccept()) d.close();
    });
    d.dialog.addEventListener('close', () => resolve(undefined));
    input.focus();
    input.select();
  });
}
