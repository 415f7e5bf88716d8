import { ForbiddenError } from '@casl/ability';
import { Op, literal, type WhereOptions } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { Page } from '../../shared/schemas/common.schema';
import type { CalcDto } from '../../shared/schemas/calc-dto';
import type { CalcListQuery } from '../../shared/schemas/revision.schema';
import { Calc, Project, Revision } from '../db/models';
import { REVISION_INCLUDE, toCalcDto } from './calc-mapping';

// Only the newest revision of each calc decides its place in lists and queues.
const LATEST_ONLY = literal('`revisions`.`seq` = (SELECT MAX(r2.seq) FROM revisions r2 WHERE r2.calc_id = `Calc`.`id`)');

const ORDER: Record<CalcListQuery['sort'], unknown[]> = {
  number: ['number'], title: ['title'], updatedAt: [{ model: Revision, as: 'revisions' }, 'updatedAt'], status: [{ model: Revision, as: 'revisions' }, 'status'],
};

/** Calcs with their latest revision, filtered by project, latest state and text, paged on the server. */
export async function listCalcs(ability: AppAbility, query: CalcListQuery, extra: WhereOptions<Revision> = {}): Promise<Page<CalcDto>> {
  ForbiddenError.from(ability).throwUnlessCan('read', 'Calc');
  const where: WhereOptions<Calc> = {
    ...(query.projectId ? { projectId: query.projectId } : {}),
    ...(query.q ? { [Op.or]: [{ number: { [Op.like]: `%${query.q}%` } }, { title: { [Op.like]: `%${query.q}%` } }] } : {}),
  };
  const revisionWhere = { [Op.and]: [LATEST_ONLY, query.status ? { status: query.status } : {}, extra] };
  const { rows, count } = await Calc.findAndCountAll({
    where,
    include: [Project, { model: Revision, as: 'revisions', where: revisionWhere, required: true, include: REVISION_INCLUDE.filter((i) => i.as !== 'ruleSet').concat([{ ...REVISION_INCLUDE[0], attributes: ['id', 'code', 'version', 'title'] }]) }],
    order: [[...ORDER[query.sort], query.dir.toUpperCase()] as never, ['id', 'ASC']],
    offset: query.page * query.size, limit: query.size, distinct: true, subQuery: false,
  });
  const items = rows.map((calc) => toCalcDto(calc, (calc as Calc & { revisions: Revision[] }).revisions));
  return { items, total: count, page: query.page, size: query.size };
}
