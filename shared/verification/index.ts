/*
 * Verification by independent model (alternate calculation): the design standard's requirement,
 * and the pure comparison of the author's model with the checker's. Runs in server and browser.
 */
export { verificationSchema, type Verification, type Tolerances, type ModelScope } from '../rules/verification-schema';
export { verificationNeed, dutyTorque, type VerificationNeed } from './requirement';
export type { Comparison, ComparisonRow, CompareValue, RowGroup } from './comparison-types';
export { compareModels, describeDifference } from './compare-models';
export type { ModelRecord } from './compare-results';
export { relativeDifference } from './row-compare';
