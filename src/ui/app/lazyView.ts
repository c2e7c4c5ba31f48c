// A side-panel view whose code loads the first time it is shown, so the first download of the
// page stays within its budget: a container now, the view inside it once its module arrived.
import { el } from '../dom.ts';

export interface LazyView {
  readonly root: HTMLElement;
  show(): void;
}

export function lazyView<T extends { readonly root: HTMLElement }>(
  load: () => Promise<T>,
  ready: (view: T) => void,
  onShow: (view: T) => void,
): LazyView {
  const root = el('div', { className: 'kl-lazy-view' }, [
    el('p', { className: 'kl-muted', text: 'Loading…' }),
  ]);
  let view: T | undefined;
  let loading: Promise<void> | undefined;
  return {
    root,
    show() {
      if (view) return onShow(view);
      loading ??= load().then(
        (v) => {
          view = v;
          root.replaceChildren(v.root);
          ready(v);
          onShow(v);
        },
        (e: unknown) => {
          loading = undefined;
          root.replaceChildren(
            el('p', {
              className: 'kl-check is-error',
              text: `The panel could not be loaded (${e instanceof Error ? e.message : String(e)}); try again.`,
            }),
          );
        },
      );
    },
  };
}
