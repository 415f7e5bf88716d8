import { ForbiddenError } from '@casl/ability';
import type { Sequelize } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { RuleSetDto, RuleSetSummary } from '../../shared/schemas/rule-set.schema';
import { RuleSetRecord } from '../db/models';
import type { Actor } from '../audit/audit.service';
import { toRuleSetDto, toRuleSetSummary } from './rule-set-mapping';
import { loadRuleSet, namesOf, type Person } from './rule-set-records';
import { RuleSetDrafts } from './rule-set-drafts';
import { RuleSetPublication } from './rule-set-publication';

/**
 * Design standards as controlled documents. Compliance drafts a new version, proposes it with an
 * effective date, and a second compliance user confirms it; effective and retired versions are frozen.
 */
export class RuleSetsService {
  private readonly drafts: RuleSetDrafts;
  private readonly publication: RuleSetPublication;

  /** `onEffective` hears of every version that comes into force (impact mail to compliance). */
  constructor(
    private readonly sequelize: Sequelize,
    onEffective?: (actor: Actor, id: number) => Promise<void>,
  ) {
    this.drafts = new RuleSetDrafts(sequelize);
    this.publication = new RuleSetPublication(sequelize, onEffective);
  }

  async list(ability: AppAbility): Promise<RuleSetSummary[]> {
    ForbiddenError.from(ability).throwUnlessCan('read', 'RuleSet');
    await this.promoteDue();
    // The library lists versions; their documents (tens of kilobytes each) are read one at a time when opened.
    const rows = await RuleSetRecord.findAll({
      attributes: { exclude: ['document'] },
      order: [
        ['code', 'ASC'],
        ['version', 'DESC'],
      ],
    });
    const names = await namesOf(rows.flatMap((r) => [r.proposedBy, r.confirmedBy]));
    return rows.map((r) => toRuleSetSummary(r, names));
  }

  async get(ability: AppAbility, id: number): Promise<RuleSetDto> {
    ForbiddenError.from(ability).throwUnlessCan('read', 'RuleSet');
    const record = await loadRuleSet(id);
    return toRuleSetDto(record, await namesOf([record.proposedBy, record.confirmedBy]));
  }

  async createDraft(ability: AppAbility, actor: Person, fromId: number): Promise<RuleSetDto> {
    return this.get(ability, await this.drafts.create(ability, actor, fromId));
  }

  async updateDraft(
    ability: AppAbility,
    actor: Person,
    id: number,
    document: Record<string, unknown>,
    lockVersion: number,
  ): Promise<RuleSetDto> {
    await this.drafts.save(ability, actor, id, document, lockVersion);
    return this.get(ability, id);
  }

  async propose(
    ability: AppAbility,
    actor: Person,
    id: number,
    effectiveDate: string,
    lockVersion: number,
  ): Promise<RuleSetDto> {
    await this.drafts.propose(ability, actor, id, effectiveDate, lockVersion);
    return this.get(ability, id);
  }

  /** The second compliance signature: a different person, with their password, makes it effective. */
  async confirm(
    ability: AppAbility,
    actor: Person,
    id: number,
    password: string,
    lockVersion: number,
  ): Promise<RuleSetDto> {
    await this.publication.confirm(ability, actor, id, password, lockVersion);
    return this.get(ability, id);
  }

  /** Puts confirmed versions whose effective date has come into force; cheap, and idempotent. */
  promoteDue(): Promise<void> {
    return this.publication.promoteDue();
  }
}
