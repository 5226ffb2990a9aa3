/**
 * Elaboration: a root netlist and the files it includes → one flat circuit. Subcircuits are
 * expanded with an explicit work stack (never recursion), an instance chain that meets its own
 * subcircuit again is reported and cut, nesting is limited, and the flattened size is capped: an
 * instance whose expansion would not fit is refused before it is built (expansion-size.ts), so no
 * input can exhaust the stack, the memory or the time.
 */
import { key, type InstanceCard, type Item, type Lookup, type ModelCard, type Netlist, type SubcktBlock } from '../../../grammar/src/index';
import { FindingSet } from '../findings/index';
import { buildElement, terminalsOf, type ElementCard, type Frame } from './elements';
import { globalParamValues, keptElements, keptExpansions, scopeToken, type KeptExpansion, type ScopeToken } from './elaboration-memo';
import type { FileSource, FlatCircuit, FlatElement, FlatInstance, FlatModel, PlacedDirective } from './flat-circuit';
import { didYouMean } from './did-you-mean';
import { ExpansionSizer, lookupDef, type Defs, type SubcktDef } from './expansion-size';
import { IncludeExpander, type PlacedItem } from './includes';
import { evaluateParams, instanceScope, type PlacedParam } from './scope';
import { keepTrace, lastTrace, planTopLevel, runOutputs, splicingCounts, type RunOutputs, type TopLevelPlan, type TopLevelTrace } from './top-level-runs';

export interface ElaborateOptions {
  /** Deepest subcircuit nesting expanded (default 64). */
  maxDepth?: number;
  /** Most elements and instances produced before elaboration stops (default 200,000). */
  maxElements?: number;
  /** Most cards spliced in from included files (default 1,000,000). */
  maxIncludedCards?: number;
}

/** A top-level X card's expansion being built, to be kept if building it says nothing. */
interface Recording {
  card: InstanceCard;
  uri: string;
  instances: number;
  elements: number;
  charged: number;
  offered: number;
  models: [string, FlatModel][];
  size: number | undefined;
  /** A body it entered holds a directive (collected once per file and offset, so not replayed). */
  directive: boolean;
}

interface Work {
  items: PlacedItem[];
  next: number;
  frame: Frame;
  defs: Defs;
  /** Lowercase subcircuit names from the root down to this scope. */
  path: string[];
}

/** Elaborates the netlist at `rootUri`; files come from the adapter, already parsed. */
export function elaborate(rootUri: string, files: FileSource, options: ElaborateOptions = {}): FlatCircuit {
  return new Elaborator(rootUri, files, options).run();
}

class Elaborator {
  private readonly sink = new FindingSet();
  private readonly expander: IncludeExpander;
  private readonly elements: FlatElement[] = [];
  private readonly instances: FlatInstance[] = [];
  private readonly models = new Map<string, FlatModel>();
  private readonly directives: PlacedDirective[] = [];
  private readonly seenDirectives = new Set<string>();
  private readonly maxDepth: number;
  private readonly maxElements: number;
  private readonly sizer: ExpansionSizer;
  /** Cards charged to the flattened size: top-level elements and instances, and every expanded body whole. */
  private charged = 0;
  private stopped = false;
  private readonly maxIncludedCards: number | undefined;
  /** This elaboration's top-level scope, under which top-level cards' flat forms are kept; none when a subcircuit body includes a file. */
  private scope: ScopeToken | undefined;
  private recording: Recording | undefined;
  /** The runs of the top level that may be copied from the last elaboration (top-level-runs.ts). */
  private plan: TopLevelPlan | undefined;
  /** This elaboration's top level as the next one will see it; undefined when it may not be copied from. */
  private outputs: RunOutputs | undefined;
  private subckts: (string | undefined)[] = [];
  /** The local models set while flattening, in order. */
  private readonly localModels: [string, FlatModel][] = [];
  /** Whether the top-level item being flattened said something or was built anew. */
  private unkept = false;
  private offeredBefore = 0;

  constructor(private readonly rootUri: string, files: FileSource, options: ElaborateOptions) {
    this.expander = new IncludeExpander(files, this.sink, options.maxIncludedCards);
    this.maxDepth = options.maxDepth ?? 64;
    this.maxElements = options.maxElements ?? 200_000;
    this.maxIncludedCards = options.maxIncludedCards;
    this.sizer = new ExpansionSizer({ body: (def) => this.bodyOf(def), own: (def) => this.subcktsOf(def) }, this.maxDepth, this.maxElements);
  }

