import { ForbiddenError, type AnyAbility } from '@casl/ability';

/**
 * `ForbiddenError.from(ability)` with the same `setMessage` and `throwUnlessCan`, but the error is built only when
 * the check fails. CASL's `from` makes a new Error, with its stack trace captured, before it asks: about 13 µs a
 * check here, against 0.2 µs for the question itself, and a request asks one to three. The error thrown is CASL's
 * own, with the same message, so the error handler's 403 is unchanged.
 */
export function forbiddenCheck<T extends AnyAbility>(ability: T) {
  let message: string | undefined;
  const check = {
    setMessage(text: string) {
      message = text;
      return check;
    },
    throwUnlessCan(...args: Parameters<T['can']>): void {
      if ((ability.can as (...a: unknown[]) => boolean)(...args)) return;
      const error = ForbiddenError.from(ability);
      if (message !== undefined) error.setMessage(message);
      error.throwUnlessCan(...args);
    },
  };
  return check;
}
