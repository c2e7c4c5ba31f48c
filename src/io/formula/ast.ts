// The small syntax tree of a formula: enough to find and rewrite function calls and to print
// the formula back. Literal texts are kept as written so printing does not reformat numbers.

export type BinaryOp = '+' | '-' | '*' | '/' | '^' | '&' | '=' | '<>' | '<' | '>' | '<=' | '>=';

export type Node =
  | { readonly type: 'number'; readonly text: string }
  | { readonly type: 'string'; readonly value: string }
  | { readonly type: 'bool'; readonly value: boolean }
  | { readonly type: 'error'; readonly text: string }
  /** A cell or range reference, exactly as written (may carry a sheet name and '$'). */
  | { readonly type: 'ref'; readonly text: string; readonly range: boolean }
  | { readonly type: 'name'; readonly text: string }
  | { readonly type: 'unary'; readonly op: '-' | '+'; readonly arg: Node }
  | { readonly type: 'percent'; readonly arg: Node }
  | { readonly type: 'binary'; readonly op: BinaryOp; readonly left: Node; readonly right: Node }
  | { readonly type: 'paren'; readonly inner: Node }
  /**
   * A function call; `null` stands for an omitted argument as in F(1,,3). `at` is the 1-based
   * character of the name in the source formula (absent for calls built by a rewrite).
   */
  | {
      readonly type: 'call';
      readonly name: string;
      readonly args: readonly (Node | null)[];
      readonly at?: number;
    }
  | { readonly type: 'array'; readonly rows: readonly (readonly Node[])[] };

export type CallNode = Extract<Node, { type: 'call' }>;

/**
 * An atomic node can stand as an operand anywhere without parentheses. A negative number is a
 * unary minus and so is not atomic: "-2^2" differs between programs.
 */
export function isAtomic(n: Node): boolean {
  return n.type !== 'unary' && n.type !== 'binary' && n.type !== 'percent';
}
