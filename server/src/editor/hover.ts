/**
 * Hover text (Markdown) for what sits under the cursor: a device, a model or a node. Rectifier
 * devices get their stress table from the analysis (see `stress-hover.ts`).
 */
import { key, type Card, type Netlist, type Span } from '../../../grammar/src/index';
import { escapeMarkdown as md, markdownCode as code } from '../presentation/markup';
import { indexNames, occurrenceAt } from './name-index';

export interface HoverResult {
  markdown: string;
  span: Span;
}

/** Extra hover sections a later stage can contribute (e.g. stress tables), keyed by card. */
export type HoverSections = (card: Card) => string | undefined;

export function hoverAt(netlist: Netlist, offset: number, sections: HoverSections = () => undefined): HoverResult | undefined {
  const card = cardAt(netlist, offset);
  if (card && 'name' in card && card.kind !== 'model' && card.kind !== 'subckt' && card.name && within(card.name.span, offset)) {
    const extra = sections(card);
    return { markdown: extra ? `${describeElement(card)}\n\n${extra}` : describeElement(card), span: card.name.span };
  }
  const occurrence = occurrenceAt(indexNames(netlist), offset);
  if (!occurrence) return undefined;
  const name = netlist.text.slice(occurrence.span.start, occurrence.span.end);
  if (occurrence.kind === 'model') return { markdown: describeModel(netlist, occurrence.key, name), span: occurrence.span };
  if (occurrence.kind === 'node') return { markdown: describeNode(netlist, occurrence.key, occurrence.scope, name), span: occurrence.span };
  return { markdown: `**subcircuit ${md(name)}**`, span: occurrence.span };
}

function within(span: Span, offset: number): boolean {
  return span.start <= offset && offset <= span.end;
}

function cardAt(netlist: Netlist, offset: number): Card | undefined {
  return netlist.cards.find((c) => within(c.span, offset));
}

/** Every piece of netlist text in a hover goes through `md` (prose) or `code` (a code span): names can hold Markdown. */
function describeElement(card: Card): string {
  const text = (word: { text: string } | undefined) => code(word?.text ?? '?');
  switch (card.kind) {
    case 'diode':
      return `**${md(card.name.text)}** — diode, anode ${text(card.nodes[0])} → cathode ${text(card.nodes[1])}, model ${text(card.model)}`;
    case 'mosfet':
      return `**${md(card.name.text)}** — MOSFET, drain ${text(card.nodes[0])} gate ${text(card.nodes[1])} source ${text(card.nodes[2])}, model ${text(card.model)}`;
    case 'passive':
      return `**${md(card.name.text)}** — ${({ R: 'resistor', C: 'capacitor', L: 'inductor' })[card.letter]} ${md(card.value?.text ?? '')} between ${card.nodes.map(text).join(' and ')}`;
    case 'source':
      return `**${md(card.name.text)}** — ${card.letter === 'V' ? 'voltage' : 'current'} source ${md(sourceValue(card), 200)}`;
    case 'instance':
      return `**${md(card.name.text)}** — instance of ${text(card.subckt)}`;
    default:
      return `**${md('name' in card && card.name ? card.name.text : card.kind)}**`;
  }
}

function sourceValue(card: Extract<Card, { kind: 'source' }>): string {
  return card.waveform ? `${card.waveform.name.text}(${card.waveform.args.map((a) => a.text).join(' ')})` : (card.dc?.text ?? '');
}

function describeModel(netlist: Netlist, modelKey: string, name: string): string {
  const model = netlist.cards.find((c) => c.kind === 'model' && c.name && key(c.name) === modelKey);
  const users = netlist.cards.filter((c) => (c.kind === 'diode' || c.kind === 'mosfet') && c.model && key(c.model) === modelKey);
  const lines = [`**model ${md(name)}**${model && model.kind === 'model' && model.type ? ` (${md(model.type.text)})` : ''}`];
  if (model && model.kind === 'model' && model.params.length) {
    lines.push('', model.params.map((p) => code(`${p.name.text}=${p.value?.text ?? ''}`)).join(' '));
  }
  if (!model) lines.push('', 'Not defined in this file (it may come from an include).');
  if (users.length) lines.push('', `Used by ${users.map((u) => md('name' in u && u.name ? u.name.text : '')).join(', ')}.`);
  return lines.join('\n');
}

function describeNode(netlist: Netlist, nodeKey: string, scope: string, name: string): string {
  const here = indexNames(netlist).filter((o) => o.kind === 'node' && o.key === nodeKey && o.scope === scope);
  const cards = here.flatMap((o) => {
    const card = cardAt(netlist, o.span.start);
    return card && 'name' in card && card.name && card.kind !== 'model' && card.kind !== 'subckt' ? [card.name.text] : [];
  });
  const ground = nodeKey === '0' || nodeKey === 'gnd' ? ' (ground)' : '';
  return `**node ${md(name)}**${ground} — ${cards.length} connection${cards.length === 1 ? '' : 's'}: ${[...new Set(cards)].map((c) => md(c)).join(', ')}`;
}
