import { ForbiddenError, subject } from '@casl/ability';
import { Op, type Sequelize } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { Role } from '../../shared/authz/roles';
import type { Page, PageQuery } from '../../shared/schemas/common.schema';
import type { CreateUserRequest, UpdateUserRequest, UserDto } from '../../shared/schemas/user.schema';
import { User, UserRole, Session } from '../db/models';
import { AppError } from '../errors/app-error';
import { accessibleWhere } from '../authz/accessible-where';
import { appendAudit, type Actor } from '../audit/audit.service';
import { hashPassword } from '../auth/password';
import { toUserDto } from './user-dto';
import { runTransaction } from '../db/transaction';

const withRoles = { model: UserRole, as: 'roleRows' } as const;

/**
 * User administration. Accounts are never deleted and usernames never reused, so every
 * signature and audit entry keeps pointing at the person who made it.
 */
export class UsersService {
  constructor(private readonly sequelize: Sequelize) {}

  async list(ability: AppAbility, query: PageQuery): Promise<Page<UserDto>> {
    const where = accessibleWhere(ability, 'read', 'User');
    const search = query.q ? { [Op.or]: [{ username: { [Op.like]: `%${query.q}%` } }, { displayName: { [Op.like]: `%${query.q}%` } }] } : {};
    const { rows, count } = await User.findAndCountAll({
      where: { [Op.and]: [where, search] }, include: [withRoles], distinct: true,
      order: [['username', 'ASC']], offset: query.page * query.size, limit: query.size,
    });
    return { items: rows.map(toUserDto), total: count, page: query.page, size: query.size };
  }

  async get(ability: AppAbility, id: number): Promise<UserDto> {
    const user = await this.load(id);
    ForbiddenError.from(ability).throwUnlessCan('read', subject('User', toUserDto(user)));
    return toUserDto(user);
  }

  async create(ability: AppAbility, actor: Actor, dto: CreateUserRequest): Promise<UserDto> {
    ForbiddenError.from(ability).throwUnlessCan('create', 'User');
    const taken = await User.findOne({ where: { username: dto.username } });
    if (taken) throw new AppError('conflict', 409, `Username "${dto.username}" is taken (usernames are never reused)`, { fieldErrors: { username: ['is already taken'] } });
    const passwordHash = await hashPassword(dto.initialPassword);
    const id = await runTransaction(this.sequelize, async (transaction) => {
      const user = await User.create({ username: dto.username, displayName: dto.displayName, email: dto.email, passwordHash }, { transaction });
      await UserRole.bulkCreate(dto.roles.map((role) => ({ userId: user.id, role })), { transaction });
      const payload = { username: dto.username, displayName: dto.displayName, email: dto.email, roles: [...dto.roles].sort() };
      await appendAudit(this.sequelize, actor, { action: 'user.created', entityType: 'User', entityId: user.id, payload }, transaction);
      return user.id;
    });
    return toUserDto(await this.load(id));
  }

  async update(ability: AppAbility, actor: Actor, id: number, dto: UpdateUserRequest): Promise<UserDto> {
    await runTransaction(this.sequelize, async (transaction) => {
      const user = await this.load(id, transaction);
      const before = toUserDto(user);
      // Checked before the version and even when no field is given, so a bare `{ version }` is no back door.
      ForbiddenError.from(ability).throwUnlessCan('update', subject('User', before));
      if (user.version !== dto.version) throw AppError.conflict(`User ${user.username} was changed by someone else; reload and try again`);
      const fields = (['displayName', 'email', 'roles', 'secondFactorRequired'] as const).filter((f) => dto[f] !== undefined);
      for (const field of fields) ForbiddenError.from(ability).throwUnlessCan('update', subject('User', before), field);
      if (dto.roles) await this.replaceRoles(ability, user, dto.roles, transaction);
      user.set({ displayName: dto.displayName ?? user.displayName, email: dto.email ?? user.email, totpRequired: dto.secondFactorRequired ?? user.totpRequired });
      user.changed('updatedAt', true);
      await user.save({ transaction });
      const after = { ...before, ...dto, roles: dto.roles ? [...dto.roles].sort() : before.roles };
      await appendAudit(this.sequelize, actor, { action: 'user.updated', entityType: 'User', entityId: id, payload: { before: pick(before, fields), after: pick(after, fields) } }, transaction);
    });
    return toUserDto(await this.load(id));
  }

  async setActive(ability: AppAbility, actor: Actor, id: number, active: boolean): Promise<UserDto> {
    await runTransaction(this.sequelize, async (transaction) => {
      const user = await this.load(id, transaction);
      ForbiddenError.from(ability).throwUnlessCan('deactivate', subject('User', toUserDto(user)));
      if (actor.id === id && !active) throw new AppError('self_deactivation', 400, 'You cannot deactivate your own account');
      user.active = active;
      await user.save({ transaction });
      // Deactivation ends every session the person has, on every app instance.
      if (!active) await Session.destroy({ where: { userId: id }, transaction });
      await appendAudit(this.sequelize, actor, { action: active ? 'user.reactivated' : 'user.deactivated', entityType: 'User', entityId: id, payload: { username: user.username } }, transaction);
    });
    return toUserDto(await this.load(id));
  }

  private async replaceRoles(ability: AppAbility, user: User, roles: Role[], transaction: import('sequelize').Transaction) {
    ForbiddenError.from(ability).throwUnlessCan('assignRoles', subject('User', toUserDto(user)));
    await UserRole.destroy({ where: { userId: user.id }, transaction });
    await UserRole.bulkCreate(roles.map((role) => ({ userId: user.id, role })), { transaction });
  }

  private async load(id: number, transaction?: import('sequelize').Transaction): Promise<User> {
    const user = await User.findByPk(id, { include: [withRoles], transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
    if (!user) throw AppError.notFound(`User ${id}`);
    return user;
  }
}

function pick<T extends object>(obj: T, keys: readonly string[]): Partial<T> {
  return Object.fromEntries(Object.entries(obj).filter(([k]) => keys.includes(k))) as Partial<T>;
}