  run(): FlatCircuit {
    const root: Netlist | undefined = this.expander.read(this.rootUri);
    const placed = root ? this.placeTopLevel(root) : undefined;
    const top = placed?.placed ?? [];
    if (!root) this.sink.add({ uri: this.rootUri, span: { start: 0, end: 0 }, severity: 'error', code: 'missing-include', message: `cannot read ${this.rootUri}` });
    this.collectDirectives(top);
    const globalParams = globalParamValues(paramsOf(top), this.sink);
    const globalLookup: Lookup = (name) => globalParams.get(name);
    const defs: Defs = { own: this.defineSubckts(top) };
    const frame: Frame = {
      uri: this.rootUri, namePrefix: '', keyPrefix: '', ports: new Map(), lookup: globalLookup, chain: [],
      ...this.defineModels(top, '', globalLookup, { modelKey: () => undefined, modelNames: () => [] }),
    };
    this.scope = this.scopeOf(root, top, globalParams, defs);
    if (this.plan && this.plan.previous.scope !== this.scope) this.plan = undefined;
    this.outputs = this.scope && placed?.traced ? runOutputs(top.length) : undefined;
    if (this.outputs) this.subckts = new Array<string | undefined>(top.length).fill(undefined);
    this.flatten({ items: top, next: 0, frame, defs, path: [] }, globalLookup);
    const traced = this.outputs && !this.stopped && placed?.traced;
    keepTrace(root?.cards[0], traced ? {
      uri: this.rootUri, scope: this.scope!, rootItems: root!.items, placedStart: placed.traced!.placedStart, splicingBefore: placed.traced!.splicingBefore, placed: top,
      files: placed.traced!.files, spliced: placed.traced!.spliced, outputs: this.outputs!, subckts: this.subckts,
      elements: this.elements, instances: this.instances, models: this.localModels,
    } : undefined);
    return {
      rootUri: this.rootUri, elements: this.elements, instances: this.instances, models: this.models,
      directives: this.directives, globalParams, dependencies: [...this.expander.used], diagnostics: this.sink.list,
    };
  }

  /**
   * The root's top level with includes spliced in: from the last elaboration's where only an
   * unchanged run surrounds the change (top-level-runs.ts), else placed afresh. `traced` holds what
   * the next elaboration needs to do the same, when placing it said nothing.
   */
  private placeTopLevel(root: Netlist): { placed: PlacedItem[]; traced?: Pick<TopLevelTrace, 'placedStart' | 'splicingBefore' | 'files' | 'spliced'> } {
    const previous = lastTrace(root.cards[0]);
    const plan = previous && planTopLevel(previous, root.items, this.rootUri, (uri, tree) => this.expander.sameTree(uri, tree));
    if (plan) {
      this.plan = plan;
      this.expander.replayTopLevel(previous.files, previous.spliced);
      return { placed: plan.placed, traced: { placedStart: plan.placedStart, splicingBefore: plan.splicingBefore, files: previous.files, spliced: previous.spliced } };
    }
    const offered = this.sink.offered;
    const starts: number[] = [];
    const placed = this.expander.expand(root.items, this.rootUri, [this.rootUri], starts);
    if (this.sink.offered !== offered) return { placed };
    return { placed, traced: { placedStart: Int32Array.from(starts), splicingBefore: splicingCounts(root.items), files: [...this.expander.usedTrees], spliced: this.expander.splicedCards } };
  }

  /** Notes the outputs before top-level item `index` (and whether the one before it may be copied later). */
  private noteTopLevel(index: number): void {
    const out = this.outputs;
    if (!out) return;
    out.elements[index] = this.elements.length;
    out.instances[index] = this.instances.length;
    out.models[index] = this.localModels.length;
    out.charged[index] = this.charged;
    const said = this.sink.offered !== this.offeredBefore;
    out.unkept[index] = index === 0 ? 0 : out.unkept[index - 1]! + (this.unkept || said ? 1 : 0);
    this.unkept = false;
    this.offeredBefore = this.sink.offered;
  }

