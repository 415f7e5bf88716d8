import { Op, type Sequelize } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import {
  SIGNAL_KEYS,
  SIGNAL_PAGE,
  type HealthQuery,
  type HealthReport,
  type SignalKey,
  type SignalPage,
  type SignalPageQuery,
} from '../../shared/schemas/review-health.schema';
import { Project, User } from '../db/models';
import { AppError } from '../errors/app-error';
import { accessibleWhere } from '../authz/accessible-where';
import { timed } from '../http/server-timing';
import { loadHealthSettings, settingsOf } from './health-settings.service';
import { scopeOf, type HealthScope } from './health-scope';
import { pairCounts, type PairCount } from './check-signals';
import { findingRates } from './rate-signals';
import { versionFacts } from './standard-versions';
import { listedPairs } from './listed-pairs';
import { listSignal, type SignalContext } from './signal-lists';
import { forbiddenCheck } from '../authz/forbidden-check';

/**
 * Review-health signals for one project (or every project the reader may see) and a period of UTC days.
 * Each signal is one index-backed query bound to the period; rows are facts with links to the trail.
 * The report carries each signal's count and first page; the screen pages each list on its own (`page`).
 */
export class ReviewHealthService {
  constructor(private readonly sequelize: Sequelize) {}

  /** `all` for the CSV export: every row of every signal and every author–checker pair. */
  async report(ability: AppAbility, query: HealthQuery, { all = false } = {}): Promise<HealthReport> {
    const started = Date.now();
    const { ctx, project } = await this.context(ability, query);
    const ask = { size: all ? null : SIGNAL_PAGE, after: null };
    const [signals, { pairs, names }] = await Promise.all([
      Promise.all(SIGNAL_KEYS.map(async (key) => ({ key, ...(await listSignal(key, ctx, ask)) }))),
      ctx.people(),
    ]);
    const settings = ctx.settings;
    const rates = findingRates(pairs, names, all ? undefined : listedPairs(pairs, settings));
    return {
      from: query.from,
      to: query.to,
      project,
      settings,
      signals,
      checkerRates: rates.checkers,
      pairRates: rates.pairs,
      pairRatesTotal: pairs.length,
      checksInPeriod: pairs.reduce((n, p) => n + p.checks, 0),
      elapsedMs: Date.now() - started,
    };
  }

  /** The next page of one signal's rows, after the cursor the previous page gave. */
  async page(ability: AppAbility, key: SignalKey, query: SignalPageQuery): Promise<SignalPage> {
    const { ctx } = await this.context(ability, query);
    return { key, ...(await listSignal(key, ctx, { size: query.size, after: query.after ?? null })) };
  }

  private async context(
    ability: AppAbility,
    query: HealthQuery,
  ): Promise<{ ctx: SignalContext; project: HealthReport['project'] }> {
    forbiddenCheck(ability)
      .setMessage('Review-health signals are for compliance and administrators')
      .throwUnlessCan('read', 'ReviewHealth');
    const { scope, project } = await this.scope(ability, query);
    const [row, versions] = await timed('settings', () => Promise.all([loadHealthSettings(), versionFacts()]));
    let people: Promise<{ pairs: PairCount[]; names: Map<number, string> }> | null = null;
    const ctx: SignalContext = {
      sequelize: this.sequelize,
      scope,
      settings: settingsOf(row),
      versions,
      // Read once per answer, however many per-person signals and rates ask for it.
      people: () =>
        (people ??= timed('pairs', async () => {
          const pairs = await pairCounts(this.sequelize, scope);
          return { pairs, names: await this.names(pairs.flatMap((p) => [p.checkerId, p.authorId])) };
        })),
    };
    return { ctx, project };
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
