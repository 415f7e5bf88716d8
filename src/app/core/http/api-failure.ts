import type { ApiError, FieldErrors } from '../../../../shared/schemas/api-error.schema';
import { fieldLabel } from '../../../../shared/engine/field-places';

const OFFLINE_MESSAGE = 'The server cannot be reached; check the connection and try again';

// zod is large and failures are rare: the shared schema is loaded with the first failure, not with the
// first page (lazy pages that validate forms have usually loaded it already).
const errorBodySchema = () => import('../../../../shared/schemas/api-error.schema').then((m) => m.apiErrorBodySchema);

/**
 * Every failed API call, as the one client error type. The error interceptor builds it once from
 * the HTTP answer (its body parsed with the shared schema), so pages and dialogs never look at
 * `HttpErrorResponse`. It is an `Error`, so a resource's `error()` holds it unchanged.
 */
export class ApiFailure extends Error implements ApiError {
  override readonly name = 'ApiFailure';

  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fieldErrors: FieldErrors = {},
    /** Whatever else the body carried, e.g. the stored record with a 409 (`current`). */
    readonly details: Readonly<Record<string, unknown>> = {},
  ) {
    super(message);
  }

  /** Reads an error answer: the server's own body when it has one, else a plain description. */
  static async fromResponse(status: number, body: unknown): Promise<ApiFailure> {
    // If even the schema cannot load (offline, chunk gone), the plain description below still holds.
    const parsed = (await errorBodySchema().catch(() => null))?.safeParse(body);
    if (parsed?.success) {
      const { code, message, fieldErrors, ...details } = parsed.data;
      return new ApiFailure(status, code, message, fieldErrors, details);
    }
    if (status === 0) return new ApiFailure(0, 'offline', OFFLINE_MESSAGE);
    return new ApiFailure(status, 'http_error', `Request failed (${status})`);
  }

  /** One line per field, named as the form names it, with its reasons; or the message alone. */
  lines(): string[] {
    const fields = Object.entries(this.fieldErrors).map(
      ([field, reasons]) => `${fieldLabel(field)}: ${reasons.join('; ')}`,
    );
    return fields.length ? fields : [this.message];
  }
}

/**
 * For `catch` blocks around API calls: an `ApiFailure` is expected and shown where it happened;
 * anything else is a bug, so it is thrown on to the app's ErrorHandler.
 */
export function assertApiFailure(error: unknown): asserts error is ApiFailure {
  if (!(error instanceof ApiFailure)) throw error;
}
