import { PAIR_RATES_LISTED, type HealthReport } from '../../shared/schemas/review-health.schema';
import type { PairCount } from '../../server/review-health/check-signals';
import { listedPairs } from '../../server/review-health/listed-pairs';
import { findingRates } from '../../server/review-health/rate-signals';
import { healthCsv } from '../../server/review-health/health-csv';

// The screen lists the author–checker pairs that matter; the CSV export keeps every pair.
const SETTINGS = {
  quickCheckSecondsPerItem: 20,
  silentCheckerChecks: 5,
  pairingSharePercent: 75,
  pairingMinChecks: 4,
  refusalRepeatCount: 3,
  replacedWithinDays: 30,
};
// 80 pairs of distinct authors and checkers: 100 checks for the first, fewer down the list, all with findings.
const busy: PairCount[] = Array.from({ length: 80 }, (_, i) => ({
  authorId: 1000 + i,
  checkerId: 2000 + i,
  checks: 100 - i,
  withFindings: 1,
  findings: 1,
}));
// Each busy author has a second checker with as many checks, so no pair reaches the pairing share.
const second: PairCount[] = busy.map((p) => ({ ...p, checkerId: 3000 }));
const silent: PairCount = { authorId: 1, checkerId: 4, checks: 5, withFindings: 0, findings: 0 };
const silentOther: PairCount = { authorId: 1, checkerId: 8, checks: 5, withFindings: 1, findings: 1 };
const paired: PairCount = { authorId: 2, checkerId: 5, checks: 4, withFindings: 1, findings: 2 };
const quiet: PairCount = { authorId: 3, checkerId: 6, checks: 2, withFindings: 0, findings: 0 };
const quietOther: PairCount = { authorId: 3, checkerId: 7, checks: 2, withFindings: 1, findings: 1 };
const all = [...busy, ...second, silent, silentOther, paired, quiet, quietOther];
const names = new Map<number, string>();

describe('author–checker pairs on the screen', () => {
  const listed = listedPairs(all, SETTINGS);

  it('when there are more pairs than the screen lists, then the ones with the most checks are listed', () => {
    const top = [...all].sort((a, b) => b.checks - a.checks).slice(0, PAIR_RATES_LISTED);
    for (const p of top) expect(listed.has(p)).toBe(true);
    expect(listed.has(busy[79])).toBe(false);
  });

  it('when a pair with few checks passes a threshold, then it is listed too; one that passes none is not', () => {
    expect(listed.has(silent)).toBe(true);
    expect(listed.has(paired)).toBe(true);
    expect(listed.has(quiet)).toBe(false);
    expect(listed.has(silentOther)).toBe(false);
    expect(listed.size).toBe(PAIR_RATES_LISTED + 2);
  });

  it('when the rates are built for the screen, then only listed pairs are in them, most checks first', () => {
    const rates = findingRates(all, names, listed);
    expect(rates.pairs).toHaveLength(listed.size);
    expect(rates.pairs.map((r) => r.checks)).toEqual([...rates.pairs.map((r) => r.checks)].sort((a, b) => b - a));
    expect(findingRates(all, names).pairs).toHaveLength(all.length);
  });

  it('when exported, then the CSV has a line for every pair', () => {
    const report: HealthReport = {
      from: '2026-01-01',
      to: '2026-12-01',
      project: null,
      settings: SETTINGS,
      signals: [],
      checkerRates: [],
      pairRates: findingRates(all, names).pairs,
      pairRatesTotal: all.length,
      checksInPeriod: 0,
      elapsedMs: 0,
    };
    const lines = healthCsv(report).split('\r\n');
    expect(lines.filter((l) => l.startsWith('"Finding rate per author and checker"'))).toHaveLength(all.length);
  });
});
