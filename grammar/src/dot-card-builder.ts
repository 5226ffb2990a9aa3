/** Gives the arguments of a dot card (`.model`, `.subckt`, `.param`, `.include`…) their meaning. */
import type { RawArg, RawCard } from './card-parser';
import { exact, NONE, nameOf, reportExtra, reportShort, sortArgs, spanOf, valueOf, wordName } from './card-builder';
import type { Card, ModelCard, Param, Span, SyntaxDiagnostic } from './syntax-tree';

type Diagnostics = SyntaxDiagnostic[];

/** Builds a dot card from its keyword. */
export function buildDotCard(raw: RawCard, span: Span, d: Diagnostics): Card {
  const keyword = nameOf(raw.head);
  switch (raw.head.tokenType.name) {
    case 'DotModel': return buildModel(raw, span, d);
    case 'DotSubckt': {
      const { bare, params, groups } = sortArgs(raw.args, d);
      reportExtra(groups, 'parenthesised list', d);
      const words = bare.flatMap((a) => wordName(a, 'a port name', d) ?? []).filter((w) => w.text.toLowerCase() !== 'params:');
      if (!words[0]) reportShort(raw.head, raw.args, '.subckt needs a name and its ports (.subckt name node…)', d);
      return { kind: 'subckt', keyword, name: words[0], ports: words.length > 1 ? words.slice(1) : NONE, params, span };
    }
    case 'DotEnds': {
      const { bare } = sortArgs(raw.args, d);
      reportExtra(bare.slice(1), 'word after the subcircuit name', d);
      return { kind: 'ends', keyword, name: wordName(bare[0], 'a subcircuit name', d), span };
    }
    case 'DotParam': {
      const { bare, params, groups } = sortArgs(raw.args, d);
      for (const arg of [...bare, ...groups]) {
        d.push({ span: spanOf(arg), severity: 'error', code: 'syntax-error', message: '.param takes name=value pairs' });
      }
      if (params.length === 0 && bare.length === 0) reportShort(raw.head, raw.args, '.param needs name=value', d);
      return { kind: 'param', keyword, params, span };
    }
    case 'DotInclude': {
      if (!raw.args[0]) reportShort(raw.head, raw.args, `${raw.head.image} needs a file path`, d);
      reportExtra(raw.args.slice(1), 'word after the path', d);
      return { kind: 'include', keyword, path: wordName(raw.args[0], 'a file path', d), span };
    }
    case 'DotLib': return buildLib(raw, span, d);
    case 'DotEndl': return { kind: 'endl', keyword, span };
    case 'DotEnd': return { kind: 'end', keyword, span };
    default: {
      const words = exact(raw.args.flatMap((a) => (a.kind === 'word' ? [nameOf(a.token)] : [])));
      return { kind: 'control', keyword, words, span };
    }
  }
}

function buildModel(raw: RawCard, span: Span, d: Diagnostics): ModelCard {
  const { bare, params, groups } = sortArgs(raw.args, d);
  const card: ModelCard = { kind: 'model', keyword: nameOf(raw.head), name: wordName(bare[0], 'a model name', d), params, span };
  const typed = groups[0];
  if (typed) {
    card.type = typed.name ? nameOf(typed.name) : wordName(bare[1], 'a model type', d);
    card.params = exact([...groupParams(typed.args, d), ...params]);
    reportExtra(groups.slice(1), 'parenthesised list', d);
  } else {
    card.type = wordName(bare[1], 'a model type', d);
  }
  const usedBare = typed && typed.name ? 1 : 2;
  reportExtra(bare.slice(usedBare), 'word', d);
  if (!card.name || !card.type) reportShort(raw.head, raw.args, '.model needs a name and a type, e.g. .model DMAIN D(IS=1n N=1.8)', d);
  return card;
}

/** Parameters inside a `.model` list; bare words there are flags. */
function groupParams(args: RawArg[], d: Diagnostics): Param[] {
  const { bare, params, groups } = sortArgs(args, d);
  reportExtra(groups, 'parenthesised list', d);
  const flags = bare.flatMap((a) => {
    const value = a.kind === 'word' ? undefined : valueOf(a, d);
    if (value) d.push({ span: value.span, severity: 'error', code: 'syntax-error', message: 'a model parameter is written name=value' });
    return a.kind === 'word' ? [{ name: nameOf(a.token), span: spanOf(a) }] : [];
  });
  return [...params, ...flags].sort((x, y) => x.span.start - y.span.start);
}

function buildLib(raw: RawCard, span: Span, d: Diagnostics): Card {
  const keyword = nameOf(raw.head);
  const [first, second] = raw.args;
  if (!first) {
    reportShort(raw.head, raw.args, '.lib needs a file and a section, or a section name in a library file', d);
    return { kind: 'lib', keyword, span };
  }
  reportExtra(raw.args.slice(2), 'word', d);
  const looksLikePath = first.kind === 'path' || (first.kind === 'word' && /[./\\]/.test(first.token.image));
  if (second || looksLikePath) {
    return { kind: 'lib', keyword, path: wordName(first, 'a file path', d), section: wordName(second, 'a section name', d), span };
  }
  return { kind: 'lib', keyword, section: wordName(first, 'a section name', d), span };
}
