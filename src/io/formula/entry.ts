// What a spreadsheet user expects when a typed formula is committed (Enter in the cell or the
// formula bar): brackets left open at the end are closed, and ';' between arguments (the habit
// where the decimal mark is a comma) is read as ','. A rewrite is kept only when the formula then
// reads; otherwise the text stays as typed and the parser's message says what is wrong.
import { parseFormula } from './parse.ts';
import { tokenize } from './tokenize.ts';

export interface TypedFormula {
  /** The text to store: as typed, or with the changes below. */
  readonly text: string;
  /** What was changed, in words, for a status line (empty when nothing was). */
  readonly changes: readonly string[];
}

const isFormula = (text: string) => text.trimStart().startsWith('=');
const unchanged = (text: string): TypedFormula => ({ text, changes: [] });

/**
 * The text with ';' between the arguments of calls written ','; undefined when there is none, or
 * when the formula has a ',' anywhere: then "F(1;0,9)" may mean 0.9 written the continental way,
 * and only the user knows. A ';' between the rows of an array ({1;2}) stays.
 */
function swapSemicolons(text: string): string | undefined {
  if (!text.includes(';')) return undefined;
  const tokens = tokenize(text);
  if (tokens.some((t) => t.kind === 'comma')) return undefined;
  const stack: Array<'call' | 'group' | 'array'> = [];
  const at: number[] = [];
  let afterFunc = false;
  for (const t of tokens) {
    if (t.kind === 'lparen') stack.push(afterFunc ? 'call' : 'group');
    else if (t.kind === 'lbrace') stack.push('array');
    else if (t.kind === 'rparen' || t.kind === 'rbrace') stack.pop();
    else if (t.kind === 'semicolon' && stack[stack.length - 1] === 'call') at.push(t.start);
    afterFunc = t.kind === 'func';
  }
  if (at.length === 0) return undefined;
  let out = '';
  let from = 0;
  for (const i of at) {
    out += text.slice(from, i) + ',';
    from = i + 1;
  }
  return out + text.slice(from);
}

/** The text with an open quote and open brackets closed at the end; undefined when none are open. */
function closeOpen(text: string): { text: string; change: string } | undefined {
  const tokens = tokenize(text);
  const open: string[] = [];
  for (const t of tokens) {
    if (t.kind === 'lparen') open.push(')');
    else if (t.kind === 'lbrace') open.push('}');
    else if ((t.kind === 'rparen' || t.kind === 'rbrace') && open.pop() !== t.text) return undefined;
  }
  const last = tokens[tokens.length - 1];
  const quote = last?.kind === 'string' && last.unterminated ? '"' : '';
  if (open.length === 0 && quote === '') return undefined;
  const brackets =
    open.length === 0 ? '' : open.length === 1 ? 'the open bracket' : `${open.length} open brackets`;
  const change = [quote ? 'the open quote' : '', brackets].filter(Boolean).join(' and ') + ' closed';
  return { text: text.trimEnd() + quote + open.reverse().join(''), change };
}

/** ';' between arguments read as ',' (the command line's eval uses this alone). */
export function commaSeparated(text: string): TypedFormula {
  if (!isFormula(text) || parseFormula(text).ok) return unchanged(text);
  const out = swapSemicolons(text);
  return out !== undefined && parseFormula(out).ok
    ? { text: out, changes: ['";" between arguments read as ","'] }
    : unchanged(text);
}

/**
 * What a typed formula becomes when it is committed: ';' between arguments read as ',', then what
 * is left open at the end closed ("=SUM(A1,KVAR.LOAD(50;0.9" → "=SUM(A1,KVAR.LOAD(50,0.9))").
 * Text that is not a formula, or a formula that reads already, is returned as typed.
 */
export function completeTypedFormula(text: string): TypedFormula {
  if (!isFormula(text) || parseFormula(text).ok) return unchanged(text);
  let out = text;
  const changes: string[] = [];
  const swapped = swapSemicolons(out);
  if (swapped !== undefined) {
    out = swapped;
    changes.push('";" between arguments read as ","');
  }
  const closed = closeOpen(out);
  if (closed) {
    out = closed.text;
    changes.push(closed.change);
  }
  return changes.length > 0 && parseFormula(out).ok ? { text: out, changes } : unchanged(text);
}