  /**
   * Copies from the last elaboration the longest run of unchanged top-level items that starts at
   * new item `index` and holds no item that said something or was built anew then, if it fits;
   * returns the new index after it, or `index` when nothing was copied.
   */
  private copyRun(index: number, defs: Defs): number {
    const plan = this.plan;
    if (!plan) return index;
    const was = plan.previous;
    const o = was.outputs;
    const inPrefix = index < plan.prefixEnd;
    if (!inPrefix && index < plan.suffixStart) return index;
    const from = inPrefix ? index : index - plan.suffixStart + plan.oldSuffixStart;
    if (from >= (inPrefix ? plan.prefixEnd : was.placed.length)) return index;
    const to = firstUnkept(o.unkept, from, inPrefix ? plan.prefixEnd : was.placed.length);
    if (to === from || this.charged + o.charged[to]! - o.charged[from]! > this.maxElements) return index;
    // The size checks a card-by-card pass makes, in its order: a size counted once is not counted again.
    const sized = new Set<string>();
    for (let j = from; j < to; j++) {
      const subckt = was.subckts[j];
      if (subckt === undefined || sized.has(subckt)) continue;
      sized.add(subckt);
      const def = lookupDef(defs, subckt);
      if (!def || this.sizer.sizeOf(def, defs, [subckt]) === undefined) return index;
    }
    const out = this.outputs;
    const shift = { elements: this.elements.length - o.elements[from]!, instances: this.instances.length - o.instances[from]!, models: this.localModels.length - o.models[from]!, charged: this.charged - o.charged[from]! };
    for (let e = o.elements[from]!; e < o.elements[to]!; e++) this.elements.push(was.elements[e]!);
    for (let k = o.instances[from]!; k < o.instances[to]!; k++) this.instances.push(was.instances[k]!);
    for (let k = o.models[from]!; k < o.models[to]!; k++) {
      const [name, model] = was.models[k]!;
      this.models.set(name, model);
      this.localModels.push([name, model]);
    }
    this.charged += o.charged[to]! - o.charged[from]!;
    if (out) {
      const unkept = out.unkept[index]!;
      for (let j = from; j < to; j++) {
        const at = index + j - from;
        out.elements[at] = o.elements[j]! + shift.elements;
        out.instances[at] = o.instances[j]! + shift.instances;
        out.models[at] = o.models[j]! + shift.models;
        out.charged[at] = o.charged[j]! + shift.charged;
        out.unkept[at] = unkept;
        this.subckts[at] = was.subckts[j];
      }
    }
    this.unkept = false;
    return index + to - from;
  }

  private flatten(start: Work, global: Lookup): void {
    const stack: Work[] = [start];
    while (stack.length && !this.stopped) {
      const work = stack[stack.length - 1]!;
      if (stack.length === 1) {
        this.noteTopLevel(work.next);
        const after = this.copyRun(work.next, work.defs);
        if (after !== work.next) {
          work.next = after;
          continue;
        }
      }
      const placed = work.items[work.next++];
      if (!placed) {
        stack.pop();
        if (stack.length === 1) this.finishRecording();
        continue;
      }
      const { item } = placed;
      const frame = placed.uri === work.frame.uri ? work.frame : { ...work.frame, uri: placed.uri };
      const top = work.path.length === 0;
      if (item.kind === 'instance') {
        if (top && item.subckt) this.subckts[work.next - 1] = key(item.subckt);
        if (top && this.reuseExpansion(item, frame.uri, work.defs)) continue;
        if (top) this.startRecording(item, frame.uri);
        const child = this.instantiate(item, frame, work, global);
        if (child) stack.push(child);
        else if (top) this.finishRecording();
      } else if (isElement(item)) {
        this.elements.push(top ? this.topElement(item, frame) : buildElement(item, frame, this.sink));
        if (top) this.charge(1, frame.uri, item.span);
      }
    }
    this.recording = undefined;
  }

  /** The scope top-level cards are kept under; none when a subcircuit body includes a file (whose text no card of ours stands for). */
  private scopeOf(root: Netlist | undefined, top: readonly PlacedItem[], globals: Map<string, number>, defs: Defs): ScopeToken | undefined {
    const subckts = [...defs.own].map(([name, def]) => [name, def.block] as const);
    if (subckts.some(([, block]) => includesInside(block))) return undefined;
    const modelKeys: string[] = [];
    for (const { item } of top) if (item.kind === 'model' && item.name) modelKeys.push(key(item.name));
    return scopeToken(root?.cards[0], {
      globals, modelKeys: modelKeys.join('\u0000'), subckts, limits: `${this.maxDepth}/${this.maxElements}/${this.maxIncludedCards}`,
    });
  }

