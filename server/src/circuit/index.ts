/** Elaboration: parsed files → one flat circuit with origins, and the node graph over it. */
export * from './flat-circuit';
export { elaborate, type ElaborateOptions } from './elaborate';
export { collectDependencies, listIncludeTargets, resolveIncludePath, DEFAULT_MAX_INCLUDED_CARDS, MAX_INCLUDE_DEPTH, type IncludeTarget } from './includes';
export { buildNodeGraph, nodeGraphOf, otherEnd, type Incidence, type NodeGraph } from './node-graph';
export { NextCircuitMemo } from './next-circuit-memo';
export { isRefusal, refusalCode, REFUSAL_SEVERITY, type FileText, type ReadRefusal, type ReadRefusalReason } from './file-text';
