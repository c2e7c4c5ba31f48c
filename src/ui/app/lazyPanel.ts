// A side panel whose code loads the first time it is shown (the charts, the site diagram), so
// the page's first download stays within its budget. Until then it keeps the session it is
// told about and its visibility, and hands both over once loaded.
import { el } from '../dom.ts';
import type { WorkbookSession } from '../model/session.ts';

export interface Panel {
  readonly root: HTMLElement;
  visible: boolean;
  update(session: WorkbookSession): void;
  draw(): void;
}

export class LazyPanel<T extends Panel> {
  readonly root: HTMLElement;
  private panel: T | undefined;
  private loading: Promise<T> | undefined;
  private session: WorkbookSession | undefined;
  private shown = false;

  constructor(
    private readonly load: () => Promise<T>,
    testId: string,
  ) {
    this.root = el('div', { className: 'kl-panel-host', attrs: { 'data-testid': testId } });
  }

  get visible(): boolean {
    return this.shown;
  }

  set visible(v: boolean) {
    this.shown = v;
    if (this.panel) this.panel.visible = v;
  }

  update(session: WorkbookSession): void {
    this.session = session;
    this.panel?.update(session);
  }

  /** Draw now (the panel was just shown), loading its code the first time. */
  draw(): void {
    if (this.panel) return this.panel.draw();
    this.loaded()
      .then((p) => p.draw())
      .catch((e: unknown) =>
        this.root.replaceChildren(
          el('p', {
            className: 'kl-text-error',
            text: `This panel could not be loaded: ${e instanceof Error ? e.message : String(e)}`,
          }),
        ),
      );
  }

  /** Run `fn` on the panel once it is loaded (at once when it is). */
  then(fn: (panel: T) => void): void {
    if (this.panel) fn(this.panel);
    else void this.loaded().then(fn);
  }

  private loaded(): Promise<T> {
    this.loading ??= this.load().then((p) => {
      p.visible = this.shown;
      if (this.session) p.update(this.session);
      this.root.replaceChildren(p.root);
      this.panel = p;
      return p;
    });
    return this.loading;
  }
}
