/**
 * Recognition: a flat circuit → every rectifier in it, with its surroundings, and the near misses.
 * Matchers run from the largest pattern to the smallest and claim their devices, so a six-pulse
 * bridge is not also read as three single-phase bridges, nor a bridge leg as a half-wave.
 */
import type { LoadDirective, MainsDirective } from '../../../grammar/src/index';
import { anchorOf, type FlatCircuit, type PlacedDirective } from '../circuit/index';
import type { Finding } from '../findings/index';
import { matchBridges } from './bridge';
import { matchCentreTaps } from './centre-tap';
import { DEFAULT_RECOGNITION_STEPS, RecognizeContext } from './context';
import { deviceRef } from './devices';
import { matchDoublers } from './doubler';
import { classifyGate } from './gates';
import { matchHalfWaves } from './half-wave';
import type { Match } from './match';
import { matchNearMisses } from './near-miss';
import { noRectifierFinding } from './no-rectifier';
import type { Recognition, Rectifier } from './rectifier';
import { findSurroundings, type SurroundingDirectives } from './surroundings';
import { matchThreePhase } from './three-phase';

export * from './rectifier';
export { DEFAULT_MAINS } from './source-description';
export { DEFAULT_RECOGNITION_STEPS } from './context';
export { rippleShareOf, MAX_STRING_STAGES } from './capacitor-strings';

/**
 * Finds the rectifiers of a flat circuit. `directives` defaults to the circuit's own; the first
 * `mains` and `load` directive (the root file's first) fill what the circuit leaves open.
 */
export function recognizeRectifiers(
  flat: FlatCircuit, directives: readonly PlacedDirective[] = flat.directives, maxSteps = DEFAULT_RECOGNITION_STEPS,
): Recognition {
  const ctx = new RecognizeContext(flat, maxSteps);
  // Larger patterns first; each matcher stops once the work budget is spent, and so do the rest.
  const matches: Match[] = [...matchThreePhase(ctx), ...matchBridges(ctx)];
  const near = ctx.exhausted ? { nearMisses: [], diagnostics: [] } : matchNearMisses(ctx);
  for (const matcher of [matchCentreTaps, matchDoublers, matchHalfWaves]) {
    if (!ctx.exhausted) for (const match of matcher(ctx)) matches.push(match);
  }
  const fill = pickDirectives(directives, flat.rootUri);
  const diagnostics: Finding[] = [...near.diagnostics, ...budgetFinding(ctx), ...noRectifierFinding(ctx, matches.length + near.nearMisses.length)];
  const rectifiers = matches.map((match) => {
    const built = buildRectifier(ctx, match, fill);
    diagnostics.push(...built.diagnostics);
    return built.rectifier;
  });
  return { rectifiers, nearMisses: near.nearMisses, diagnostics };
}

function buildRectifier(ctx: RecognizeContext, match: Match, fill: SurroundingDirectives): { rectifier: Rectifier; diagnostics: Finding[] } {
  const devices = match.devices.map(({ device, role }) => {
    const ref = deviceRef(device, role);
    classifyGate(ctx.graph, device, ref, match.acNodes);
    return ref;
  });
  const anchors = devices.map((d) => anchorOf(d.origin));
  const anchor = [...anchors].sort((x, y) => Number(y.uri === ctx.flat.rootUri) - Number(x.uri === ctx.flat.rootUri) || x.span.start - y.span.start)[0]!;
  const { surroundings, diagnostics } = findSurroundings(ctx, match, fill, anchor);
  const undriven = devices.filter((d) => d.type === 'mosfet' && d.gate === 'undriven').map((d) => d.name);
  if (undriven.length) {
    diagnostics.push({ ...anchor, severity: 'info', code: 'assumed-condition', message: `nothing drives the gate of ${undriven.join(', ')}; assuming only the body diode conducts` });
  }
  const rectifier: Rectifier = {
    id: `${match.kind}:${devices.map((d) => d.key).sort()[0]}`,
    kind: match.kind, devices, acNodes: match.acNodes, dcPositive: match.dcPositive, dcNegative: match.dcNegative,
    anchor, surroundings,
  };
  if (match.doubler) rectifier.doubler = match.doubler;
  if (match.mixed) rectifier.mixed = true;
  if (match.tap) rectifier.tap = match.tap;
  return { rectifier, diagnostics };
}

/** The finding when the work budget ran out: how many devices were left unchecked, on the first of them. */
function budgetFinding(ctx: RecognizeContext): Finding[] {
  if (!ctx.exhausted) return [];
  const left = ctx.devices.filter((d) => ctx.isFree(d));
  const first = left[0];
  if (!first) return [];
  return [{
    ...anchorOf(first.element.origin), severity: 'warning', code: 'limit-exceeded',
    message: `rectifier recognition stopped after ${ctx.maxSteps} steps (limit: recognition steps per analysis); ${left.length} diodes and MOSFETs in no recognised rectifier were not all checked, ${first.element.name} first, so a rectifier among them may be missing`,
  }];
}

function pickDirectives(directives: readonly PlacedDirective[], rootUri: string): SurroundingDirectives {
  const ordered = [...directives.filter((d) => d.uri === rootUri), ...directives.filter((d) => d.uri !== rootUri)];
  const mains = ordered.find((d) => d.directive.keyword === 'mains')?.directive as MainsDirective | undefined;
  const load = ordered.find((d) => d.directive.keyword === 'load')?.directive as LoadDirective | undefined;
  return { mains, load };
}
