/*
 * Torquetrail rule sets (design standards): the document format, its validation, the checklist
 * evaluation (a compiled evaluator; json-rules-engine, the reference, is in reference-checklist.ts),
 * minimum diameters and the diff between versions. Plain TypeScript: runs in server and browser.
 */
export * from './condition-schema';
export * from './rule-set-schema';
export {
  FACTS,
  factSpec,
  factUnit,
  MATERIAL_KINDS,
  FEATURE_TYPES,
  ASME_PARAMS,
  type FactSpec,
  type FactType,
  type FactQuantity,
} from './fact-registry';
export { applyRuleSetMethods, methodsUsed, type MethodsUsed, type MethodIssue } from './rule-set-methods';
export { evaluateChecklistSync } from './checklist';
export type {
  Checklist,
  ChecklistRow,
  ChecklistCounts,
  ManualRow,
  ManualState,
  RowLocation,
  RowStatus,
} from './checklist-types';
export { compileCondition, type Compiled } from './sync-evaluator';
export { LIMIT_TOLERANCE, nearlyEqual, withinLimit, TOLERANT_OPERATORS } from './limit-tolerance';
export { locationFacts, type Facts, type LocationFacts } from './facts';
export { validateRuleSet, clauseParameters, type RuleSetValidation } from './validate-rule-set';
export type { RuleSetIssue } from './rule-set-issues';
export {
  minimumDiameters,
  type MinimumDiameter,
  type MinimumDiameterOptions,
  type GoverningRow,
} from './minimum-diameter';
export { diffRuleSets, type RuleSetDiff, type ItemDiff, type FieldChange, type Change } from './rule-set-diff';
export { verificationLines } from './verification-text';
export { ruleSetJsonSchemaText } from './json-schema';
