/**
 * The expression language of `{…}` and `'…'` values: numbers (with SPICE suffixes), parameter
 * names, `+ - * / ^` (also `**`), parentheses and a fixed set of functions. Parsed by our own
 * precedence-climbing parser and evaluated by walking the tree: netlist text is never executed.
 */
import { readNumber } from './values';

export type Expr =
  | { type: 'number'; value: number; start: number; end: number }
  | { type: 'ref'; name: string; start: number; end: number }
  | { type: 'unary'; op: '-' | '+'; arg: Expr; start: number; end: number }
  | { type: 'binary'; op: '+' | '-' | '*' | '/' | '^'; left: Expr; right: Expr; start: number; end: number }
  | { type: 'call'; name: string; args: Expr[]; start: number; end: number };

export interface ExprError {
  message: string;
  start: number;
  end: number;
}

/** Deeper nesting than this, of the parse or of the tree, is refused rather than risking the stack. */
export const MAX_EXPRESSION_DEPTH = 200;

const FUNCTIONS: Readonly<Record<string, { arity: number; apply: (...a: number[]) => number }>> = {
  sqrt: { arity: 1, apply: Math.sqrt },
  exp: { arity: 1, apply: Math.exp },
  ln: { arity: 1, apply: Math.log },
  log: { arity: 1, apply: Math.log },
  log10: { arity: 1, apply: Math.log10 },
  abs: { arity: 1, apply: Math.abs },
  min: { arity: 2, apply: Math.min },
  max: { arity: 2, apply: Math.max },
  pow: { arity: 2, apply: Math.pow },
};

/** Names of the functions expressions may call. */
export const EXPRESSION_FUNCTIONS: readonly string[] = Object.keys(FUNCTIONS);

interface Lexeme {
  kind: 'num' | 'id' | 'op' | 'end';
  text: string;
  start: number;
  end: number;
  value?: number;
}

