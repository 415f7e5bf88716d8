import type { UnitSystem } from '../engine';
import type { MethodIssue, MethodsUsed } from './rule-set-methods';
import type { ManualItem, RuleSet, Scope, Severity } from './rule-set-schema';

export type RowStatus = 'pass' | 'fail' | 'not-applicable' | 'error';

export interface RowLocation {
  scope: Scope;
  /** 0-based index into segments or features (as in the calc's paths); null for the shaft. */
  index: number | null;
  /** Station in the calc's length unit: segment start or feature station; null for the shaft. */
  at: number | null;
  /** For people, 1-based: `segment 2 "gear seat" (40–160 mm)`. */
  label: string;
}

export interface ChecklistRow {
  clauseId: string;
  clauseTitle: string;
  /** Code, version and clause: `KFD-ENG-014 v3 §4.2`. */
  reference: string;
  severity: Severity;
  status: RowStatus;
  location: RowLocation;
  /** Actual and limit in the calc's units (`unit`); null where the clause has no measure or no value. */
  actual: number | null;
  limit: number | null;
  unit: string;
  utilisation: number | null;
  /** How utilisation was formed: actual/limit for an upper limit, limit/actual for a minimum. */
  utilisationBasis: 'actual/limit' | 'limit/actual' | null;
  message: string;
  warnings: string[];
}

export interface ManualState {
  done: boolean;
  by?: string;
  note?: string;
}

export interface ManualRow {
  id: string;
  text: string;
  requiresAttachment: ManualItem['requiresAttachment'] | null;
  done: boolean;
  by: string | null;
  note: string | null;
}

export interface ChecklistCounts {
  rows: number;
  pass: number;
  fail: number;
  notApplicable: number;
  error: number;
  mandatoryFail: number;
  mandatoryError: number;
  advisoryFail: number;
  advisoryError: number;
}

export interface Checklist {
  ruleSet: Pick<RuleSet, 'code' | 'title' | 'version' | 'status' | 'effectiveDate'>;
  engineVersion: string;
  units: UnitSystem;
  methods: MethodsUsed;
  /** Methods the calc did not use as the rule set requires; any of them blocks "compliant". */
  methodIssues: MethodIssue[];
  rows: ChecklistRow[];
  manual: ManualRow[];
  /** Manual items not yet ticked; kept apart from the verdict, which judges the calc itself. */
  manualOpen: number;
  counts: ChecklistCounts;
  /** Compliant when no mandatory row fails or errors and every method is as required. */
  verdict: 'compliant' | 'not-compliant';
  verdictReasons: string[];
  notes: string[];
  caution: string;
}
