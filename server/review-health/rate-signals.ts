import type { FindingRate, HealthSettings, SignalRow } from '../../shared/schemas/review-health.schema';
import { auditLink, periodFilter, plural, type HealthScope } from './health-scope';
import type { PairCount } from './check-signals';

type Names = ReadonlyMap<number, string>;
const nameOf = (names: Names, id: number) => names.get(id) ?? `person ${id}`;

function sum(rows: readonly PairCount[]): Omit<PairCount, 'checkerId' | 'authorId'> {
  return rows.reduce(
    (a, r) => ({
      checks: a.checks + r.checks,
      withFindings: a.withFindings + r.withFindings,
      findings: a.findings + r.findings,
    }),
    { checks: 0, withFindings: 0, findings: 0 },
  );
}

function groupBy<K>(rows: readonly PairCount[], key: (r: PairCount) => K): Map<K, PairCount[]> {
  const out = new Map<K, PairCount[]>();
  for (const r of rows) {
    const k = key(r);
    const group = out.get(k);
    if (group) group.push(r);
    else out.set(k, [r]);
  }
  return out;
}

const byChecks = (a: FindingRate, b: FindingRate) => b.checks - a.checks || a.checkerName.localeCompare(b.checkerName);

/** Finding rates per checker and per author–checker pair (all, or only the `listed` ones), most checks first. */
export function findingRates(
  pairs: readonly PairCount[],
  names: Names,
  listed?: ReadonlySet<PairCount>,
): { checkers: FindingRate[]; pairs: FindingRate[] } {
  const checkers = [...groupBy(pairs, (p) => p.checkerId)].map(([id, rows]) => ({
    checkerName: nameOf(names, id),
    authorName: null,
    ...countsOf(sum(rows)),
  }));
  const perPair = pairs
    .filter((p) => !listed || listed.has(p))
    .map((p) => ({
      checkerName: nameOf(names, p.checkerId),
      authorName: nameOf(names, p.authorId),
      ...countsOf(p),
    }));
  return { checkers: checkers.sort(byChecks), pairs: perPair.sort(byChecks) };
}

const countsOf = (c: Omit<PairCount, 'checkerId' | 'authorId'>) => ({
  checks: c.checks,
  checksWithFindings: c.withFindings,
  findings: c.findings,
});

const checkLink = (scope: HealthScope, checkerId: number, label: string) =>
  auditLink(label, { ...periodFilter(scope), userId: checkerId, action: 'revision.signed_checked' });

/** Checkers with at least the set number of checks in the period and no finding raised on any of them. */
export function silentCheckers(
  pairs: readonly PairCount[],
  names: Names,
  scope: HealthScope,
  settings: HealthSettings,
): SignalRow[] {
  return [...groupBy(pairs, (p) => p.checkerId)].flatMap(([checkerId, rows]) => {
    const total = sum(rows);
    if (total.checks < settings.silentCheckerChecks || total.findings > 0) return [];
    return [
      {
        signal: 'no-findings' as const,
        fact: `No findings raised in ${plural(total.checks, 'check')} signed from ${scope.from} to ${scope.to}`,
        projectCode: null,
        calcId: null,
        calcNumber: null,
        revision: null,
        people: `checker ${nameOf(names, checkerId)}`,
        at: null,
        measure: total.checks,
        evidence: [
          checkLink(scope, checkerId, 'Their check signatures in the period'),
          auditLink('Findings they raised', { userId: checkerId, action: 'finding.' }),
        ],
      },
    ];
  });
}

/** Authors whose checks in the period were mostly done by one checker, at or above the set share. */
export function concentratedPairs(
  pairs: readonly PairCount[],
  names: Names,
  scope: HealthScope,
  settings: HealthSettings,
): SignalRow[] {
  return [...groupBy(pairs, (p) => p.authorId)].flatMap(([authorId, rows]) => {
    const total = sum(rows).checks;
    const top = [...rows].sort((a, b) => b.checks - a.checks)[0];
    const share = Math.round((top.checks / total) * 1000) / 10;
    if (total < settings.pairingMinChecks || share < settings.pairingSharePercent) return [];
    return [
      {
        signal: 'pairing' as const,
        fact: `${top.checks} of ${plural(total, 'check')} of ${nameOf(names, authorId)}’s revisions (${share} %) signed by ${nameOf(names, top.checkerId)}`,
        projectCode: null,
        calcId: null,
        calcNumber: null,
        revision: null,
        people: `author ${nameOf(names, authorId)}; checker ${nameOf(names, top.checkerId)}`,
        at: null,
        measure: share,
        evidence: [
          checkLink(scope, top.checkerId, 'That checker’s check signatures in the period'),
          auditLink('The author’s submissions in the period', {
            ...periodFilter(scope),
            userId: authorId,
            action: 'revision.signed_authored',
          }),
        ],
      },
    ];
  });
}
