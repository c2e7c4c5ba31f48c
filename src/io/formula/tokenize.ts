// Formula tokenizer. Tolerant: it never throws and always covers the whole text, so the formula
// bar can use it on half-typed input (an unterminated string, an unknown character) and the
// parser reports such problems with their position.

export type TokenKind =
  | 'number' // 12, 0.5, 1e-3
  | 'string' // "text" with "" for a quote
  | 'bool' // TRUE, FALSE
  | 'error' // #N/A, #DIV/0! ...
  | 'ref' // A1, $B$2, Sheet1!C3, 'My sheet'!A1:B4, A:C, 1:3
  | 'func' // a name directly followed by '('
  | 'name' // any other name (a named expression)
  | 'op' // + - * / ^ & = <> < > <= >= %
  | 'lparen'
  | 'rparen'
  | 'comma'
  | 'semicolon'
  | 'lbrace'
  | 'rbrace'
  | 'space'
  | 'unknown';

export interface Token {
  readonly kind: TokenKind;
  /** The exact source text of the token. */
  readonly text: string;
  /** Offset of the first character in the formula (0-based). */
  readonly start: number;
  readonly end: number;
  /** A string literal that runs to the end of the text without its closing quote. */
  readonly unterminated?: boolean;
}

const SHEET = String.raw`(?:'(?:[^']|'')+'|[A-Za-z_][A-Za-z0-9_.]*)!`;
const CELL = String.raw`\$?[A-Za-z]{1,3}\$?[0-9]+`;
const COL = String.raw`\$?[A-Za-z]{1,3}`;
const ROW = String.raw`\$?[0-9]+`;
/** A reference must not run on into a name, a call or a number. */
const END = String.raw`(?![A-Za-z0-9_.(!])`;
const REF = new RegExp(
  String.raw`^(?:${SHEET})?(?:${CELL}(?::(?:${SHEET})?${CELL})?|${COL}:${COL}|${ROW}:${ROW})${END}`,
);
const NUMBER = /^(?:[0-9]+(?:\.[0-9]*)?|\.[0-9]+)(?:[eE][+-]?[0-9]+)?/;
const NAME = /^[A-Za-z_\\][A-Za-z0-9_.]*/;
const ERROR = /^#(?:NULL!|DIV\/0!|VALUE!|REF!|NAME\?|NUM!|N\/A|SPILL!|CYCLE!|ERROR!|LIC!|GETTING_DATA)/i;
const SPACE = /^\s+/;
const OPERATORS = ['<>', '<=', '>=', '+', '-', '*', '/', '^', '&', '=', '<', '>', '%'];
const SINGLE: Readonly<Record<string, TokenKind>> = {
  '(': 'lparen',
  ')': 'rparen',
  ',': 'comma',
  ';': 'semicolon',
  '{': 'lbrace',
  '}': 'rbrace',
};

/** Read a string literal starting at `i` (a double quote). */
function readString(text: string, i: number): { end: number; unterminated: boolean } {
  let j = i + 1;
  while (j < text.length) {
    if (text[j] === '"') {
      if (text[j + 1] === '"') j += 2;
      else return { end: j + 1, unterminated: false };
    } else j++;
  }
  return { end: text.length, unterminated: true };
}

/** Split formula text into tokens, whitespace included (kind 'space'). */
export function tokenize(text: string): Token[] {
  const out: Token[] = [];
  let i = 0;
  const push = (kind: TokenKind, end: number, unterminated = false): void => {
    out.push({ kind, text: text.slice(i, end), start: i, end, ...(unterminated ? { unterminated } : {}) });
    i = end;
  };
  while (i < text.length) {
    const rest = text.slice(i);
    const c = rest[0] as string;
    let m: RegExpExecArray | null;
    if (c === '"') {
      const s = readString(text, i);
      push('string', s.end, s.unterminated);
    } else if ((m = SPACE.exec(rest))) push('space', i + m[0].length);
    else if ((m = ERROR.exec(rest))) push('error', i + m[0].length);
    else if ((m = REF.exec(rest))) push('ref', i + m[0].length);
    else if ((m = NUMBER.exec(rest))) push('number', i + m[0].length);
    else if (c === "'") {
      // A quoted sheet name not followed by a valid reference: keep it together for the message.
      const close = text.indexOf("'", i + 1);
      push('unknown', close < 0 ? text.length : close + 1);
    } else if ((m = NAME.exec(rest))) {
      const word = m[0];
      const end = i + word.length;
      if (text[end] === '(') push('func', end);
      else push(/^(TRUE|FALSE)$/i.test(word) ? 'bool' : 'name', end);
    } else if (SINGLE[c]) push(SINGLE[c] as TokenKind, i + 1);
    else {
      const op = OPERATORS.find((o) => rest.startsWith(o));
      if (op) push('op', i + op.length);
      else push('unknown', i + 1);
    }
  }
  return out;
}

/** Tokens without whitespace. */
export function significantTokens(text: string): Token[] {
  return tokenize(text).filter((t) => t.kind !== 'space');
}

// The formula bar finds the call under the cursor from these tokens (see cursor.ts).
export { callAtCursor, type CallAtCursor } from './cursor.ts';
