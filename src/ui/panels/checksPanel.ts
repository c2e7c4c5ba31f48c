// The Checks panel: input problems and compensation findings, most severe first, each saying
// where. Recomputed a moment after the last change while visible (reading the site back and
// designing takes a while on large sites, so it never runs on every keystroke).
import { clear, el } from '../dom.ts';
import { columnLetters } from '../model/address.ts';
import type { WorkbookSession } from '../model/session.ts';
import type { CheckItem, CheckTarget, ChecksReport } from './checksModel.ts';
import { OptionsSection } from './optionsSection.ts';

const QUIET_MS = 600;

export class ChecksPanel {
  readonly root: HTMLElement;
  private readonly body: HTMLElement;
  private session: WorkbookSession | undefined;
  private timer: ReturnType<typeof setTimeout> | undefined;
  private dirty = true;
  private readonly options: OptionsSection;
  /** The site was small enough for the options to follow every edit. */
  private optionsFollow = true;
  visible = false;
  /** Set by the app: select the cell an item concerns. */
  onJump: (target: CheckTarget) => void = () => {};

  constructor() {
    this.body = el('div', { className: 'kl-checks-body' });
    this.options = new OptionsSection(() => void this.drawOptions());
    this.root = el('section', { className: 'kl-checks', attrs: { 'data-testid': 'checks' } }, [
      el('p', {
        className: 'kl-muted',
        text: 'Input problems and cells typed over formulas, then the findings for the banks on the Compensation sheet: capacitor voltage, resonance, voltage rise, and the requirement after compensation in every case.',
      }),
      this.body,
      this.options.root,
    ]);
  }

  update(session: WorkbookSession): void {
    this.session = session;
    this.dirty = true;
    if (!this.visible) return;
    if (this.timer) clearTimeout(this.timer);
    this.timer = setTimeout(() => void this.draw(), QUIET_MS);
  }

  /** Run the checks (their code, the compensation rules, loads on first use) and show them. */
  async draw(): Promise<void> {
    this.timer = undefined;
    if (!this.session || !this.dirty) return;
    this.dirty = false;
    const doc = this.session.toDoc();
    // The checks (reading the site back, the rules, the compensation design) load the first
    // time they run, keeping them out of the page's first download.
    void import('./checksModel.ts')
      .then(({ collectChecks }) => this.render(collectChecks(doc)))
      .then(() => this.afterChecks())
      .catch((e: unknown) => {
        clear(this.body);
        this.body.append(
          el('p', {
            className: 'kl-check is-error',
            text: `The checks could not run: ${e instanceof Error ? e.message : String(e)}`,
          }),
        );
      });
  }

  /**
   * The options follow the checks on sites small enough (OPTIONS_UNASKED_MAX_ROWS, docOptions.ts);
   * on a larger one they are marked out of date instead, with a button to redo them, so that an
   * edit never waits for five designs.
   */
  private afterChecks(): Promise<void> | undefined {
    if (!this.options.wanted) return undefined;
    if (this.optionsFollow) return this.drawOptions();
    return import('./optionsView.ts').then(({ renderStale }) =>
      renderStale(this.options.stale, () => void this.drawOptions()),
    );
  }

  /** The design options for the workbook as it is now (their code loads on first use). */
  private async drawOptions(): Promise<void> {
    if (!this.session) return;
    const doc = this.session.toDoc();
    const [{ optionsOfDoc }, { renderOptions }] = await Promise.all([
      import('../../core/options/index.ts'),
      import('./optionsView.ts'),
    ]);
    const report = optionsOfDoc(doc);
    this.optionsFollow = report.unasked;
    renderOptions(this.options.body, report);
  }

  private render(r: ChecksReport): void {
    clear(this.body);
    const { error, warning, info } = r.counts;
    this.body.append(
      el('p', {
        className: 'kl-checks-summary',
        attrs: { 'data-testid': 'checks-summary' },
        text: `${error} error${error === 1 ? '' : 's'}, ${warning} warning${warning === 1 ? '' : 's'}, ${info} note${info === 1 ? '' : 's'}`,
      }),
    );
    if (r.items.length === 0 && !r.designSkipped)
      this.body.append(el('p', { className: 'kl-muted', text: 'Nothing to report for these inputs.' }));
    const list = el(
      'ul',
      { className: 'kl-check-list' },
      r.items.map((i) => this.item(i)),
    );
    this.body.append(list);
    if (r.designSkipped) this.body.append(el('p', { className: 'kl-muted', text: r.designSkipped }));
  }

  private item(i: CheckItem): HTMLElement {
    const where = el('span', { className: 'kl-check-where', text: i.where || 'site' });
    const li = el('li', { className: `kl-check is-${i.severity}`, attrs: { 'data-severity': i.severity } }, [
      el('span', { className: 'kl-check-sev', text: i.severity }),
      where,
      el('span', { className: 'kl-check-text', text: i.text }),
    ]);
    const target = i.target;
    if (target) {
      const go = el('button', {
        className: 'kl-link-btn',
        text: 'show',
        title: `Go to ${target.sheet} row ${target.row}${target.col !== undefined ? `, column ${columnLetters(target.col)}` : ''}`,
        attrs: { type: 'button' },
      });
      go.addEventListener('click', () => this.onJump(target));
      li.append(go);
    }
    return li;
  }
}
