import type { Sequelize } from 'sequelize';
import type { HealthSettings, SignalKey, SignalRow } from '../../shared/schemas/review-health.schema';
import { timed } from '../http/server-timing';
import type { HealthScope } from './health-scope';
import { quickChecks, type PairCount } from './check-signals';
import { concentratedPairs, silentCheckers } from './rate-signals';
import { refusedSignatures } from './refusal-signals';
import { attachmentsAfterCheck, replacedStandard } from './approval-signals';
import type { VersionFacts } from './standard-versions';
import { verdictFlips } from './verdict-flips';
import { memoryPage, type Listed, type PageAsk } from './signal-page';

/** What every signal list is worked out from; the pair counts and names only for the per-person signals. */
export interface SignalContext {
  sequelize: Sequelize;
  scope: HealthScope;
  settings: HealthSettings;
  versions: Map<number, VersionFacts>;
  people: () => Promise<{ pairs: PairCount[]; names: Map<number, string> }>;
}

/** Largest measure first, then by the people named, so pages of a list worked out in memory keep their order. */
const ranked = (rows: SignalRow[]) =>
  [...rows].sort((a, b) => (b.measure ?? 0) - (a.measure ?? 0) || a.people.localeCompare(b.people));

/**
 * One page of one signal. The per-revision signals page in SQL by keyset over their period index; the per-person
 * ones (one row per checker or author) are worked out whole from the pair counts and cut in memory.
 */
export function listSignal(key: SignalKey, ctx: SignalContext, ask: PageAsk): Promise<Listed> {
  const { sequelize, scope, settings, versions } = ctx;
  return timed(`signal-${key}`, async () => {
    switch (key) {
      case 'quick-check':
        return quickChecks(sequelize, scope, settings, ask);
      case 'no-findings': {
        const { pairs, names } = await ctx.people();
        return memoryPage(ranked(silentCheckers(pairs, names, scope, settings)), ask);
      }
      case 'pairing': {
        const { pairs, names } = await ctx.people();
        return memoryPage(ranked(concentratedPairs(pairs, names, scope, settings)), ask);
      }
      case 'refusals':
        return refusedSignatures(sequelize, scope, settings, ask);
      case 'attachments-after-check':
        return attachmentsAfterCheck(sequelize, scope, ask);
      case 'replaced-standard':
        return replacedStandard(sequelize, scope, settings, versions, ask);
      case 'verdict-flip':
        return verdictFlips(sequelize, scope, versions, ask);
    }
  });
}
