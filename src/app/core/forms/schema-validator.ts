import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import type { z } from 'zod';

/**
 * An Angular validator over one field of a shared zod schema, so a dialog checks exactly what the
 * server checks (same limits, same words) and the two cannot drift apart. The error key is
 * `schema`; its value is the first problem as a sentence starting with the field's screen label.
 * Like Angular's own validators it passes an empty value: `Validators.required` owns emptiness.
 */
export function schemaValidator(field: z.ZodType, label: string): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    if (control.value === '' || control.value === null) return null;
    const result = field.safeParse(control.value);
    return result.success ? null : { schema: `${label} ${result.error.issues[0]?.message ?? 'is not valid'}` };
  };
}
