/** The findings contract (ground floor): types, ordering, the one de-duplication, `*@ allow`, lazy fixes. */
export * from './finding';
export { withLazyFixes } from './lazy-fixes';
export { FindingSet, withoutRepeats } from './finding-set';
export { allowance, allowedRegions, filterAllowed, type AllowedRegion, type DirectiveInFile } from './allow';
export { distinctFixes, type DistinctFix } from './distinct-fixes';
