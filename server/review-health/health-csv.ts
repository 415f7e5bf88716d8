import type { FindingRate, HealthReport, SignalRow } from '../../shared/schemas/review-health.schema';
import { HEALTH_CAUTION, SIGNAL_TEXTS } from '../../shared/review-health/signal-texts';
import { HEALTH_SETTING_FIELDS, type HealthSettingKey } from '../../shared/schemas/review-health.schema';
import { toCsv, type CsvColumn } from '../http/csv';
import { appLink } from '../mail/links';

type Line = Omit<SignalRow, 'signal'> & { title: string };

/** Evidence as absolute links to the audit screen with its filters, so a spreadsheet reader can follow them. */
const linksOf = (row: Line) =>
  row.evidence.map((e) => `${e.label}: ${appLink(`/audit?${new URLSearchParams(e.query)}`)}`).join(' | ');

const COLUMNS: CsvColumn<Line>[] = [
  { header: 'signal', value: (r) => r.title },
  { header: 'fact', value: (r) => r.fact },
  { header: 'project', value: (r) => r.projectCode },
  { header: 'calc', value: (r) => r.calcNumber },
  { header: 'revision', value: (r) => r.revision },
  { header: 'people', value: (r) => r.people },
  { header: 'observed at (UTC, ISO 8601)', value: (r) => r.at },
  { header: 'measure (minutes, checks, %, attempts or days, per signal)', value: (r) => r.measure, numeric: true },
  { header: 'audit trail entries', value: linksOf },
];

function rateLine(title: string, r: FindingRate): Line {
  const who = r.authorName ? `checker ${r.checkerName}; author ${r.authorName}` : `checker ${r.checkerName}`;
  const share = r.checks ? Math.round((r.checksWithFindings / r.checks) * 1000) / 10 : 0;
  return {
    title,
    fact: `${r.checks} checks, ${r.checksWithFindings} with findings (${share} %), ${r.findings} findings in all`,
    projectCode: null,
    calcId: null,
    calcNumber: null,
    revision: null,
    people: who,
    at: null,
    measure: share,
    evidence: [],
  };
}

/** One CSV: every signal row, then the finding rates, closed by the period, the thresholds and the caution. */
export function healthCsv(report: HealthReport): string {
  const lines: Line[] = [
    ...report.signals.flatMap((s) =>
      s.rows.map(({ signal, ...row }) => ({ ...row, title: SIGNAL_TEXTS[signal].title })),
    ),
    ...report.checkerRates.map((r) => rateLine('Finding rate per checker', r)),
    ...report.pairRates.map((r) => rateLine('Finding rate per author and checker', r)),
  ];
  const settings = (Object.keys(HEALTH_SETTING_FIELDS) as HealthSettingKey[]).map(
    (k) => `${HEALTH_SETTING_FIELDS[k].label}: ${report.settings[k]}`,
  );
  return toCsv(COLUMNS, lines, [
    `Review-health signals for ${report.project ? `project ${report.project.code}` : 'all projects'}, ${report.from} to ${report.to} (UTC days); ${report.checksInPeriod} checks in the period`,
    `Thresholds: ${settings.join('; ')}`,
    HEALTH_CAUTION,
  ]);
}
