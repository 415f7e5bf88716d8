import { toSI, type CalcInput } from '../engine';
import { torqueFromPower } from '../engine/power';
import type { Verification } from '../rules/verification-schema';

/** Which verification a calc needs, in words for the calc page and the report. */
export interface VerificationNeed {
  method: 'review' | 'independent-model';
  reason: string;
  tolerances: Verification['tolerances'] | null;
}

const percent = (f: number) => `${+(f * 100).toPrecision(3)} %`;

/** Largest external torque entry of an input, N·m: the duty level a scope compares with. */
export function dutyTorque(input: Pick<CalcInput, 'torques' | 'units'>): number {
  let largest = 0;
  for (const t of input.torques) {
    const T = 'T' in t ? t.T : torqueFromPower(t.power, t.speed, input.units);
    largest = Math.max(largest, Math.abs(toSI(T, 'torque', input.units)));
  }
  return largest;
}

/**
 * Whether the standard asks for an independent model on this calc. The duty level is read from
 * the author's input only (never their results), so telling a blind checker about it leaks nothing
 * they would not see in the duty specification. Input that cannot be read counts as in scope.
 */
export function verificationNeed(
  verification: Verification | undefined,
  code: string,
  input: unknown,
): VerificationNeed {
  if (!verification)
    return {
      method: 'review',
      reason: `${code} asks for review of the calc by an independent checker`,
      tolerances: null,
    };
  const t = verification.tolerances;
  const within = `inputs equal within ${percent(t.inputs)} after unit conversion, results within ${percent(t.results)}`;
  const model = (why: string): VerificationNeed => ({
    method: 'independent-model',
    reason: `${code} asks for an independent model ${why}: ${within}`,
    tolerances: t,
  });
  if (verification.scope.kind === 'all') return model('for every calc');
  const level = verification.scope.value;
  const duty = readableDuty(input);
  if (duty === null || duty >= level) return model(`for calcs with a torque of ${level} N·m or more`);
  return {
    method: 'review',
    reason: `${code} asks for an independent model only from ${level} N·m; this calc's largest torque is below it, so review applies`,
    tolerances: null,
  };
}

function readableDuty(input: unknown): number | null {
  const i = input as Partial<CalcInput> | null;
  if (!i || !Array.isArray(i.torques) || (i.units !== 'SI' && i.units !== 'US')) return null;
  try {
    const d = dutyTorque(i as CalcInput);
    return Number.isFinite(d) ? d : null;
  } catch {
    return null;
  }
}
