/** The findings contract (ground floor): types, ordering, the one de-duplication, `*@ allow`, lazy fixes. */
export * from './finding';
export {
  editsKey, isFixPlan, offeredFixes, summariseOffer, verifiedFix, verifyOffer, withLazyFixes,
  type FixPlan, type OfferedFix, type OfferSummary, type Verified,
} from './lazy-fixes';
export { FindingSet, withoutRepeats } from './finding-set';
export { allowance, allowedRegions, filterAllowed, type AllowedRegion, type DirectiveInFile } from './allow';
export { distinctFixes, type DistinctFix } from './distinct-fixes';
