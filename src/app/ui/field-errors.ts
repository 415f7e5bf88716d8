import type { FormGroup } from '@angular/forms';
import type { ApiError } from '../../../shared/schemas/api-error.schema';

/**
 * Puts the server's field errors onto the matching controls, so a 400 or 409 shows under the
 * field it concerns. Returns the messages that matched no control, for a form-level note.
 */
export function applyServerErrors(form: FormGroup, failure: ApiError): string[] {
  const unmatched: string[] = [];
  for (const [field, messages] of Object.entries(failure.fieldErrors)) {
    const control = form.get(field.replace(/\[\d+\]$/, ''));
    if (control) {
      control.setErrors({ server: messages.join('; ') });
      control.markAsTouched();
    } else {
      unmatched.push(`${field}: ${messages.join('; ')}`);
    }
  }
  if (Object.keys(failure.fieldErrors).length === 0) unmatched.push(failure.message);
  return unmatched;
}
