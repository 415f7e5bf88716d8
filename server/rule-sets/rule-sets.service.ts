import { plainSelect } from '../db/plain-query';
import type { Sequelize } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { RuleSetDto, RuleSetSummary } from '../../shared/schemas/rule-set.schema';
import { RuleSetRecord } from '../db/models';
import { columnsOf, instanceOf } from '../db/plain-rows';
import type { Actor } from '../audit/audit.service';
import { toRuleSetDto, toRuleSetSummary } from './rule-set-mapping';
import { loadRuleSet, namesOf, type Person } from './rule-set-records';
import { RuleSetDrafts } from './rule-set-drafts';
import { RuleSetPublication } from './rule-set-publication';
import { forbiddenCheck } from '../authz/forbidden-check';

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
    forbiddenCheck(ability).throwUnlessCan('read', 'RuleSet');
    // Versions due to come into force do so before the list is shown, which is then read again.
    let library = await libraryOf(this.sequelize);
    if (await this.publication.promoteDue(library.rows)) library = await libraryOf(this.sequelize);
    return library.rows.map((r) => toRuleSetSummary(r, library.names));
  }

  async get(ability: AppAbility, id: number): Promise<RuleSetDto> {
    forbiddenCheck(ability).throwUnlessCan('read', 'RuleSet');
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
  async promoteDue(): Promise<void> {
    await this.publication.promoteDue();
  }
}

let librarySql: string | undefined;

/**
 * Every version without its document (tens of kilobytes each, read one at a time when opened), with the names of
 * who proposed and confirmed it, in one plain statement: the library is read on every visit to it.
 */
async function libraryOf(sequelize: Sequelize): Promise<{ rows: RuleSetRecord[]; names: Map<number, string> }> {
  librarySql ??= `SELECT ${columnsOf(RuleSetRecord, 'r', ['document'])},
      p.display_name AS \`ctx.proposer\`, c.display_name AS \`ctx.confirmer\`
    FROM rule_sets r LEFT JOIN users p ON p.id = r.proposed_by LEFT JOIN users c ON c.id = r.confirmed_by
    ORDER BY r.code ASC, r.version DESC`;
  const found = await plainSelect<Record<string, unknown>>(sequelize, librarySql);
  const names = new Map<number, string>();
  const rows = found.map(({ 'ctx.proposer': proposer, 'ctx.confirmer': confirmer, ...row }) => {
    const record = instanceOf(RuleSetRecord, row);
    if (record.proposedBy != null && proposer != null) names.set(record.proposedBy, String(proposer));
    if (record.confirmedBy != null && confirmer != null) names.set(record.confirmedBy, String(confirmer));
    return record;
  });
  return { rows, names };
}
