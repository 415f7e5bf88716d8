import { z } from 'zod';
import { topConditionSchema } from './condition-schema';
import { verificationSchema } from './verification-schema';

/*
 * Rule-set document, format v1: a versioned design standard owned by compliance. Limits live in
 * `parameters` so compliance can tune numbers without touching conditions; conditions compare facts
 * (fact-registry.ts) in SI units. Cross-field rules (known facts, parameter types, unique ids) are
 * checked by validateRuleSet.
 */
const text = (max: number, description: string) => z.string().trim().min(1).max(max).meta({ description });
const identifier = /^[a-z][A-Za-z0-9]*$/;

export const SCOPES = ['shaft', 'segment', 'feature', 'support', 'load'] as const;
export type Scope = (typeof SCOPES)[number];

export const FATIGUE_CRITERIA = ['DE-Goodman', 'DE-ASME-elliptic', 'DE-Gerber', 'DE-Soderberg'] as const;
export type FatigueCriterion = (typeof FATIGUE_CRITERIA)[number];

export const methodsSchema = z.strictObject({
  filletKts: z
    .enum(['peterson', 'norton'])
    .meta({ description: 'Kts at shoulder fillets: Peterson polynomial or Norton fit' }),
  filletKt: z
    .enum(['norton', 'author'])
    .meta({ description: 'Kt at shoulder fillets: Norton fit, or a chart value the author must enter' }),
  surfaceTable: z
    .enum(['9th-10th', '11th'])
    .meta({ description: 'Edition of Shigley Table 6-2 for the surface factor ka' }),
  kfOnMidrange: z.boolean().meta({ description: 'Apply Kf, Kfs to midrange stresses' }),
  fatigueCriterion: z.enum(FATIGUE_CRITERIA).meta({ description: 'Criterion behind the fatigueSafety facts' }),
  reliability: z
    .literal([50, 90, 95, 99, 99.9, 99.99])
    .optional()
    .meta({ description: 'Reliability in % (Shigley Table 6-5) imposed on every calc; absent: the calc chooses' }),
});

export const parameterSchema = z.strictObject({
  name: z
    .string()
    .regex(identifier, 'a parameter name starts with a lower-case letter and has only letters and digits')
    .max(60),
  label: text(200, 'What the number means, for people'),
  value: z.union([z.number(), z.boolean(), z.string().max(200)]),
  unit: z
    .string()
    .max(20)
    .optional()
    .meta({ description: 'SI unit of a numeric value (MPa, mm, deg/m, deg, N·m, GPa) or "1"' }),
  origin: text(300, 'Where the value comes from: a published rule (book, edition, clause) or "house choice"'),
});

export const measureSchema = z.strictObject({
  actual: z.string().min(1).max(80).meta({ description: 'Numeric fact shown as the actual value' }),
  limit: z.string().min(1).max(80).meta({ description: 'Numeric fact, or "param:<name>", shown as the limit' }),
  unit: z.string().max(20).meta({ description: 'SI unit of the actual fact (checked against the fact registry)' }),
  sense: z.enum(['at-most', 'at-least']),
});

export const clauseSchema = z.strictObject({
  id: z
    .string()
    .regex(/^[A-Za-z0-9][A-Za-z0-9.-]*$/, 'a clause id has letters, digits, dots and dashes, e.g. "4.2"')
    .max(20),
  title: text(200, 'Short title'),
  text: text(4000, 'Clause text; names the origin of each numeric limit'),
  severity: z.enum(['mandatory', 'advisory']),
  scope: z.enum(SCOPES),
  applicability: topConditionSchema.meta({ description: 'Where the clause applies (json-rules-engine conditions)' }),
  check: topConditionSchema.meta({ description: 'What must hold where it applies (json-rules-engine conditions)' }),
  measure: measureSchema.optional(),
  materialScope: z
    .literal('steel')
    .optional()
    .meta({ description: 'Written for steel: other materials get a warning' }),
});

export const manualItemSchema = z.strictObject({
  id: z
    .string()
    .regex(/^[a-z][a-z0-9-]*$/, 'a manual item id is lower-case kebab-case')
    .max(60),
  text: text(500, 'What the checker confirms'),
  requiresAttachment: z.enum(['drawing', 'material-certificate', 'other']).optional(),
});

export const ruleSetSchema = z
  .strictObject({
    $schema: z.string().optional(),
    code: z
      .string()
      .regex(/^[A-Z0-9][A-Z0-9-]*$/, 'a code has capitals, digits and dashes, e.g. "KFD-ENG-014"')
      .max(40),
    title: text(200, 'Title of the standard'),
    version: z.int().min(1).max(9999),
    status: z.enum(['draft', 'effective', 'retired']),
    effectiveDate: z.iso
      .date()
      .nullable()
      .meta({ description: 'ISO date from which the version applies; null while draft' }),
    changeSummary: text(2000, 'What changed from the previous version and why'),
    scope: text(2000, 'Which shafts and duties the standard covers'),
    methods: methodsSchema,
    parameters: z.array(parameterSchema).max(200),
    clauses: z.array(clauseSchema).min(1).max(500),
    manualItems: z.array(manualItemSchema).max(100),
    verification: verificationSchema.optional(),
  })
  .meta({ title: 'Torquetrail rule set (design standard), format v1' });

export type RuleSet = z.infer<typeof ruleSetSchema>;
export type RuleSetMethods = z.infer<typeof methodsSchema>;
export type Parameter = z.infer<typeof parameterSchema>;
export type Clause = z.infer<typeof clauseSchema>;
export type Measure = z.infer<typeof measureSchema>;
export type ManualItem = z.infer<typeof manualItemSchema>;
export type Severity = Clause['severity'];