  /** A top-level element card's flat element: the one kept from the last elaboration in this scope, else built (and kept when building it said nothing). */
  private topElement(card: ElementCard, frame: Frame): FlatElement {
    const scope = this.scope;
    const kept = scope && keptElements.get(card, scope, frame.uri);
    if (kept) return kept;
    const offered = this.sink.offered;
    const element = buildElement(card, frame, this.sink);
    if (scope && this.sink.offered === offered) keptElements.set(card, scope, frame.uri, element);
    else this.unkept = true;
    return element;
  }

  /** Puts back a top-level instance's kept expansion when it still fits where it did; false when there is none to put back. */
  private reuseExpansion(card: InstanceCard, uri: string, defs: Defs): boolean {
    const kept = this.scope && keptExpansions.get(card, this.scope, uri);
    const subckt = card.subckt ? key(card.subckt) : undefined;
    const def = kept && subckt ? lookupDef(defs, subckt) : undefined;
    if (!kept || !def || !subckt) return false;
    // The size check building it makes, so the sizer spends its counting budget as a fresh build
    // does (a size it has counted once it does not count again); then the running count.
    const size = this.sizer.sizeOf(def, defs, [subckt]);
    if (size === undefined || size !== kept.size || this.charged + 1 + size > this.maxElements || this.charged + kept.charged > this.maxElements) return false;
    for (const instance of kept.instances) this.instances.push(instance);
    for (const element of kept.elements) this.elements.push(element);
    for (const [name, model] of kept.models) {
      this.models.set(name, model);
      this.localModels.push([name, model]);
    }
    this.charged += kept.charged;
    return true;
  }

  private startRecording(card: InstanceCard, uri: string): void {
    this.recording = this.scope && {
      card, uri, instances: this.instances.length, elements: this.elements.length, charged: this.charged, offered: this.sink.offered,
      models: [], size: undefined, directive: false,
    };
  }

  /** Keeps the expansion just built when building it said nothing, else forgets any kept before. */
  private finishRecording(): void {
    const r = this.recording;
    if (!r || !this.scope) return;
    this.recording = undefined;
    const clean = !this.stopped && !r.directive && r.size !== undefined && this.sink.offered === r.offered;
    if (!clean) this.unkept = true;
    const expansion: KeptExpansion | undefined = clean
      ? { instances: this.instances.slice(r.instances), elements: this.elements.slice(r.elements), models: r.models, charged: this.charged - r.charged, size: r.size }
      : undefined;
    keptExpansions.set(r.card, this.scope, r.uri, expansion);
  }

  /** Records an X instance and returns the work of expanding it, or nothing when it cannot be expanded. */
  private instantiate(card: InstanceCard, frame: Frame, work: Work, global: Lookup): Work | undefined {
    const subckt = card.subckt ? key(card.subckt) : '';
    const def = card.subckt ? lookupDef(work.defs, subckt) : undefined;
    const instance: FlatInstance = {
      name: frame.namePrefix + card.name.text, key: frame.keyPrefix + key(card.name), subckt,
      terminals: terminalsOf(card.nodes, frame), resolved: false,
      origin: { uri: frame.uri, span: card.span, nameSpan: card.name.span, chain: frame.chain },
      params: evaluateParams(card.params, frame.lookup, frame.uri, this.sink),
    };
    this.instances.push(instance);
    if (work.path.length === 0) this.charge(1, frame.uri, card.span);
    if (!card.subckt) return undefined;
    if (!def) {
      // An error: nothing inside the instance is analysed, so a typo here would hide a rectifier.
      const place = { uri: frame.uri, span: card.subckt.span };
      const { clause, fixes } = didYouMean(card.subckt.text, visibleSubckts(work.defs), place);
      this.sink.add({
        ...place, severity: 'error', code: 'unknown-subckt',
        message: `no .subckt '${card.subckt.text}' is defined: ${card.name.text} is kept as a black box and nothing inside it is analysed${clause}`,
        ...(fixes.length ? { fixes } : {}),
      });
      return undefined;
    }
    if (!this.canExpand(card, frame, work, subckt) || !this.fits(card, frame, work, def, subckt)) return undefined;
    instance.resolved = true;
    return this.enter(card, frame, work, def, global);
  }

