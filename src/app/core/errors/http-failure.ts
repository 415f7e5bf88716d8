import { HttpErrorResponse } from '@angular/common/http';
import { fieldLabel } from '../../../../shared/engine/field-places';

/** The one shape the client uses for a failed API call. */
export interface HttpFailure {
  status: number;
  code: string;
  message: string;
  fieldErrors: Record<string, string[]>;
}

export function toHttpFailure(error: unknown): HttpFailure {
  if (error instanceof HttpErrorResponse) {
    const body = (error.error ?? {}) as Partial<HttpFailure>;
    const offline = error.status === 0;
    return {
      status: error.status,
      code: body.code ?? (offline ? 'offline' : 'http_error'),
      message: body.message ?? (offline ? 'The server cannot be reached; check the connection and try again' : `Request failed (${error.status})`),
      fieldErrors: body.fieldErrors ?? {},
    };
  }
  return { status: 0, code: 'client_error', message: error instanceof Error ? error.message : String(error), fieldErrors: {} };
}

/** A failure as lines a person can read: one per field, named as the form names it, or the message alone. */
export function failureLines(f: HttpFailure): string[] {
  const fields = Object.entries(f.fieldErrors).map(([field, reasons]) => `${fieldLabel(field)}: ${reasons.join('; ')}`);
  return fields.length ? fields : [f.message];
}
