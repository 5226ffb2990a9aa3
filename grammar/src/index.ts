/** The netlist language: parsing, values, expressions, directives. Imports nothing but chevrotain. */
export * from './syntax-tree';
export * from './directive-records';
export { parseNetlist, type ParseOptions } from './parse-netlist';
export { listOffsetsAhead } from './reparse';
export { readNumber, spiceSpelling, type ReadNumber } from './values';
export { parseExpression, evaluateExpression, foldExpr, referencedNames, EXPRESSION_FUNCTIONS, MAX_EXPRESSION_DEPTH, type Expr, type ExprError } from './expression';
export { parseDirective } from './directives';
export { boundMessage, clipText, displayNumber, displayPercent, escapeControlChars, NO_NUMBER, QUOTE_MAX_CHARS } from './display';
export { detectForeignEncoding, type ForeignEncoding } from './encoding';
export { resolveParams, evaluateValue, type ParamDefinition, type Lookup, type ResolvedParams } from './params';
export { LineIndex, lineIndexOf, type Position } from './line-index';