  private canExpand(card: InstanceCard, frame: Frame, work: Work, subckt: string): boolean {
    const at = { uri: frame.uri, span: card.name.span };
    if (work.path.includes(subckt)) {
      const loop = [...work.path.slice(work.path.indexOf(subckt)), subckt].join(' → ');
      this.sink.add({ ...at, severity: 'error', code: 'recursive-subckt', message: `subcircuit '${subckt}' instantiates itself (${loop}); ${card.name.text} is not expanded` });
      const outer = frame.chain[0];
      if (outer) this.sink.add({ uri: outer.uri, span: outer.nameSpan, severity: 'error', code: 'recursive-subckt', message: `${outer.name} holds a subcircuit that instantiates itself (${loop})` });
      return false;
    }
    if (work.path.length >= this.maxDepth) {
      this.sink.add({ ...at, severity: 'error', code: 'subckt-depth', message: `subcircuits nest deeper than ${this.maxDepth} levels; ${card.name.text} is not expanded` });
      return false;
    }
    return true;
  }

  /** Whether the instance's whole expansion fits in the flattened size; a finding on it when not. */
  private fits(card: InstanceCard, frame: Frame, work: Work, def: SubcktDef, subckt: string): boolean {
    const size = this.sizer.sizeOf(def, work.defs, [...work.path, subckt]);
    if (this.recording && work.path.length === 0) this.recording.size = size;
    // Unknown (the counting budget is spent): the running count in `charge` still stops the expansion.
    if (size === undefined || this.charged + size <= this.maxElements) return true;
    const cards = size > this.maxElements ? `more than ${this.maxElements}` : String(size);
    this.sink.add({
      uri: frame.uri, span: card.name.span, severity: 'error', code: 'circuit-too-large',
      message: `with ${card.name.text} (${cards} cards once expanded) the flattened circuit passes ${this.maxElements} elements (limit: flattened size); ${card.name.text} is not expanded and nothing inside it is analysed`,
    });
    return false;
  }

  private bodyOf(def: SubcktDef): PlacedItem[] {
    return (def.body ??= this.expander.expand(def.block.body, def.uri, [def.uri]));
  }

  private subcktsOf(def: SubcktDef): Map<string, SubcktDef> {
    return (def.own ??= this.defineSubckts(this.bodyOf(def)));
  }

  /** The scope of a new instance: ports, parameters, local models and definitions. */
  private enter(card: InstanceCard, frame: Frame, work: Work, def: SubcktDef, global: Lookup): Work {
    const header = def.block.header;
    const body = this.bodyOf(def);
    this.charge(body.length, frame.uri, card.span);
    if (header.ports.length !== card.nodes.length) {
      this.sink.add({ uri: frame.uri, span: card.name.span, severity: 'error', code: 'port-count', message: `${card.name.text} connects ${card.nodes.length} nodes but '${header.name?.text}' has ${header.ports.length} ports` });
    }
    const ports = new Map<string, string>();
    header.ports.forEach((p, i) => {
      const outer = card.nodes[i];
      if (outer && !ports.has(key(p))) ports.set(key(p), terminalsOf([outer], frame)[0]!.node);
    });
    const lookup = instanceScope(
      { params: header.params, uri: def.uri },
      { params: card.params, uri: frame.uri, lookup: frame.lookup },
      (def.params ??= paramsOf(body)), global, this.sink,
    );
    const step = { name: card.name.text, subckt: key(header.name ?? card.subckt!), uri: frame.uri, span: card.span, nameSpan: card.name.span };
    const keyPrefix = `${frame.keyPrefix}${key(card.name)}.`;
    const child: Frame = {
      uri: def.uri, namePrefix: `${frame.namePrefix}${card.name.text}.`, keyPrefix, ports, lookup, chain: [...frame.chain, step],
      ...this.defineModels(body, keyPrefix, lookup, frame),
    };
    this.collectDirectives(body);
    return { items: body, next: 0, frame: child, defs: { own: this.subcktsOf(def), outer: work.defs }, path: [...work.path, step.subckt] };
  }

  private defineSubckts(items: readonly PlacedItem[]): Map<string, SubcktDef> {
    const own = new Map<string, SubcktDef>();
    for (const { item, uri } of items) {
      if (item.kind !== 'subckt-block' || !item.header.name) continue;
      const name = key(item.header.name);
      if (own.has(name)) this.sink.add({ uri, span: item.header.name.span, severity: 'warning', code: 'subckt-redefined', message: `subcircuit '${item.header.name.text}' is defined again; this definition wins` });
      own.set(name, { block: item, uri });
    }
    return own;
  }

