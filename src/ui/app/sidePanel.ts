// The panel on the right: the function reference, the charts, the checks or the site diagram, one
// at a time, or closed.
import { el } from '../dom.ts';

export type PanelName = 'functions' | 'charts' | 'checks' | 'diagram';

export class SidePanel {
  readonly root: HTMLElement;
  private readonly body: HTMLElement;
  private readonly title: HTMLElement;
  private current: PanelName | undefined;
  private readonly views = new Map<PanelName, { title: string; node: HTMLElement; onShow?: () => void }>();
  onToggle: (name: PanelName | undefined) => void = () => {};
  /** Set by the app: where the keyboard goes when the panel is closed with its × button. */
  onClosed: (click: Event) => void = () => {};

  constructor() {
    this.title = el('span', { className: 'kl-pane-title' });
    const close = el('button', {
      className: 'kl-icon-btn',
      text: '×',
      title: 'Close the panel',
      attrs: { type: 'button', 'aria-label': 'Close the panel' },
    });
    close.addEventListener('click', (e) => {
      this.toggle(undefined);
      this.onClosed(e);
    });
    this.body = el('div', { className: 'kl-side-body' });
    this.root = el('aside', { className: 'kl-side', attrs: { 'data-testid': 'side-panel' } }, [
      el('div', { className: 'kl-pane-head' }, [this.title, close]),
      this.body,
    ]);
    this.root.hidden = true;
  }

  add(name: PanelName, title: string, node: HTMLElement, onShow?: () => void): void {
    this.views.set(name, { title, node, ...(onShow ? { onShow } : {}) });
  }

  get shown(): PanelName | undefined {
    return this.current;
  }

  /** A wider panel (the diagram asks for it); back to the usual width when asked again. */
  toggleWide(): void {
    this.root.classList.toggle('is-wide');
  }

  toggle(name: PanelName | undefined): void {
    this.current = name === this.current ? undefined : name;
    if (this.current !== 'diagram') this.root.classList.remove('is-wide');
    const view = this.current ? this.views.get(this.current) : undefined;
    this.root.hidden = !view;
    if (view) {
      this.title.textContent = view.title;
      this.body.replaceChildren(view.node);
      view.onShow?.();
    }
    this.onToggle(this.current);
  }
}
