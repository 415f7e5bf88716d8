import { z } from 'zod';

export const oneTimeCodeSchema = z
  .string({ error: 'is required' })
  .trim()
  .regex(/^\d{6}$/, 'must be the 6 digits your authenticator app shows');

export const confirmSecondFactorSchema = z.object({ code: oneTimeCodeSchema }).strict();
export const disableSecondFactorSchema = z
  .object({ password: z.string({ error: 'is required' }).min(1, 'is required') })
  .strict();

export interface SecondFactorStatus {
  enrolled: boolean;
  /** An administrator requires a one-time code from this person when they sign. */
  required: boolean;
}

export interface SecondFactorEnrolment {
  otpauthUrl: string;
  /** The same URL as a QR code (PNG data URL) for the authenticator app to scan. */
  qrDataUrl: string;
  /** For typing in by hand when a camera is not at hand. */
  secret: string;
}