  /** Evaluates the models of a scope; local ones get keys under the instance (`x1.dmod`). */
  private defineModels(items: readonly PlacedItem[], keyPrefix: string, lookup: Lookup, outer: Pick<Frame, 'modelKey' | 'modelNames'>): Pick<Frame, 'modelKey' | 'modelNames'> {
    const own = new Map<string, string>();
    for (const { item, uri } of items) {
      if (item.kind !== 'model' || !item.name) continue;
      const name = key(item.name);
      own.set(name, item.name.text);
      const model = modelOf(item, uri, lookup, this.sink);
      this.models.set(keyPrefix + name, model);
      if (keyPrefix !== '') this.localModels.push([keyPrefix + name, model]);
      if (this.recording && keyPrefix !== '') this.recording.models.push([keyPrefix + name, model]);
    }
    return {
      modelKey: (name) => (own.has(name) ? keyPrefix + name : outer.modelKey(name)),
      // Only asked for when a model is not found, so the names are listed then, innermost first.
      modelNames: function* () {
        yield* own.values();
        yield* outer.modelNames();
      },
    };
  }

  private collectDirectives(items: readonly PlacedItem[]): void {
    for (const { item, uri } of items) {
      if (item.kind !== 'directive' || !item.directive) continue;
      if (this.recording) this.recording.directive = true;
      const id = `${uri}#${item.span.start}`;
      if (this.seenDirectives.has(id)) continue;
      this.seenDirectives.add(id);
      this.directives.push({ uri, directive: item.directive });
    }
  }

  /** Adds to the flattened size; past the limit, elaboration stops with a finding (after `fits`, only when sizes were unknown). */
  private charge(cards: number, uri: string, span: { start: number; end: number }): void {
    this.charged += cards;
    if (this.charged <= this.maxElements || this.stopped) return;
    this.stopped = true;
    this.sink.add({ uri, span, severity: 'error', code: 'circuit-too-large', message: `the flattened circuit passes ${this.maxElements} elements; elaboration stops here` });
  }
}

/** The first item in [from, end) that was not kept (`unkept` counts them before each item), else `end`. */
function firstUnkept(unkept: Int32Array, from: number, end: number): number {
  const before = unkept[from]!;
  if (unkept[end]! === before) return end;
  // The least t in (from, end] with more unkept before it; the item at t − 1 is the first unkept one.
  let low = from + 1;
  let high = end;
  while (low < high) {
    const mid = (low + high) >>> 1;
    if (unkept[mid]! > before) high = mid;
    else low = mid + 1;
  }
  return low - 1;
}

/** Whether a block, or one nested in it, holds an `.include` or `.lib` card. */
function includesInside(block: SubcktBlock): boolean {
  const pending: Item[] = [block];
  while (pending.length) {
    const item = pending.pop()!;
    if (item.kind === 'include' || item.kind === 'lib') return true;
    if (item.kind === 'subckt-block' || item.kind === 'lib-section') pending.push(...item.body);
  }
  return false;
}

/** The names of the subcircuits visible in a scope, as written, innermost first. */
function* visibleSubckts(defs: Defs | undefined): Generator<string> {
  for (let d = defs; d; d = d.outer) {
    for (const def of d.own.values()) if (def.block.header.name) yield def.block.header.name.text;
  }
}

function paramsOf(items: readonly PlacedItem[]): PlacedParam[] {
  // A plain loop: called on every file's whole top level, where flatMap made an array per card.
  const placed: PlacedParam[] = [];
  for (const { item, uri } of items) if (item.kind === 'param') for (const param of item.params) placed.push({ param, uri });
  return placed;
}

function modelOf(card: ModelCard, uri: string, lookup: Lookup, sink: FindingSet): FlatModel {
  return {
    name: card.name!.text, type: card.type ? key(card.type) : '', uri, span: card.span,
    params: evaluateParams(card.params, lookup, uri, sink),
  };
}

function isElement(item: Item): item is Extract<Item, { kind: 'passive' | 'diode' | 'mosfet' | 'source' | 'coupling' | 'opaque' }> {
  return item.kind === 'passive' || item.kind === 'diode' || item.kind === 'mosfet' || item.kind === 'source' || item.kind === 'coupling' || item.kind === 'opaque';
}
