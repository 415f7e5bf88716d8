import { validateRuleSet, type RuleSet } from '../../../../shared/rules';
import type { ApiError } from '../../../../shared/schemas/api-error.schema';

export interface RuleSetProblem {
  text: string;
  tab: number;
}

// Tabs of the standard's page: Clauses (with title, change summary, scope), Parameters, Methods and manual items, JSON.
const TOP: Record<string, [label: string, tab: number]> = {
  title: ['Title (Clauses tab)', 0],
  changeSummary: ['What changes in this version (Clauses tab)', 0],
  scope: ['Scope (Clauses tab)', 0],
  code: ['Code', 3],
  version: ['Version', 3],
  effectiveDate: ['Effective date', 3],
  methods: ['Methods (Methods and manual items tab)', 2],
};
const CLAUSE_FIELDS: Record<string, string> = {
  title: 'title',
  text: 'clause text',
  severity: 'severity',
  id: 'number',
  check: 'check',
  applicability: 'where it applies',
  measure: 'measure',
};

/** "document.clauses[2].text" → "§4.2 clause text", on the tab where that field is edited. */
export function ruleSetPlace(path: string, doc: RuleSet | null): { label: string; tab: number } {
  const p = path.replace(/^(body\.)?(document\.)?/, '');
  const clause = /^clauses\[(\d+)\](?:\.(\w+))?/.exec(p);
  if (clause) {
    const id = doc?.clauses[Number(clause[1])]?.id;
    return {
      label: `${id ? `§${id}` : `clause ${Number(clause[1]) + 1}`}${clause[2] ? ` ${CLAUSE_FIELDS[clause[2]] ?? clause[2]}` : ''} (Clauses tab)`,
      tab: 0,
    };
  }
  const param = /^parameters\[(\d+)\](?:\.(\w+))?/.exec(p);
  if (param) {
    const name = doc?.parameters[Number(param[1])]?.name;
    return {
      label: `parameter ${name ?? Number(param[1]) + 1}${param[2] ? ` ${param[2]}` : ''} (Parameters tab)`,
      tab: 1,
    };
  }
  const item = /^manualItems\[(\d+)\]/.exec(p);
  if (item) return { label: `manual item ${Number(item[1]) + 1} (Methods and manual items tab)`, tab: 2 };
  const [label, tab] = TOP[p.split(/[.[]/)[0]] ?? [p, 3];
  return { label, tab };
}

/** A refused save as lines in the screen's words; zod's "at least 1 characters" becomes "is empty". */
export function ruleSetProblems(f: ApiError, doc: RuleSet | null): RuleSetProblem[] {
  const fields = Object.entries(f.fieldErrors);
  if (!fields.length) return [{ text: f.message, tab: -1 }];
  return fields.map(([path, reasons]) => {
    const place = ruleSetPlace(path, doc);
    const why = reasons.map((r) => (/at least 1 characters?/.test(r) ? 'is empty' : r)).join('; ');
    return { text: `${place.label}: ${why}`, tab: place.tab };
  });
}

/** The JSON tab's text checked as a standard: the document, or the reader's list of what is wrong with it. */
export function checkRuleSetText(text: string, doc: RuleSet | null): { value: RuleSet | null; issues: string[] } {
  let parsed: unknown;
  try {
    parsed = JSON.parse(text);
  } catch (e) {
    return { value: null, issues: [`The text is not valid JSON: ${(e as Error).message}`] };
  }
  const result = validateRuleSet(parsed);
  if (result.ok) return { value: result.value, issues: [] };
  return {
    value: null,
    issues: result.issues.map((i) => `${ruleSetPlace(i.path, doc).label} — ${i.path}: ${i.message}`),
  };
}
