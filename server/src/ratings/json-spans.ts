/**
 * A strict JSON scanner that says where things are: the first syntax error with its offset (a
 * truncated file, a trailing comma, a stray character), and the span of each value by JSON
 * pointer, so a problem the validator names by pointer lands on the right text. Iterative with an
 * explicit stack: nesting depth cannot exhaust the call stack. It checks syntax only;
 * `JSON.parse` still builds the values.
 */
import type { Span } from '../../../grammar/src/index';

export interface JsonSyntaxError {
  offset: number;
  message: string;
}

export interface JsonScan {
  error?: JsonSyntaxError;
  /** Spans of values by JSON pointer (`""` is the document); object members span key to value. */
  spans: Map<string, Span>;
}

/** Pointers deeper than this, or spans past this count, are not kept (problems fall back to a prefix). */
const MAX_POINTER_DEPTH = 4;
const MAX_SPANS = 100_000;

interface Frame {
  kind: 'object' | 'array';
  pointer: string;
  depth: number;
  start: number;
  count: number;
  key?: string;
  keyStart?: number;
}

type Mode = 'value' | 'first-key' | 'key' | 'first-item' | 'after';

const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;
const WHITESPACE = /[ \t\n\r]*/y;

/** Scans `text` as one JSON document. */
export function scanJson(text: string): JsonScan {
  return new Scanner(text).run();
}

/** One step's outcome: go on in a mode, or stop with the scan's result. */
type Step = Mode | JsonScan;

class Scanner {
  private readonly spans = new Map<string, Span>();
  private readonly stack: Frame[] = [];
  private i = 0;

  constructor(private readonly text: string) {}

  run(): JsonScan {
    let mode = 'value' as Step;
    while (typeof mode === 'string') {
      this.i = this.skipSpace(this.i);
      mode = mode === 'after' ? this.afterValue() : mode === 'first-key' || mode === 'key' ? this.readKey(mode) : this.readValue(mode);
    }
    return mode;
  }

  /** After a value: the end of the document, a comma, or the closer of the open container. */
  private afterValue(): Step {
    const c = this.text[this.i];
    const top = this.stack[this.stack.length - 1];
    if (!top) return c === undefined ? { spans: this.spans } : this.fail(`unexpected ${describe(c)} after the end of the JSON`);
    if (c === ',') {
      top.count++;
      const next = this.text[this.skipSpace(this.i + 1)];
      if (next === '}' || next === ']') return this.fail(`a trailing comma: JSON allows no comma before '${next}'`);
      this.i++;
      return top.kind === 'object' ? 'key' : 'value';
    }
    const closer = top.kind === 'object' ? '}' : ']';
    if (c !== closer) return this.fail(c === undefined ? truncated() : `expected ',' or '${closer}', found ${describe(c)}`);
    return this.close();
  }

  /** A property name and its colon, or the `}` of an empty object. */
  private readKey(mode: 'first-key' | 'key'): Step {
    const c = this.text[this.i];
    if (mode === 'first-key' && c === '}') return this.close();
    if (c !== '"') return this.fail(c === undefined ? truncated() : `expected a property name in double quotes, found ${describe(c)}`);
    const end = scanString(this.text, this.i);
    if (typeof end !== 'number') return this.fail(end.message, end.offset);
    const top = this.stack[this.stack.length - 1]!;
    top.key = JSON.parse(this.text.slice(this.i, end)) as string;
    top.keyStart = this.i;
    this.i = this.skipSpace(end);
    const colon = this.text[this.i];
    if (colon !== ':') return this.fail(colon === undefined ? truncated() : `expected ':' after the property name, found ${describe(colon)}`);
    this.i++;
    return 'value';
  }

