/**
 * The settings the adapters pass into the analysis. Named once, with their manifest keys and
 * ranges, in ratings/settings.ts; validated once at the adapter boundary (validateSettings).
 */
export { DEFAULT_SETTINGS, type AnalysisSettings } from '../ratings/settings';
export { validateSettings } from '../ratings/validate-settings';
