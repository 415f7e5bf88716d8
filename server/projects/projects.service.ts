import { plainSelect } from '../db/plain-query';
import { subject } from '@casl/ability';
import { literal, Op, type Sequelize } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { Page, PageQuery } from '../../shared/schemas/common.schema';
import type { CreateProjectRequest, ProjectDto, UpdateProjectRequest } from '../../shared/schemas/project.schema';
import { Project } from '../db/models';
import { AppError } from '../errors/app-error';
import { accessibleWhere } from '../authz/accessible-where';
import { appendAudit, type Actor } from '../audit/audit.service';
import { runTransaction } from '../db/transaction';
import { selectSql } from '../db/plain-rows';
import { likeContaining } from '../db/like-pattern';
import { forbiddenCheck } from '../authz/forbidden-check';

/** A project row, as a model or as the plain values a list reads (`raw`: no model built per row). */
type ProjectRow = Pick<
  Project,
  'id' | 'code' | 'name' | 'client' | 'description' | 'revisionScheme' | 'status' | 'createdAt' | 'version'
>;

export function toProjectDto(p: ProjectRow): ProjectDto {
  return {
    id: p.id,
    code: p.code,
    name: p.name,
    client: p.client,
    description: p.description,
    revisionScheme: p.revisionScheme,
    status: p.status,
    createdAt: p.createdAt.toISOString(),
    version: p.version,
  };
}

const LIST_ATTRIBUTES: (keyof ProjectRow)[] = [
  'id',
  'code',
  'name',
  'client',
  'description',
  'revisionScheme',
  'status',
  'createdAt',
  'version',
];

/** Projects group calcs; admins create and archive them, everyone signed in reads the active ones. */
export class ProjectsService {
  constructor(private readonly sequelize: Sequelize) {}

  /**
   * A page of the projects this person may read, by code, with their number: one plain statement (the count rides on
   * each row as a window); only a page past the end asks for the count alone.
   */
  async list(ability: AppAbility, query: PageQuery): Promise<Page<ProjectDto>> {
    const search = query.q
      ? {
          [Op.or]: [{ code: { [Op.like]: likeContaining(query.q) } }, { name: { [Op.like]: likeContaining(query.q) } }],
        }
      : {};
    const where = { [Op.and]: [accessibleWhere(ability, 'read', 'Project'), search] };
    const sql = selectSql(Project, {
      attributes: [...LIST_ATTRIBUTES, [literal('COUNT(*) OVER ()'), 'total']],
      where,
      order: [['code', 'ASC']],
      offset: query.page * query.size,
      limit: query.size,
    });
    const rows = await plainSelect<ProjectRow & { total: number }>(this.sequelize, sql);
    const total = rows.length ? Number(rows[0].total) : query.page ? await Project.count({ where }) : 0;
    return { items: rows.map(toProjectDto), total, page: query.page, size: query.size };
  }

  async get(ability: AppAbility, id: number): Promise<ProjectDto> {
    const project = await Project.findByPk(id);
    if (!project) throw AppError.notFound(`Project ${id}`);
    forbiddenCheck(ability).throwUnlessCan('read', subject('Project', toProjectDto(project)));
    return toProjectDto(project);
  }

  async create(ability: AppAbility, actor: Actor, dto: CreateProjectRequest): Promise<ProjectDto> {
    forbiddenCheck(ability).throwUnlessCan('create', 'Project');
    if (await Project.findOne({ where: { code: dto.code } })) {
      throw new AppError('conflict', 409, `Project code ${dto.code} is already in use`, {
        fieldErrors: { code: ['is already in use'] },
      });
    }
    return runTransaction(this.sequelize, async (transaction) => {
      const project = await Project.create({ ...dto, createdBy: actor.id }, { transaction });
      await appendAudit(
        this.sequelize,
        actor,
        { action: 'project.created', entityType: 'Project', entityId: project.id, payload: dto },
        transaction,
      );
      return toProjectDto(project);
    });
  }

  async update(ability: AppAbility, actor: Actor, id: number, dto: UpdateProjectRequest): Promise<ProjectDto> {
    return runTransaction(this.sequelize, async (transaction) => {
      const project = await Project.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!project) throw AppError.notFound(`Project ${id}`);
      forbiddenCheck(ability).throwUnlessCan('update', subject('Project', toProjectDto(project)));
      if (project.version !== dto.version)
        throw AppError.conflict(`Project ${project.code} was changed by someone else; reload and try again`);
      const { version: _v, ...changes } = dto;
      const before = toProjectDto(project);
      project.set(changes);
      await project.save({ transaction });
      const after = toProjectDto(project);
      await appendAudit(
        this.sequelize,
        actor,
        { action: 'project.updated', entityType: 'Project', entityId: id, payload: { before, after } },
        transaction,
      );
      return after;
    });
  }
}
