// The design options side by side, at the foot of the Checks panel: asked for with a button
// (pricing and judging five designs takes a while on large sites), then kept up to date with the
// checks. The cards and their wording load with the figures (optionsView.ts): only the button is
// in the first download.
import { clear, el } from '../dom.ts';

export class OptionsSection {
  readonly root: HTMLElement;
  /** Where the heading and cards go (optionsView.ts fills it). */
  readonly body: HTMLElement;
  /** Where the out-of-date notice goes (optionsView.ts fills it). */
  readonly stale: HTMLElement;
  /** The user asked for the options: they are worked out with every run of the checks. */
  wanted = false;

  constructor(ask: () => void) {
    this.body = el('div', { attrs: { 'data-testid': 'options-body' } });
    this.stale = el('div');
    const button = el('button', {
      className: 'kl-btn',
      text: 'Compare design options',
      attrs: { type: 'button', 'data-testid': 'options-compare' },
    });
    button.addEventListener('click', () => {
      this.wanted = true;
      button.remove();
      clear(this.body);
      this.body.append(el('p', { className: 'kl-muted', text: 'Pricing and judging each option…' }));
      ask();
    });
    this.root = el('section', { className: 'kl-options', attrs: { 'data-testid': 'options' } }, [
      button,
      this.stale,
      this.body,
    ]);
  }
}
