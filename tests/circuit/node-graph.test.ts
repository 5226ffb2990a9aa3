/**
 * The node graph against the plain definition, built here the obvious way: for every node, every
 * (element, terminal) that touches it in element then terminal order; every instance whose ports
 * touch it, once each; an element by its key, the later of two with one key. Checked over a file
 * of every card kind, with subcircuits, a repeated node on one element and a duplicate key.
 */
import { describe, expect, it } from 'vitest';
import { buildNodeGraph, nodeGraphOf, type FlatCircuit } from '../../server/src/circuit/index';
import { analyze, type FileAnalysis } from '../../server/src/analysis/analyze';
import { generateNetlist } from '../../bench/generate-netlist';
import { flatten } from './check';

function plainGraph(flat: FlatCircuit) {
  const at = new Map<string, [string, number][]>();
  for (const e of flat.elements) e.terminals.forEach((t, i) => { if (!at.has(t.node)) at.set(t.node, []); at.get(t.node)!.push([e.key, i]); });
  const instancesAt = new Map<string, string[]>();
  for (const x of flat.instances) for (const n of new Set(x.terminals.map((t) => t.node))) { if (!instancesAt.has(n)) instancesAt.set(n, []); instancesAt.get(n)!.push(x.key); }
  return { at, instancesAt };
}

function expectSameAsPlain(flat: FlatCircuit, graph = buildNodeGraph(flat)): void {
  const plain = plainGraph(flat);
  expect(graph.nodes).toEqual([...plain.at.keys()]);
  for (const [node, list] of plain.at) {
    const got = graph.at(node);
    expect(got.map((i) => [i.element.key, i.terminal])).toEqual(list);
    for (const i of got) expect(i.element.terminals[i.terminal]!.node).toBe(node);
    expect(graph.at(node)).toBe(got); // made once
  }
  for (const [node, keys] of plain.instancesAt) expect(graph.instancesAt(node).map((x) => x.key)).toEqual(keys);
  expect(graph.at('no-such-node')).toEqual([]);
  expect(graph.instancesAt('no-such-node')).toEqual([]);
  const lastByKey = new Map(flat.elements.map((e) => [e.key, e]));
  for (const [k, e] of lastByKey) expect(graph.element(k)).toBe(e);
  expect(graph.element('no-such-key')).toBeUndefined();
}

describe('the node graph', () => {
  it('is the plain incidence lists on a generated file of every card kind', () => {
    expectSameAsPlain(flatten(generateNetlist(700, 7)));
  });

  it('lists an element twice at a node it touches with both terminals, and keeps the later of two elements with one key', () => {
    const flat = flatten(`loops and duplicates
R1 a a 1k
R2 a b 1k
R2 b c 2k
.subckt cell p q
C1 p q 1u
D1 q p DX
.model DX D
.ends
X1 a c cell
X2 c c cell
V1 a 0 SIN(0 10 50)
`);
    expect(buildNodeGraph(flat).at('a').filter((i) => i.element.key === 'r1').map((i) => i.terminal)).toEqual([0, 1]);
    expectSameAsPlain(flat);
  });

  it('made for the next circuit of an edited file, from the last one\'s terminals where no node changed, is still the plain lists', () => {
    const uri = 'file:///graph-edits.cir';
    let text = generateNetlist(300, 3);
    let previous: FileAnalysis | undefined;
    const next = (edited: string) => {
      text = edited;
      previous = analyze({ roots: [uri], readText: () => text, previousParse: (u) => previous?.parsed.get(u), consumePreviousParse: true, waveforms: false }).files.get(uri)!;
      const graph = nodeGraphOf(previous.flat);
      expectSameAsPlain(previous.flat, graph);
      return graph;
    };
    const middle = () => text.indexOf('\n', text.length >> 1) + 1;
    const first = next(text);
    // A comment line moves every card below it and changes no element's nodes: the terminals stand.
    const commented = next(text.slice(0, middle()) + '* a comment\n' + text.slice(middle()));
    expect(commented.nodes).toBe(first.nodes);
    // A value typed: one element is new, on the same nodes.
    const valued = next(text.replace(/^(R\S+ \S+ \S+ )\S+/m, '$1 123'));
    expect(valued.nodes).toBe(first.nodes);
    // A node renamed, a card added and one removed: the terminals are indexed afresh.
    const renamed = next(text.replace(/^(R\S+ )(\S+)/m, '$1renamed_node'));
    expect(renamed.nodes).not.toBe(first.nodes);
    next(text.slice(0, middle()) + 'RNEW renamed_node 0 1k\n' + text.slice(middle()));
    next(text.replace(/^RNEW .*\n/m, ''));
  });
});