const LEXEME = /\s*(?:((?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?[a-zA-Zµμ]*)|([A-Za-z_][\w.]*)|(\*\*|[-+*/^(),]))/y;

const TRAILING_BLANKS = /\s*$/y;

function lex(text: string, base: number): Lexeme[] | ExprError {
  const out: Lexeme[] = [];
  LEXEME.lastIndex = 0;
  let at = 0;
  while (at < text.length) {
    LEXEME.lastIndex = at;
    const m = LEXEME.exec(text);
    if (!m) {
      // Only blanks left is the end; testing for that here, not before every lexeme, keeps lexing linear.
      TRAILING_BLANKS.lastIndex = at;
      if (TRAILING_BLANKS.test(text)) break;
      const bad = at + (text.slice(at).length - text.slice(at).trimStart().length);
      return { message: `unexpected '${text.charAt(bad)}' in expression`, start: base + bad, end: base + bad + 1 };
    }
    const tokenText = m[1] ?? m[2] ?? m[3]!;
    const start = base + m.index + m[0].length - tokenText.length;
    const lexeme: Lexeme = { kind: m[1] ? 'num' : m[2] ? 'id' : 'op', text: tokenText, start, end: start + tokenText.length };
    if (m[1]) lexeme.value = readNumber(tokenText)?.value ?? Number.NaN;
    out.push(lexeme);
    at = LEXEME.lastIndex;
  }
  out.push({ kind: 'end', text: '', start: base + text.length, end: base + text.length });
  return out;
}

const BINARY_PRECEDENCE: Readonly<Record<string, number>> = { '+': 1, '-': 1, '*': 2, '/': 2, '^': 4, '**': 4 };

/** Parses expression text that starts at offset `base` of the document. */
export function parseExpression(text: string, base = 0): { expr?: Expr; error?: ExprError } {
  const lexemes = lex(text, base);
  if (!Array.isArray(lexemes)) return { error: lexemes };
  const parser = new ExprParser(lexemes);
  try {
    const expr = parser.parseBinary(0, 0);
    parser.expectEnd();
    // A left-associated chain (1+1+…) parses in a loop, yet its tree is as deep as it is long; a tree
    // that deep cannot be copied to a worker or written as JSON, so it is refused like deep nesting.
    if (treeDepth(expr) > MAX_EXPRESSION_DEPTH) {
      return { error: { message: `expression nested deeper than ${MAX_EXPRESSION_DEPTH} levels (each operator of a chain such as 1+1+… is one level); split it over several .param lines`, start: expr.start, end: expr.end } };
    }
    return { expr };
  } catch (thrown) {
    if (thrown instanceof ExprSyntaxError) return { error: thrown.detail };
    throw thrown;
  }
}

class ExprSyntaxError extends Error {
  constructor(readonly detail: ExprError) {
    super(detail.message);
  }
}

class ExprParser {
  private at = 0;
  constructor(private readonly lexemes: Lexeme[]) {}

  private peek(): Lexeme {
    return this.lexemes[this.at]!;
  }

  private fail(message: string, lexeme = this.peek()): never {
    throw new ExprSyntaxError({ message, start: lexeme.start, end: Math.max(lexeme.end, lexeme.start + 1) });
  }

  expectEnd(): void {
    const next = this.peek();
    if (next.kind !== 'end') this.fail(`unexpected '${next.text}' in expression`);
  }

  parseBinary(minPrecedence: number, depth: number): Expr {
    if (depth > MAX_EXPRESSION_DEPTH) this.fail(`expression nested deeper than ${MAX_EXPRESSION_DEPTH} levels`);
    let left = this.parseUnary(depth);
    for (;;) {
      const op = this.peek();
      const precedence = op.kind === 'op' ? BINARY_PRECEDENCE[op.text] : undefined;
      if (precedence === undefined || precedence < minPrecedence) return left;
      this.at++;
      const rightAssociative = op.text === '^' || op.text === '**';
      const right = this.parseBinary(rightAssociative ? precedence : precedence + 1, depth + 1);
      const symbol = (op.text === '**' ? '^' : op.text) as '+' | '-' | '*' | '/' | '^';
      left = { type: 'binary', op: symbol, left, right, start: left.start, end: right.end };
    }
  }

  private parseUnary(depth: number): Expr {
    const next = this.peek();
    if (next.kind === 'op' && (next.text === '-' || next.text === '+')) {
      this.at++;
      // Unary minus binds looser than ^ so that -2^2 = -4, as in ordinary notation.
      const arg = this.parseBinary(3, depth + 1);
      return { type: 'unary', op: next.text, arg, start: next.start, end: arg.end };
    }
    return this.parsePrimary(depth);
  }

  private parsePrimary(depth: number): Expr {
    const next = this.peek();
    if (next.kind === 'num') {
      this.at++;
      if (!Number.isFinite(next.value)) this.fail(`'${next.text}' is not a number`, next);
      return { type: 'number', value: next.value!, start: next.start, end: next.end };
    }
    if (next.kind === 'id') {
      this.at++;
      if (this.peek().text === '(') return this.parseCall(next, depth);
      return { type: 'ref', name: next.text.toLowerCase(), start: next.start, end: next.end };
    }
    if (next.text === '(') {
      this.at++;
      const inner = this.parseBinary(0, depth + 1);
      if (this.peek().text !== ')') this.fail("expected ')'");
      this.at++;
      return inner;
    }
    return this.fail(next.kind === 'end' ? 'expression ends too early' : `unexpected '${next.text}' in expression`);
  }

  private parseCall(name: Lexeme, depth: number): Expr {
    const fn = name.text.toLowerCase();
    if (!FUNCTIONS[fn]) this.fail(`unknown function '${name.text}'; known: ${EXPRESSION_FUNCTIONS.join(', ')}`, name);
    this.at++;
    const args: Expr[] = [];
    while (this.peek().text !== ')') {
      args.push(this.parseBinary(0, depth + 1));
      if (this.peek().text === ',') this.at++;
      else if (this.peek().text !== ')') this.fail("expected ',' or ')'");
    }
    const close = this.peek();
    this.at++;
    if (args.length !== FUNCTIONS[fn]!.arity) {
      this.fail(`${fn}() takes ${FUNCTIONS[fn]!.arity} argument(s), got ${args.length}`, name);
    }
    return { type: 'call', name: fn, args, start: name.start, end: close.end };
  }
}

/** Names an expression refers to (`pi` excluded unless shadowed is for the caller to decide). */
export function referencedNames(expr: Expr, into: Set<string> = new Set()): Set<string> {
  const stack: Expr[] = [expr];
  while (stack.length) {
    const e = stack.pop()!;
    if (e.type === 'ref') into.add(e.name);
    else if (e.type === 'unary') stack.push(e.arg);
    else if (e.type === 'binary') stack.push(e.left, e.right);
    else if (e.type === 'call') stack.push(...e.args);
  }
  return into;
}

/**
 * Evaluates an expression. `lookup` returns a parameter's value or undefined; `pi` is built in
 * unless a parameter of that name exists.
 */
export function evaluateExpression(expr: Expr, lookup: (name: string) => number | undefined): { value?: number; error?: ExprError } {
  try {
    return { value: evaluate(expr, lookup) };
  } catch (thrown) {
    if (thrown instanceof ExprSyntaxError) return { error: thrown.detail };
    throw thrown;
  }
}

function evaluate(expr: Expr, lookup: (name: string) => number | undefined): number {
  return foldExpr<number>(expr, (e, operands) => {
    switch (e.type) {
      case 'number':
        return e.value;
      case 'ref': {
        const value = lookup(e.name) ?? (e.name === 'pi' ? Math.PI : undefined);
        if (value === undefined) throw new ExprSyntaxError({ message: `unknown parameter '${e.name}'`, start: e.start, end: e.end });
        return value;
      }
      case 'unary':
        return e.op === '-' ? -operands[0]! : operands[0]!;
      case 'binary':
        return applyBinary(e.op, operands[0]!, operands[1]!);
      case 'call':
        return FUNCTIONS[e.name]!.apply(...operands);
    }
  });
}

/**
 * Folds an expression bottom-up with an explicit stack: the parser measures a fresh tree with it
 * before refusing a deep one (a sum of 8,000 terms is a tree 8,000 deep), and evaluation needs no
 * stack however the tree was built. `combine` gets each node with its operands' folded values,
 * left to right, in the order a recursive left-to-right walk would finish them.
 */
export function foldExpr<T>(expr: Expr, combine: (e: Expr, operands: T[]) => T): T {
  const pending: { e: Expr; ready: boolean }[] = [{ e: expr, ready: false }];
  const values: T[] = [];
  while (pending.length) {
    const { e, ready } = pending.pop()!;
    const operands = operandsOf(e);
    if (!ready && operands.length > 0) {
      pending.push({ e, ready: true });
      for (let k = operands.length - 1; k >= 0; k--) pending.push({ e: operands[k]!, ready: false });
      continue;
    }
    values.push(combine(e, operands.length > 0 ? values.splice(values.length - operands.length) : []));
  }
  return values[0]!;
}

function treeDepth(expr: Expr): number {
  return foldExpr<number>(expr, (_, operands) => 1 + operands.reduce((deepest, d) => Math.max(deepest, d), 0));
}

function operandsOf(e: Expr): readonly Expr[] {
  if (e.type === 'unary') return [e.arg];
  if (e.type === 'binary') return [e.left, e.right];
  if (e.type === 'call') return e.args;
  return [];
}

function applyBinary(op: '+' | '-' | '*' | '/' | '^', a: number, b: number): number {
  switch (op) {
    case '+': return a + b;
    case '-': return a - b;
    case '*': return a * b;
    case '/': return a / b;
    case '^': return Math.pow(a, b);
  }
}
