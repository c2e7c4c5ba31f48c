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
