import { z } from 'zod';

/** Organisation thresholds of the review-health signals, as the settings form names them. */
export const HEALTH_SETTING_FIELDS = {
  quickCheckSecondsPerItem: { label: 'Seconds of checking per row, segment or feature', min: 1, max: 3600 },
  silentCheckerChecks: { label: 'Checks without a finding before a checker is listed', min: 2, max: 1000 },
  pairingSharePercent: { label: 'Share of one author’s checks done by one checker (%)', min: 50, max: 100 },
  pairingMinChecks: { label: 'Checks of an author before pairing is looked at', min: 2, max: 1000 },
  refusalRepeatCount: { label: 'Refused attempts that count as repeated', min: 2, max: 100 },
  replacedWithinDays: { label: 'Days before a standard version was replaced', min: 1, max: 3650 },
} as const;
export type HealthSettingKey = keyof typeof HEALTH_SETTING_FIELDS;

const setting = (key: HealthSettingKey) => {
  const { label, min, max } = HEALTH_SETTING_FIELDS[key];
  const message = `${label}: must be a whole number from ${min} to ${max.toLocaleString('en-GB')}`;
  return z.number({ error: message }).int({ error: message }).min(min, { error: message }).max(max, { error: message });
};

export const healthSettingsSchema = z.strictObject({
  quickCheckSecondsPerItem: setting('quickCheckSecondsPerItem'),
  silentCheckerChecks: setting('silentCheckerChecks'),
  pairingSharePercent: setting('pairingSharePercent'),
  pairingMinChecks: setting('pairingMinChecks'),
  refusalRepeatCount: setting('refusalRepeatCount'),
  replacedWithinDays: setting('replacedWithinDays'),
});
export type HealthSettings = z.infer<typeof healthSettingsSchema>;

export const updateHealthSettingsSchema = healthSettingsSchema.extend({
  lockVersion: z.number({ error: 'must be the version you loaded' }).int().min(0),
});
export type UpdateHealthSettings = z.infer<typeof updateHealthSettingsSchema>;

export interface HealthSettingsDto extends HealthSettings {
  lockVersion: number;
  updatedAt: string;
  updatedBy: string | null;
}
