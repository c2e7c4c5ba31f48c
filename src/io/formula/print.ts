// Printing a syntax tree back to formula text (without the leading '='). Literals and
// references come out as written; whitespace is not kept.
import type { Node } from './ast.ts';

export function printNode(n: Node): string {
  switch (n.type) {
    case 'number':
    case 'error':
    case 'ref':
    case 'name':
      return n.text;
    case 'string':
      return `"${n.value.replace(/"/g, '""')}"`;
    case 'bool':
      return n.value ? 'TRUE' : 'FALSE';
    case 'unary':
      return n.op + printNode(n.arg);
    case 'percent':
      return printNode(n.arg) + '%';
    case 'binary':
      return printNode(n.left) + n.op + printNode(n.right);
    case 'paren':
      return `(${printNode(n.inner)})`;
    case 'call':
      return `${n.name}(${n.args.map((a) => (a ? printNode(a) : '')).join(',')})`;
    case 'array':
      return `{${n.rows.map((r) => r.map(printNode).join(',')).join(';')}}`;
  }
}

/** The formula text of a tree, starting with '='. */
export function printFormula(n: Node): string {
  return '=' + printNode(n);
}

/** Thrown inside printNodeWithin when the text passes its limit. */
class TooLong extends Error {}

/**
 * The text of a tree, or undefined when it would be longer than `max` characters. The tree may
 * share subtrees (an expansion repeats an argument); printing stops at the limit, so the work
 * is bounded by it however often they repeat. `counter.nodes` counts the nodes printed.
 */
export function printNodeWithin(n: Node, max: number, counter?: { nodes: number }): string | undefined {
  const parts: string[] = [];
  let length = 0;
  const put = (t: string) => {
    length += t.length;
    if (length > max) throw new TooLong();
    parts.push(t);
  };
  const go = (x: Node): void => {
    if (counter) counter.nodes++;
    switch (x.type) {
      case 'number':
      case 'error':
      case 'ref':
      case 'name':
        return put(x.text);
      case 'string':
        return put(`"${x.value.replace(/"/g, '""')}"`);
      case 'bool':
        return put(x.value ? 'TRUE' : 'FALSE');
      case 'unary':
        put(x.op);
        return go(x.arg);
      case 'percent':
        go(x.arg);
        return put('%');
      case 'binary':
        go(x.left);
        put(x.op);
        return go(x.right);
      case 'paren':
        put('(');
        go(x.inner);
        return put(')');
      case 'call':
        put(`${x.name}(`);
        x.args.forEach((a, i) => {
          if (i > 0) put(',');
          if (a) go(a);
        });
        return put(')');
      case 'array':
        put('{');
        x.rows.forEach((r, i) => {
          if (i > 0) put(';');
          r.forEach((c, j) => {
            if (j > 0) put(',');
            go(c);
          });
        });
        return put('}');
    }
  };
  try {
    go(n);
  } catch (e) {
    if (e instanceof TooLong) return undefined;
    throw e;
  }
  return parts.join('');
}
