/** Document symbols (subcircuits with their parts, models, sources) and folding ranges. */
import type { Item, Netlist, Span } from '../../../grammar/src/index';

export interface OutlineSymbol {
  name: string;
  detail: string;
  kind: 'subckt' | 'model' | 'source' | 'rectifier' | 'part';
  span: Span;
  selection: Span;
  children: OutlineSymbol[];
}

export function outlineOf(netlist: Netlist): OutlineSymbol[] {
  return outlineItems(netlist.items);
}

function outlineItems(items: readonly Item[]): OutlineSymbol[] {
  const out: OutlineSymbol[] = [];
  for (const item of items) {
    if (item.kind === 'subckt-block' && item.header.name) {
      out.push({
        name: item.header.name.text, detail: `subcircuit (${item.header.ports.map((p) => p.text).join(' ')})`,
        kind: 'subckt', span: item.span, selection: item.header.name.span, children: outlineItems(item.body),
      });
    } else if (item.kind === 'lib-section') out.push(...outlineItems(item.body));
    else if (item.kind === 'model' && item.name) {
      out.push({ name: item.name.text, detail: `model ${item.type?.text ?? ''}`.trim(), kind: 'model', span: item.span, selection: item.name.span, children: [] });
    } else if (item.kind === 'source' || item.kind === 'diode' || item.kind === 'mosfet') {
      const detail = item.kind === 'source' ? `${item.letter === 'V' ? 'voltage' : 'current'} source` : item.kind;
      out.push({ name: item.name.text, detail, kind: item.kind === 'source' ? 'source' : 'part', span: item.span, selection: item.name.span, children: [] });
    }
  }
  return out;
}

export interface FoldRange {
  start: number;
  end: number;
  kind: 'region' | 'comment';
}

/** `.subckt` and `.lib` blocks, and runs of two or more comment lines. */
export function foldingRangesOf(netlist: Netlist): FoldRange[] {
  const out: FoldRange[] = [];
  const visit = (items: readonly Item[]) => {
    for (const item of items) {
      if (item.kind === 'subckt-block' || item.kind === 'lib-section') {
        out.push({ start: item.span.start, end: item.span.end, kind: 'region' });
        visit(item.body);
      }
    }
  };
  visit(netlist.items);
  let run: Span[] = [];
  const flush = () => {
    if (run.length >= 2) out.push({ start: run[0]!.start, end: run[run.length - 1]!.end, kind: 'comment' });
    run = [];
  };
  const lineComments = netlist.comments.filter((c) => netlist.text[c.start] === '*' && isLineStart(netlist.text, c.start));
  for (const comment of lineComments) {
    const previous = run[run.length - 1];
    if (previous && !/^\r?\n[ \t]*$/.test(netlist.text.slice(previous.end, comment.start))) flush();
    run.push(comment);
  }
  flush();
  return out.sort((a, b) => a.start - b.start);
}

function isLineStart(text: string, offset: number): boolean {
  const before = text.lastIndexOf('\n', offset - 1);
  return text.slice(before + 1, offset).trim() === '';
}
