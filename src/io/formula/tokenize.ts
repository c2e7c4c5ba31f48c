// Formula tokenizer. Tolerant: it never throws and always covers the whole text, so the formula
// bar can use it on half-typed input (an unterminated string, an unknown character) and the
// parser reports such problems with their position.
import { errorLiteral, name, number, reference, Scanner, spaces, type ScanCounter } from './scan.ts';

export type { ScanCounter } from './scan.ts';

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

/**
 * Split formula text into tokens, whitespace included (kind 'space'). Linear in the length of
 * the text: the scanners (scan.ts) read forward only, and what one of them reads without
 * matching is read again at most once by the scanner that takes it. `counter`, when given,
 * counts every character read (for tests).
 */
export function tokenize(text: string, counter?: ScanCounter): Token[] {
  const s = new Scanner(text, counter);
  const out: Token[] = [];
  let i = 0;
  const push = (kind: TokenKind, end: number, unterminated = false): void => {
    out.push({ kind, text: text.slice(i, end), start: i, end, ...(unterminated ? { unterminated } : {}) });
    i = end;
  };
  while (i < text.length) {
    const c = s.at(i);
    let n: number;
    if (c === '"') {
      const q = s.quoted(i, '"');
      push('string', q.end, !q.closed);
    } else if ((n = spaces(s, i)) > i) push('space', n);
    else if (c === '#' && (n = errorLiteral(s, i)) > 0) push('error', n);
    else if ((n = reference(s, i)) > 0) push('ref', n);
    else if ((n = number(s, i)) > 0) push('number', n);
    else if (c === "'") {
      // A quoted sheet name not followed by a valid reference: kept whole for the message.
      push('unknown', s.quoted(i, "'").end);
    } else if ((n = name(s, i)) > 0) {
      if (s.at(n) === '(') push('func', n);
      else push(BOOL.test(text.slice(i, n)) ? 'bool' : 'name', n);
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
export function significantTokens(text: string, counter?: ScanCounter): Token[] {
  return tokenize(text, counter).filter((t) => t.kind !== 'space');
}
