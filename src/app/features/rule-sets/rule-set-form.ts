import { FormArray, FormControl, FormGroup, Validators } from '@angular/forms';
import type { RuleSet } from '../../../../shared/rules';

/** The parts of a draft compliance edits in the form; conditions are edited in the JSON view. */
export type ParameterForm = FormGroup<{
  name: FormControl<string>;
  label: FormControl<string>;
  value: FormControl<string>;
  unit: FormControl<string>;
  origin: FormControl<string>;
}>;
export type ClauseForm = FormGroup<{
  id: FormControl<string>;
  title: FormControl<string>;
  text: FormControl<string>;
  severity: FormControl<'mandatory' | 'advisory'>;
}>;
export type RuleSetForm = FormGroup<{
  title: FormControl<string>;
  changeSummary: FormControl<string>;
  scope: FormControl<string>;
  parameters: FormArray<ParameterForm>;
  clauses: FormArray<ClauseForm>;
}>;

const text = (value: string, max: number) =>
  new FormControl(value, { nonNullable: true, validators: [Validators.required, Validators.maxLength(max)] });

export function buildRuleSetForm(doc: RuleSet): RuleSetForm {
  return new FormGroup({
    title: text(doc.title, 200),
    changeSummary: text(doc.changeSummary ?? '', 2000),
    scope: text(doc.scope, 2000),
    parameters: new FormArray(
      doc.parameters.map(
        (p) =>
          new FormGroup({
            name: new FormControl(p.name, { nonNullable: true }),
            label: text(p.label, 200),
            // Kept as text so booleans and words survive; numbers are parsed back on save.
            value: text(String(p.value), 200),
            unit: new FormControl(p.unit ?? '', { nonNullable: true }),
            origin: text(p.origin, 300),
          }),
      ),
    ),
    clauses: new FormArray(
      doc.clauses.map(
        (c) =>
          new FormGroup({
            id: new FormControl(c.id, { nonNullable: true }),
            title: text(c.title, 200),
            text: text(c.text, 4000),
            severity: new FormControl(c.severity, { nonNullable: true }),
          }),
      ),
    ),
  });
}

function parseValue(raw: string, original: unknown): unknown {
  if (typeof original === 'number') return raw.trim() === '' ? raw : Number(raw);
  if (typeof original === 'boolean') return raw === 'true';
  return raw;
}

/** The document with the form's edits applied; validation is left to validateRuleSet. */
export function applyRuleSetForm(doc: RuleSet, form: RuleSetForm): RuleSet {
  const v = form.getRawValue();
  return {
    ...doc,
    title: v.title,
    changeSummary: v.changeSummary,
    scope: v.scope,
    parameters: doc.parameters.map((p, i) => ({
      ...p,
      label: v.parameters[i].label,
      origin: v.parameters[i].origin,
      value: parseValue(v.parameters[i].value, p.value) as never,
    })),
    clauses: doc.clauses.map((c, i) => ({
      ...c,
      title: v.clauses[i].title,
      text: v.clauses[i].text,
      severity: v.clauses[i].severity,
    })),
  };
}
