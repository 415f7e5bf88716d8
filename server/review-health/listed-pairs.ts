import { PAIR_RATES_LISTED, type HealthSettings } from '../../shared/schemas/review-health.schema';
import type { PairCount } from './check-signals';

/**
 * The author–checker pairs the screen lists: the ones with the most checks, and every pair past a threshold
 * of the settings (at least the set number of checks with no finding, or the author's main checker at or
 * above the set share). The rest stay in the CSV export; the screen says how many pairs there are in all.
 */
export function listedPairs(pairs: readonly PairCount[], settings: HealthSettings): Set<PairCount> {
  const byChecks = [...pairs].sort((a, b) => b.checks - a.checks);
  const listed = new Set(byChecks.slice(0, PAIR_RATES_LISTED));
  const authorChecks = new Map<number, number>();
  for (const p of pairs) authorChecks.set(p.authorId, (authorChecks.get(p.authorId) ?? 0) + p.checks);
  for (const p of byChecks) {
    const total = authorChecks.get(p.authorId)!;
    const silent = p.checks >= settings.silentCheckerChecks && p.findings === 0;
    const paired = total >= settings.pairingMinChecks && (p.checks / total) * 100 >= settings.pairingSharePercent;
    if (silent || paired) listed.add(p);
  }
  return listed;
}