  /** A value: a container opens, a scalar is read whole; or the `]` of an empty array. */
  private readValue(mode: 'value' | 'first-item'): Step {
    const c = this.text[this.i];
    if (c === undefined) return this.fail(this.text.trim() === '' ? 'the file holds no JSON value' : truncated());
    if (mode === 'first-item' && c === ']') return this.close();
    const top = this.stack[this.stack.length - 1];
    if (c === '{' || c === '[') {
      this.stack.push({ kind: c === '{' ? 'object' : 'array', pointer: pointerOfNext(top), depth: top ? top.depth + 1 : 0, start: this.i, count: 0 });
      this.i++;
      return c === '{' ? 'first-key' : 'first-item';
    }
    const end = scanScalar(this.text, this.i);
    if (typeof end !== 'number') return this.fail(end.message, end.offset);
    this.record(this.i, end);
    this.i = end;
    return 'after';
  }

  private close(): Step {
    const frame = this.stack.pop()!;
    this.i++;
    this.record(frame.start, this.i);
    return 'after';
  }

  /** Keeps the span of the value just read; an object member spans from its key. */
  private record(start: number, end: number): void {
    const top = this.stack[this.stack.length - 1];
    const depth = top ? top.depth + 1 : 0;
    if (depth > MAX_POINTER_DEPTH || this.spans.size >= MAX_SPANS) return;
    const from = top?.kind === 'object' && top.keyStart !== undefined ? top.keyStart : start;
    this.spans.set(pointerOfNext(top), { start: from, end });
  }

  private skipSpace(at: number): number {
    WHITESPACE.lastIndex = at;
    return at + WHITESPACE.exec(this.text)![0].length;
  }

  private fail(message: string, at = this.i): JsonScan {
    return { error: { offset: Math.min(at, this.text.length), message }, spans: this.spans };
  }
}

/** The pointer of the value about to be read inside `frame` (the document itself without one). */
function pointerOfNext(frame: Frame | undefined): string {
  if (!frame) return '';
  const segment = frame.kind === 'array' ? String(frame.count) : escapePointer(frame.key ?? '');
  return `${frame.pointer}/${segment}`;
}

/** The end of the string, number or literal at `start`, or the error in it. */
function scanScalar(text: string, start: number): number | JsonSyntaxError {
  const c = text[start]!;
  if (c === '"') return scanString(text, start);
  for (const literal of ['true', 'false', 'null']) {
    if (text.startsWith(literal, start)) return start + literal.length;
  }
  NUMBER.lastIndex = start;
  const number = NUMBER.exec(text);
  if (number) return start + number[0].length;
  return { offset: start, message: `expected a value, found ${describe(c)}` };
}

function scanString(text: string, start: number): number | JsonSyntaxError {
  for (let i = start + 1; i < text.length; i++) {
    const code = text.charCodeAt(i);
    if (code === 0x22) return i + 1;
    if (code < 0x20) return { offset: i, message: 'a control character (such as a line break) inside a string; JSON needs it escaped' };
    if (code === 0x5c) {
      const escape = text[i + 1];
      if (escape === 'u' ? !/^[0-9a-fA-F]{4}$/.test(text.slice(i + 2, i + 6)) : !escape || !'"\\/bfnrt'.includes(escape)) {
        return { offset: i, message: 'an invalid escape inside a string' };
      }
      i += escape === 'u' ? 5 : 1;
    }
  }
  return { offset: text.length, message: truncated() };
}

function truncated(): string {
  return 'the text ends before the JSON is complete (is the file truncated?)';
}

function describe(c: string | undefined): string {
  if (c === undefined) return 'the end of the text';
  const code = c.charCodeAt(0);
  return code < 0x20 || code === 0x7f ? `the control character U+${code.toString(16).toUpperCase().padStart(4, '0')}` : `'${c}'`;
}

/** JSON pointer escaping (RFC 6901): `~` → `~0`, `/` → `~1`. */
export function escapePointer(key: string): string {
  return key.replace(/~/g, '~0').replace(/\//g, '~1');
}

/** The span of the value at `pointer`, or of its nearest recorded ancestor. */
export function spanAt(scan: JsonScan, pointer: string): Span {
  for (let p = pointer; ; p = p.slice(0, p.lastIndexOf('/'))) {
    const span = scan.spans.get(p);
    if (span) return span;
    if (p === '') return { start: 0, end: 0 };
  }
}
