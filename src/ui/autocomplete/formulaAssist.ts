// The typing help that floats under the cell editor or the formula bar: matching functions while
// a name is typed, then the signature with the argument in progress, its unit and allowed range.
import { clear, el } from '../dom.ts';
import {
  accept,
  nameAtCursor,
  signatureAtCursor,
  suggestions,
  type Signature,
  type Suggestion,
} from './suggest.ts';

type Field = HTMLInputElement | HTMLTextAreaElement;

export class FormulaAssist {
  readonly box: HTMLDivElement;
  private readonly list: HTMLUListElement;
  private readonly hint: HTMLDivElement;
  private field: Field | undefined;
  private items: Suggestion[] = [];
  private active = 0;
  private readonly attached = new WeakSet<Field>();

  constructor(
    private readonly standardNames: readonly string[],
    private readonly onTextChange?: (f: Field) => void,
  ) {
    this.list = el('ul', { className: 'kl-assist-list', attrs: { role: 'listbox' } });
    this.hint = el('div', { className: 'kl-assist-hint' });
    this.box = el('div', { className: 'kl-assist', attrs: { 'data-testid': 'assist' } }, [
      this.list,
      this.hint,
    ]);
    // Clicks inside keep the focus in the field being typed into.
    this.box.addEventListener('mousedown', (e) => e.preventDefault());
    this.box.hidden = true;
    document.body.append(this.box);
  }

  attach(field: Field): void {
    if (this.attached.has(field)) return;
    this.attached.add(field);
    const refresh = () => {
      this.field = field;
      this.update();
    };
    field.addEventListener('input', refresh);
    field.addEventListener('click', refresh);
    (field as HTMLElement).addEventListener('keyup', (e: KeyboardEvent) => {
      if (['ArrowLeft', 'ArrowRight', 'Home', 'End'].includes(e.key)) refresh();
    });
    field.addEventListener('blur', () => this.hide());
  }

  get isOpen(): boolean {
    return !this.box.hidden && this.items.length > 0;
  }

  /** Keys while the list is open: arrows choose, Tab or Enter accept, Escape closes. */
  handleKey(e: KeyboardEvent): boolean {
    if (!this.isOpen) return false;
    if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
      const n = this.items.length;
      this.active = (this.active + (e.key === 'ArrowDown' ? 1 : n - 1)) % n;
      this.renderList();
      return true;
    }
    if (e.key === 'Tab' || e.key === 'Enter') {
      this.choose(this.active);
      return true;
    }
    if (e.key === 'Escape') {
      this.items = [];
      this.update(false);
      return true;
    }
    return false;
  }

  /** Show the help for this field now (text was put into it by a command, not typed). */
  follow(field: Field): void {
    this.attach(field);
    this.field = field;
    this.update();
  }

  hide(): void {
    this.box.hidden = true;
    this.items = [];
  }

  update(withList = true): void {
    const f = this.field;
    if (!f || !f.isConnected) return this.hide();
    const cursor = f.selectionStart ?? f.value.length;
    const at = withList ? nameAtCursor(f.value, cursor) : undefined;
    this.items = at ? suggestions(at.prefix, this.standardNames) : [];
    if (this.items.length === 1 && at && this.items[0]?.name === at.prefix && f.value[at.end] === '(')
      this.items = [];
    this.active = Math.min(this.active, Math.max(0, this.items.length - 1));
    const sig = this.items.length ? undefined : signatureAtCursor(f.value, cursor);
    this.renderList();
    this.renderHint(sig);
    this.box.hidden = this.items.length === 0 && !sig;
    if (!this.box.hidden) this.place(f);
  }

  private choose(i: number): void {
    const f = this.field;
    const item = this.items[i];
    if (!f || !item) return;
    const at = nameAtCursor(f.value, f.selectionStart ?? f.value.length);
    if (!at) return;
    const next = accept(f.value, at, item.name);
    f.value = next.text;
    f.setSelectionRange(next.cursor, next.cursor);
    this.items = [];
    this.onTextChange?.(f);
    this.update();
  }

  private renderList(): void {
    clear(this.list);
    this.items.forEach((s, i) => {
      const li = el(
        'li',
        {
          className: `kl-assist-item${i === this.active ? ' is-active' : ''}${s.catalogue ? '' : ' is-standard'}`,
          attrs: { role: 'option' },
        },
        [
          el('span', { className: 'kl-assist-name', text: s.name }),
          el('span', { className: 'kl-assist-detail', text: s.detail }),
        ],
      );
      li.addEventListener('click', () => this.choose(i));
      this.list.append(li);
    });
    this.list.hidden = this.items.length === 0;
  }

  private renderHint(sig: Signature | undefined): void {
    clear(this.hint);
    this.hint.hidden = !sig;
    if (!sig) return;
    const line = el('div', { className: 'kl-sig' }, [
      el('span', { className: 'kl-sig-name', text: sig.spec.name }),
      '(',
    ]);
    sig.parts.forEach((p, i) => {
      if (i > 0) line.append(', ');
      line.append(el('span', { className: p.active ? 'kl-sig-arg is-active' : 'kl-sig-arg', text: p.text }));
    });
    line.append(')');
    if (sig.spec.result.unit && sig.spec.result.unit !== '1')
      line.append(el('span', { className: 'kl-sig-result', text: ` → ${sig.spec.result.unit}` }));
    this.hint.append(line);
    const cur = sig.current;
    if (cur) {
      const bits = [`${cur.param.name}: ${cur.param.doc}`, `allowed ${cur.range}`];
      if (cur.default !== undefined) bits.push(`optional, default ${cur.default}`);
      this.hint.append(el('div', { className: 'kl-sig-doc', text: bits.join(' · ') }));
    } else if (sig.argIndex >= sig.parts.length) {
      this.hint.append(
        el('div', {
          className: 'kl-sig-doc is-warn',
          text: `${sig.spec.name} takes at most ${sig.parts.length} arguments`,
        }),
      );
    } else {
      this.hint.append(el('div', { className: 'kl-sig-doc', text: sig.spec.summary }));
    }
  }

  private place(f: Field): void {
    const r = f.getBoundingClientRect();
    const below = r.bottom + 4;
    const h = this.box.offsetHeight || 160;
    const top = below + h > window.innerHeight && r.top - h - 4 > 0 ? r.top - h - 4 : below;
    this.box.style.left = `${Math.max(4, Math.min(r.left, window.innerWidth - this.box.offsetWidth - 8))}px`;
    this.box.style.top = `${top}px`;
  }
}
