import { z } from 'zod';
import { cursorSchema, decimalId } from './common.schema';
import type { HealthSettings } from './health-settings.schema';

// The thresholds' schemas live in health-settings.schema.ts; importers of the report's schema get them here too.
export {
  HEALTH_SETTING_FIELDS,
  healthSettingsSchema,
  updateHealthSettingsSchema,
  type HealthSettingKey,
  type HealthSettings,
  type HealthSettingsDto,
  type UpdateHealthSettings,
} from './health-settings.schema';

const day = z.iso.date({ error: 'must be a date (YYYY-MM-DD)' });
export const MAX_PERIOD_DAYS = 3660;

const periodFields = {
  projectId: decimalId('a project').optional(),
  from: day,
  to: day,
};
type Period = { from: string; to: string };
const periodRules = <T extends z.ZodType<Period>>(schema: T) =>
  schema
    .refine((q) => q.from <= q.to, { message: 'must not be after To', path: ['from'] })
    .refine((q) => Date.parse(q.to) - Date.parse(q.from) <= MAX_PERIOD_DAYS * 86_400_000, {
      message: `the period may span at most ${MAX_PERIOD_DAYS} days`,
      path: ['to'],
    });

/** One project (or all) and a period of UTC days, both ends included. */
export const healthQuerySchema = periodRules(z.object(periodFields));
export type HealthQuery = z.infer<typeof healthQuerySchema>;

/** Rows of each signal in the report; the screen asks for the next pages one signal at a time. */
export const SIGNAL_PAGE = 25;
export const SIGNAL_PAGE_MAX = 100;

/** The next page of one signal's rows: the report's period and project, and the `next` cursor it gave. */
export const signalPageQuerySchema = periodRules(
  z.object({
    ...periodFields,
    after: cursorSchema,
    size: z.coerce
      .number({ error: `must be a whole number from 1 to ${SIGNAL_PAGE_MAX}` })
      .int(`must be a whole number from 1 to ${SIGNAL_PAGE_MAX}`)
      .min(1, `must be a whole number from 1 to ${SIGNAL_PAGE_MAX}`)
      .max(SIGNAL_PAGE_MAX, `must be a whole number from 1 to ${SIGNAL_PAGE_MAX}`)
      .default(SIGNAL_PAGE),
  }),
);
export type SignalPageQuery = z.infer<typeof signalPageQuerySchema>;

export const SIGNAL_KEYS = [
  'quick-check',
  'no-findings',
  'pairing',
  'refusals',
  'attachments-after-check',
  'replaced-standard',
  'verdict-flip',
] as const;
export type SignalKey = (typeof SIGNAL_KEYS)[number];
export const signalKeyParamsSchema = z.object({
  key: z.enum(SIGNAL_KEYS, { error: `must be one of ${SIGNAL_KEYS.join(', ')}` }),
});

/** A page of one signal's rows: `total` counts them all (from the cursor on), `next` continues the list. */
export interface SignalPage {
  key: SignalKey;
  rows: SignalRow[];
  total: number;
  next: string | null;
}

/** A link to the audit trail, as the audit screen's own filters (query parameters of /audit). */
export interface AuditLink {
  label: string;
  query: Record<string, string>;
}

/** One observed fact, worded neutrally, with the trail entries behind it. */
export interface SignalRow {
  signal: SignalKey;
  fact: string;
  projectCode: string | null;
  calcId: number | null;
  calcNumber: string | null;
  revision: string | null;
  people: string;
  /** When the fact was observed (UTC, ISO 8601), e.g. the check signature. */
  at: string | null;
  /** The number the threshold was compared with (minutes, share, attempts, days); null when there is none. */
  measure: number | null;
  evidence: AuditLink[];
}

export interface FindingRate {
  checkerName: string;
  authorName: string | null;
  checks: number;
  checksWithFindings: number;
  findings: number;
}

/** The screen lists this many author–checker pairs with the most checks, plus every pair past a threshold. */
export const PAIR_RATES_LISTED = 50;

export interface HealthReport {
  from: string;
  to: string;
  project: { id: number; code: string } | null;
  settings: HealthSettings;
  /** Each signal's first page (SIGNAL_PAGE rows; every row in the CSV export), its total and the next cursor. */
  signals: SignalPage[];
  checkerRates: FindingRate[];
  /** On screen: the pairs that matter (see PAIR_RATES_LISTED); in the CSV export: every pair. */
  pairRates: FindingRate[];
  /** How many author–checker pairs signed checks in the period, listed or not. */
  pairRatesTotal: number;
  checksInPeriod: number;
  elapsedMs: number;
}
