import { ForbiddenError } from '@casl/ability';
import { Op, type Sequelize } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import {
  SIGNAL_KEYS,
  type HealthQuery,
  type HealthReport,
  type SignalKey,
  type SignalRow,
} from '../../shared/schemas/review-health.schema';
import { Project, User } from '../db/models';
import { AppError } from '../errors/app-error';
import { accessibleWhere } from '../authz/accessible-where';
import { loadHealthSettings, settingsOf } from './health-settings.service';
import { ROW_CAP, scopeOf, type HealthScope } from './health-scope';
import { pairCounts, quickChecks } from './check-signals';
import { concentratedPairs, findingRates, silentCheckers } from './rate-signals';
import { refusedSignatures } from './refusal-signals';
import { attachmentsAfterCheck, replacedStandard } from './approval-signals';
import { versionFacts } from './standard-versions';
import { verdictFlips } from './verdict-flips';
import { listedPairs } from './listed-pairs';

/**
 * Review-health signals for one project (or every project the reader may see) and a period of UTC days.
 * Each signal is one index-backed query bound to the period; rows are facts with links to the trail.
 */
export class ReviewHealthService {
  constructor(private readonly sequelize: Sequelize) {}

  /** `allPairs` for the CSV export: every author–checker pair, not only those the screen lists. */
  async report(ability: AppAbility, query: HealthQuery, { allPairs = false } = {}): Promise<HealthReport> {
    const started = Date.now();
    ForbiddenError.from(ability)
      .setMessage('Review-health signals are for compliance and administrators')
      .throwUnlessCan('read', 'ReviewHealth');
    const { scope, project } = await this.scope(ability, query);
    const settings = settingsOf(await loadHealthSettings());
    const versions = await versionFacts();
    const [quick, pairs, refusals, attachments, replaced, flips] = await Promise.all([
      quickChecks(this.sequelize, scope, settings),
      pairCounts(this.sequelize, scope),
      refusedSignatures(this.sequelize, scope, settings),
      attachmentsAfterCheck(this.sequelize, scope),
      replacedStandard(this.sequelize, scope, settings, versions),
      verdictFlips(this.sequelize, scope, versions),
    ]);
    const names = await this.names(pairs.flatMap((p) => [p.checkerId, p.authorId]));
    const rates = findingRates(pairs, names, allPairs ? undefined : listedPairs(pairs, settings));
    const rows: Record<SignalKey, SignalRow[]> = {
      'quick-check': quick,
      'no-findings': silentCheckers(pairs, names, scope, settings),
      pairing: concentratedPairs(pairs, names, scope, settings),
      refusals,
      'attachments-after-check': attachments,
      'replaced-standard': replaced,
      'verdict-flip': flips,
    };
    return {
      from: query.from,
      to: query.to,
      project,
      settings,
      signals: SIGNAL_KEYS.map((key) => ({ key, rows: rows[key].slice(0, ROW_CAP), more: rows[key].length > ROW_CAP })),
      checkerRates: rates.checkers,
      pairRates: rates.pairs,
      pairRatesTotal: pairs.length,
      checksInPeriod: pairs.reduce((n, p) => n + p.checks, 0),
      elapsedMs: Date.now() - started,
    };
  }

  /** The chosen project must be one the reader may read; "all" means every project their abilities allow. */
  private async scope(
    ability: AppAbility,
    query: HealthQuery,
  ): Promise<{ scope: HealthScope; project: HealthReport['project'] }> {
    const readable = accessibleWhere(ability, 'read', 'Project');
    const unrestricted = Reflect.ownKeys(readable).length === 0;
    if (query.projectId !== undefined) {
      const project = await Project.findOne({
        where: { [Op.and]: [{ id: query.projectId }, readable] },
        attributes: ['id', 'code'],
      });
      if (!project) throw AppError.notFound(`Project ${query.projectId}`);
      return {
        scope: scopeOf(null, project.id, query.from, query.to),
        project: { id: project.id, code: project.code },
      };
    }
    const ids = unrestricted ? null : (await Project.findAll({ where: readable, attributes: ['id'] })).map((p) => p.id);
    return { scope: scopeOf(ids, undefined, query.from, query.to), project: null };
  }

  private async names(ids: number[]): Promise<Map<number, string>> {
    const unique = [...new Set(ids)];
    if (unique.length === 0) return new Map();
    const users = await User.findAll({ where: { id: { [Op.in]: unique } }, attributes: ['id', 'displayName'] });
    return new Map(users.map((u) => [u.id, u.displayName]));
  }
}
