// The function reference panel's stand-in in the page's first download: the panel (search,
// detail, live examples) loads the first time it is shown.
import { el } from '../dom.ts';
import type { FunctionReference, ReferenceHost } from './functionReference.ts';

export class LazyReference {
  readonly root = el('div', { className: 'kl-panel-host' });
  private loading: Promise<FunctionReference> | undefined;

  constructor(private readonly host: ReferenceHost) {}

  /** Draw the detail again (examples are computed by the engine of the open workbook). */
  refresh(): void {
    this.loading ??= import('./functionReference.ts').then(({ FunctionReference }) => {
      const r = new FunctionReference(this.host);
      this.root.replaceChildren(r.root);
      return r;
    });
    this.loading
      .then((r) => r.refresh())
      .catch((e: unknown) =>
        this.root.replaceChildren(
          el('p', {
            className: 'kl-text-error',
            text: `The function reference could not be loaded: ${e instanceof Error ? e.message : String(e)}`,
          }),
        ),
      );
  }
}
