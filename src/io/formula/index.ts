// The formula toolkit: tokenizer, parser, printer, expansion to plain formulas, cursor lookup.
export { tokenize, significantTokens, type Token, type TokenKind } from './tokenize.ts';
export { parseFormula, type ParseResult } from './parse.ts';
export { printNode, printFormula } from './print.ts';
export { isAtomic, type Node, type CallNode, type BinaryOp } from './ast.ts';
export { expandFormula, MAX_FORMULA_LENGTH, referencedFunctions, type ExpandResult } from './expand.ts';
export { callAtCursor, type CallAtCursor } from './cursor.ts';
export { commaSeparated, completeTypedFormula, type TypedFormula } from './entry.ts';
