/**
 * Ratings: rating records with their origins, their resolution from directives, parts files,
 * the built-in catalog and `.model BV`; the derating policy; preferred values; voltage bands; and
 * the choice of a replacement part. Pure functions of plain data.
 */
export * from './rating-records';
export * from './rating-origin';
export * from './rating-fields';
export * from './forward-model';
export * from './diode-catalog';
export * from './capacitor-classes';
export * from './e-series';
export * from './model-input';
export * from './parts-file-format';
export * from './parts-file-validate';
export * from './parts-file-ratings';
export * from './parts-file-text';
export * from './resolve-ratings';
export * from './derating-policy';
export * from './settings';
export * from './validate-settings';
export * from './surge-rating';
export * from './stress-checks';
export * from './select-part';
export * from './voltage-safety';
export * from './inrush-limiter';
export * from './resistor-tolerance';
export * from './capacitor-life';
export * from './project-config';
