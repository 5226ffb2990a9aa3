/** Converts character offsets to 0-based line/column pairs and back, by binary search over line starts. */
export interface Position {
  line: number;
  character: number;
}

export class LineIndex {
  private readonly starts: number[];

  constructor(private readonly text: string) {
    this.starts = [0];
    if (text.indexOf('\r') < 0) {
      // Line feeds only (the usual case): the engine's string search finds them many times faster
      // than a loop over every character, and this runs on every analysis of a large file.
      for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) this.starts.push(i + 1);
      return;
    }
    for (let i = 0; i < text.length; i++) {
      const ch = text.charCodeAt(i);
      if (ch === 10) this.starts.push(i + 1);
      else if (ch === 13 && text.charCodeAt(i + 1) !== 10) this.starts.push(i + 1);
    }
  }

  get lineCount(): number {
    return this.starts.length;
  }

  positionAt(offset: number): Position {
    const clamped = Math.max(0, Math.min(offset, this.text.length));
    let low = 0;
    let high = this.starts.length - 1;
    while (low < high) {
      const mid = (low + high + 1) >> 1;
      if (this.starts[mid]! <= clamped) low = mid;
      else high = mid - 1;
    }
    return { line: low, character: clamped - this.starts[low]! };
  }

  offsetAt(position: Position): number {
    const line = Math.max(0, Math.min(position.line, this.starts.length - 1));
    const next = line + 1 < this.starts.length ? this.starts[line + 1]! : this.text.length;
    return Math.min(this.starts[line]! + Math.max(0, position.character), next);
  }

  /** The offset where a line starts. */
  lineStart(line: number): number {
    return this.starts[Math.max(0, Math.min(line, this.starts.length - 1))]!;
  }
}

const indexes = new WeakMap<object, LineIndex>();

/** The line index of an analysed file's text, built once per analysis and then shared by every request. */
export function lineIndexOf(file: { text: string }): LineIndex {
  let index = indexes.get(file);
  if (!index) {
    index = new LineIndex(file.text);
    indexes.set(file, index);
  }
  return index;
}
