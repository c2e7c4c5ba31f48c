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
// Sticky patterns, matched at an index of the whole text: no copy of the rest at every step,
// so long formulas tokenize in linear time.
const REF = new RegExp(
  String.raw`(?:${SHEET})?(?:${CELL}(?::(?:${SHEET})?${CELL})?|${COL}:${COL}|${ROW}:${ROW})${END}`,
  'y',
);
const NUMBER = /(?:[0-9]+(?:\.[0-9]*)?|\.[0-9]+)(?:[eE][+-]?[0-9]+)?/y;
const NAME = /[A-Za-z_\\][A-Za-z0-9_.]*/y;
const ERROR = /#(?:NULL!|DIV\/0!|VALUE!|REF!|NAME\?|NUM!|N\/A|SPILL!|CYCLE!|ERROR!|LIC!|GETTING_DATA)/iy;
const SPACE = /\s+/y;
const BOOL = /^(?:TRUE|FALSE)$/i;
const OPERATORS = ['<>', '<=', '>=', '+', '-', '*', '/', '^', '&', '=', '<', '>', '%'];
const SINGLE: Readonly<Record<string, TokenKind>> = {
  '(': 'lparen',
  ')': 'rparen',
  ',': 'comma',
  ';': 'semicolon',
  '{': 'lbrace',
  '}': 'rbrace',
};

/** Length of the match of a sticky pattern at `i`, or 0. */
function matchAt(re: RegExp, text: string, i: number): number {
  re.lastIndex = i;
  const m = re.exec(text);
  return m ? m[0].length : 0;
}

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
    const c = text[i] as string;
    let n: number;
    if (c === '"') {
      const s = readString(text, i);
      push('string', s.end, s.unterminated);
    } else if ((n = matchAt(SPACE, text, i))) push('space', i + n);
    else if (c === '#' && (n = matchAt(ERROR, text, i))) push('error', i + n);
    else if ((n = matchAt(REF, text, i))) push('ref', i + n);
    else if ((n = matchAt(NUMBER, text, i))) push('number', i + n);
    else if (c === "'") {
      // A quoted sheet name not followed by a valid reference: keep it together for the message.
      const close = text.indexOf("'", i + 1);
      push('unknown', close < 0 ? text.length : close + 1);
    } else if ((n = matchAt(NAME, text, i))) {
      const end = i + n;
      if (text[end] === '(') push('func', end);
      else push(BOOL.test(text.slice(i, end)) ? 'bool' : 'name', end);
    } else if (SINGLE[c]) push(SINGLE[c] as TokenKind, i + 1);
    else {
      const op = OPERATORS.find((o) => text.startsWith(o, i));
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
