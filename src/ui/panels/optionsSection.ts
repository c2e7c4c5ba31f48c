// The design options side by side, at the foot of the Checks panel: asked for with a button
// (pricing and judging five designs takes a while on large sites), then kept up to date with the
// checks. One card per option; the figures are the core's, the same the CLI prints with
// `quote --compare`, and what the workbook shows once that option's banks are typed in.
import { clear, el } from '../dom.ts';

export class OptionsSection {
  readonly root: HTMLElement;
  /** Where the cards go (optionsView.ts fills it). */
  readonly body: HTMLElement;
  /** The user asked for the options: they are worked out with every run of the checks. */
  wanted = false;

  private readonly stale: HTMLElement;

  constructor(onAsk: () => void) {
    const redo = el('button', {
      className: 'kl-btn',
      text: 'Compare again',
      attrs: { type: 'button', 'data-testid': 'options-redo' },
    });
    this.stale = el('p', { className: 'kl-options-stale', attrs: { hidden: '' } }, [
      'The workbook changed since these options were worked out (on a site this large they are not redone after every edit). ',
      redo,
    ]);
    redo.addEventListener('click', () => {
      this.stale.hidden = true;
      onAsk();
    });
    this.body = el('div', { attrs: { 'data-testid': 'options-body' } });
    const ask = el('button', {
      className: 'kl-btn',
      text: 'Compare design options',
      attrs: { type: 'button', 'data-testid': 'options-compare' },
    });
    ask.addEventListener('click', () => {
      this.wanted = true;
      ask.remove();
      clear(this.body);
      this.body.append(el('p', { className: 'kl-muted', text: 'Pricing and judging each option…' }));
      onAsk();
    });
    this.root = el('section', { className: 'kl-options', attrs: { 'data-testid': 'options' } }, [
      el('h3', { text: 'Design options side by side' }),
      el('p', {
        className: 'kl-muted',
        text: 'The banks as the Compensation sheet holds them, the proposed design, plain capacitors, every bank detuned 7 %, and one bank at the point of connection, each priced at the Rates sheet, saved at the Tariff sheet and judged by the same rules.',
      }),
      ask,
      this.stale,
      this.body,
    ]);
  }

  /** The cards below no longer describe the workbook: say so and offer to redo them. */
  markStale(): void {
    this.stale.hidden = false;
  }
}
