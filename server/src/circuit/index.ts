/** Elaboration: parsed files → one flat circuit with origins, and the node graph over it. */
export * from './flat-circuit';
export { elaborate, type ElaborateOptions } from './elaborate';
export { collectDependencies, listIncludeTargets, resolveIncludePath, MAX_INCLUDE_DEPTH, type IncludeTarget } from './includes';
export { buildNodeGraph, otherEnd, type Incidence, type NodeGraph } from './node-graph';
