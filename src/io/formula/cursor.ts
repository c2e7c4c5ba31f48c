// Which function call, and which of its arguments, the cursor is in: for the formula bar's
// argument hint and autocomplete. Works on half-typed formulas.
import { tokenize } from './tokenize.ts';

export interface CallAtCursor {
  /** Function name in upper case, as typed (catalogue or not). */
  readonly name: string;
  /** 0-based index of the argument the cursor is in. */
  readonly argIndex: number;
}

type Frame = { kind: 'call'; name: string; argIndex: number } | { kind: 'group' } | { kind: 'array' };

/** The innermost call whose parentheses enclose `cursor` (an offset into `text`), if any. */
export function callAtCursor(text: string, cursor: number): CallAtCursor | undefined {
  const stack: Frame[] = [];
  let pendingName: string | undefined;
  for (const t of tokenize(text)) {
    if (t.end > cursor) break;
    const top = stack[stack.length - 1];
    switch (t.kind) {
      case 'func':
        pendingName = t.text.toUpperCase();
        continue;
      case 'lparen':
        stack.push(
          pendingName !== undefined ? { kind: 'call', name: pendingName, argIndex: 0 } : { kind: 'group' },
        );
        break;
      case 'lbrace':
        stack.push({ kind: 'array' });
        break;
      case 'rparen':
      case 'rbrace':
        stack.pop();
        break;
      case 'comma':
        if (top?.kind === 'call') top.argIndex++;
        break;
      default:
        break;
    }
    pendingName = undefined;
  }
  for (let i = stack.length - 1; i >= 0; i--) {
    const f = stack[i] as Frame;
    if (f.kind === 'call') return { name: f.name, argIndex: f.argIndex };
  }
  return undefined;
}
