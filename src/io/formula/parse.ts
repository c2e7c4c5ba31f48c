// Formula parser: tokens to the small syntax tree in ast.ts, with the usual spreadsheet
// precedence (low to high): comparison, &, + -, * /, ^, unary sign, postfix %. Errors say what
// was found and at which character (1-based, counting the leading '=').
import type { BinaryOp, Node } from './ast.ts';
import { significantTokens, type ScanCounter, type Token } from './tokenize.ts';

export type ParseResult =
  | { readonly ok: true; readonly ast: Node }
  | { readonly ok: false; readonly message: string; readonly position: number };

class ParseError extends Error {
  constructor(
    message: string,
    readonly position: number,
  ) {
    super(message);
  }
}

const COMPARISON: readonly string[] = ['=', '<>', '<', '>', '<=', '>='];

/**
 * Deepest nesting of brackets, calls and signs read. The parser recurses per level, and far
 * deeper input would overflow the stack; spreadsheet programs stop at 64 nested calls.
 */
export const MAX_PARSE_DEPTH = 200;

function describe(t: Token): string {
  if (t.kind === 'string') return `text ${t.text.length > 20 ? t.text.slice(0, 20) + '…' : t.text}`;
  return `"${t.text}"`;
}

class Parser {
  private i = 0;
  private depth = 0;
  constructor(
    private readonly tokens: readonly Token[],
    private readonly length: number,
  ) {}

  private peek(): Token | undefined {
    return this.tokens[this.i];
  }
  private next(): Token {
    const t = this.tokens[this.i++];
    if (!t) throw this.endError('a value');
    return t;
  }
  private endError(expected: string): ParseError {
    return new ParseError(
      `the formula ends too early (after character ${this.length}); expected ${expected}`,
      this.length + 1,
    );
  }
  private unexpected(t: Token, expected: string): ParseError {
    if (t.kind === 'string' && t.unterminated)
      return new ParseError(
        `the text starting at character ${t.start + 1} has no closing quote (")`,
        t.start + 1,
      );
    if (t.kind === 'semicolon')
      return new ParseError(
        `";" at character ${t.start + 1} is not read here: arguments are separated by "," and decimals written with "." (as in spreadsheet programs set to English: SUM(1,2.5), not SUM(1;2,5))`,
        t.start + 1,
      );
    if (t.kind === 'unknown')
      return new ParseError(
        `${describe(t)} at character ${t.start + 1} is not part of any formula syntax`,
        t.start + 1,
      );
    return new ParseError(
      `unexpected ${describe(t)} at character ${t.start + 1}; expected ${expected}`,
      t.start + 1,
    );
  }
  private isOp(t: Token | undefined, ops: readonly string[]): boolean {
    return t !== undefined && t.kind === 'op' && ops.includes(t.text);
  }

  parseFormula(): Node {
    const first = this.peek();
    if (this.isOp(first, ['='])) this.i++;
    if (!this.peek()) throw this.endError('an expression');
    const ast = this.expression();
    const extra = this.peek();
    if (extra) throw this.unexpected(extra, 'an operator or the end of the formula');
    return ast;
  }

  private binaryLevel(ops: readonly string[], operand: () => Node): Node {
    let left = operand();
    while (this.isOp(this.peek(), ops)) {
      const op = this.next().text as BinaryOp;
      left = { type: 'binary', op, left, right: operand() };
    }
    return left;
  }

  private expression(): Node {
    this.enter();
    const n = this.binaryLevel(COMPARISON, () => this.concat());
    this.depth--;
    return n;
  }
  private enter(): void {
    if (++this.depth <= MAX_PARSE_DEPTH) return;
    const at = (this.peek()?.start ?? this.length) + 1;
    throw new ParseError(
      `the formula nests brackets, calls or signs more than ${MAX_PARSE_DEPTH} levels deep (at character ${at}); write inner parts into cells of their own`,
      at,
    );
  }
  private concat(): Node {
    return this.binaryLevel(['&'], () => this.additive());
  }
  private additive(): Node {
    return this.binaryLevel(['+', '-'], () => this.multiplicative());
  }
  private multiplicative(): Node {
    return this.binaryLevel(['*', '/'], () => this.power());
  }
  private power(): Node {
    return this.binaryLevel(['^'], () => this.unary());
  }
  private unary(): Node {
    const t = this.peek();
    if (this.isOp(t, ['-', '+'])) {
      this.i++;
      this.enter();
      const arg = this.unary();
      this.depth--;
      return { type: 'unary', op: (t as Token).text as '-' | '+', arg };
    }
    let n = this.primary();
    let percents = 0;
    while (this.isOp(this.peek(), ['%'])) {
      this.enter(); // each % wraps the value once more: a tree as deep as the signs
      percents++;
      this.i++;
      n = { type: 'percent', arg: n };
    }
    this.depth -= percents;
    return n;
  }

  private primary(): Node {
    const t = this.next();
    switch (t.kind) {
      case 'number':
        return { type: 'number', text: t.text };
      case 'string':
        if (t.unterminated) throw this.unexpected(t, 'a value');
        return { type: 'string', value: t.text.slice(1, -1).replace(/""/g, '"') };
      case 'bool':
        return { type: 'bool', value: t.text.toUpperCase() === 'TRUE' };
      case 'error':
        return { type: 'error', text: t.text.toUpperCase() };
      case 'ref':
        return { type: 'ref', text: t.text, range: t.text.includes(':') };
      case 'name':
        return { type: 'name', text: t.text };
      case 'func':
        return this.call(t);
      case 'lparen': {
        const inner = this.expression();
        this.close(t, 'rparen', ')');
        return { type: 'paren', inner };
      }
      case 'lbrace':
        return this.array(t);
      default:
        throw this.unexpected(t, 'a value');
    }
  }

  private close(open: Token, kind: 'rparen' | 'rbrace', text: string): void {
    const t = this.peek();
    if (!t) throw this.endError(`"${text}" to close the "${open.text}" at character ${open.start + 1}`);
    if (t.kind !== kind)
      throw this.unexpected(t, `"${text}" to close the "${open.text}" at character ${open.start + 1}`);
    this.i++;
  }

  private call(nameToken: Token): Node {
    const open = this.next(); // the tokenizer guarantees '(' follows a func token
    const args: (Node | null)[] = [];
    if (this.peek()?.kind === 'rparen') {
      this.i++;
      return { type: 'call', name: nameToken.text, args, at: nameToken.start + 1 };
    }
    for (;;) {
      const t = this.peek();
      if (!t)
        throw this.endError(
          `an argument or ")" to close "${nameToken.text}(" opened at character ${open.start + 1}`,
        );
      args.push(t.kind === 'comma' || t.kind === 'rparen' ? null : this.expression());
      const sep = this.peek();
      if (!sep)
        throw this.endError(`"," or ")" to close "${nameToken.text}(" opened at character ${open.start + 1}`);
      this.i++;
      if (sep.kind === 'rparen') return { type: 'call', name: nameToken.text, args, at: nameToken.start + 1 };
      if (sep.kind !== 'comma') {
        this.i--;
        throw this.unexpected(sep, `"," or ")" in the arguments of ${nameToken.text}`);
      }
    }
  }

  private array(open: Token): Node {
    this.enter();
    const rows: Node[][] = [[]];
    for (;;) {
      (rows[rows.length - 1] as Node[]).push(this.unary());
      const sep = this.peek();
      if (sep?.kind === 'comma') this.i++;
      else if (sep?.kind === 'semicolon') {
        this.i++;
        rows.push([]);
      } else {
        this.close(open, 'rbrace', '}');
        this.depth--;
        return { type: 'array', rows };
      }
    }
  }
}

/** Parse a formula, with or without its leading '='. Never throws. `counter` counts characters read. */
export function parseFormula(text: string, counter?: ScanCounter): ParseResult {
  try {
    return { ok: true, ast: new Parser(significantTokens(text, counter), text.length).parseFormula() };
  } catch (e) {
    if (e instanceof ParseError) return { ok: false, message: e.message, position: e.position };
    return {
      ok: false,
      message: `the formula could not be read: ${e instanceof Error ? e.message : String(e)}`,
      position: 1,
    };
  }
}
