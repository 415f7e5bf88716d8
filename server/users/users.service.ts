import { subject } from '@casl/ability';
import { Op, type Sequelize, type Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { Page, PageQuery } from '../../shared/schemas/common.schema';
import type { CreateUserRequest, UpdateUserRequest, UserDto } from '../../shared/schemas/user.schema';
import { User, UserRole, Session } from '../db/models';
import { AppError } from '../errors/app-error';
import { accessibleWhere } from '../authz/accessible-where';
import { appendAudit, type Actor } from '../audit/audit.service';
import { hashPassword } from '../auth/password';
import { toUserDto } from './user-dto';
import { applyUserUpdate, pendingOf } from './user-update';
import { RoleGrantsService } from './role-grants.service';
import { runTransaction } from '../db/transaction';
import { likeContaining } from '../db/like-pattern';
import { forbiddenCheck } from '../authz/forbidden-check';

const withRoles = { model: UserRole, as: 'roleRows' } as const;

/**
 * User administration. Accounts are never deleted and usernames never reused, so every
 * signature and audit entry keeps pointing at the person who made it.
 */
export class UsersService {
  private readonly grants: RoleGrantsService;

  constructor(private readonly sequelize: Sequelize) {
    this.grants = new RoleGrantsService(sequelize);
  }

  async list(ability: AppAbility, query: PageQuery): Promise<Page<UserDto>> {
    const where = accessibleWhere(ability, 'read', 'User');
    const search = query.q
      ? {
          [Op.or]: [
            { username: { [Op.like]: likeContaining(query.q) } },
            { displayName: { [Op.like]: likeContaining(query.q) } },
          ],
        }
      : {};
    const { rows, count } = await User.findAndCountAll({
      where: { [Op.and]: [where, search] },
      include: [withRoles],
      distinct: true,
      order: [['username', 'ASC']],
      offset: query.page * query.size,
      limit: query.size,
    });
    const pending = await this.grants.pendingRolesOf(rows.map((u) => u.id));
    return {
      items: rows.map((u) => toUserDto(u, pending.get(u.id))),
      total: count,
      page: query.page,
      size: query.size,
    };
  }

  async get(ability: AppAbility, id: number): Promise<UserDto> {
    const user = await this.load(id);
    forbiddenCheck(ability).throwUnlessCan('read', subject('User', toUserDto(user)));
    return this.dto(user);
  }

  async create(ability: AppAbility, actor: Actor, dto: CreateUserRequest): Promise<UserDto> {
    forbiddenCheck(ability).throwUnlessCan('create', 'User');
    const taken = await User.findOne({ where: { username: dto.username } });
    if (taken)
      throw new AppError('conflict', 409, `Username "${dto.username}" is taken (usernames are never reused)`, {
        fieldErrors: { username: ['is already taken'] },
      });
    const passwordHash = await hashPassword(dto.initialPassword);
    const id = await runTransaction(this.sequelize, async (transaction) => {
      const user = await User.create(
        { username: dto.username, displayName: dto.displayName, email: dto.email, passwordHash },
        { transaction },
      );
      const payload = {
        username: dto.username,
        displayName: dto.displayName,
        email: dto.email,
        roles: [...dto.roles].sort(),
      };
      await appendAudit(
        this.sequelize,
        actor,
        { action: 'user.created', entityType: 'User', entityId: user.id, payload },
        transaction,
      );
      // A new account is no way round the second person: its signing roles wait for confirmation too.
      user.roleRows = [];
      await this.grants.changeRoles(actor as Actor & { id: number }, user, dto.roles, transaction);
      return user.id;
    });
    return this.dto(await this.load(id));
  }

  async update(ability: AppAbility, actor: Actor, id: number, dto: UpdateUserRequest): Promise<UserDto> {
    await runTransaction(this.sequelize, async (transaction) => {
      const user = await this.load(id, transaction);
      await applyUserUpdate(this.sequelize, this.grants, { ability, actor }, user, dto, transaction);
    });
    return this.dto(await this.load(id));
  }

  async setActive(ability: AppAbility, actor: Actor, id: number, active: boolean): Promise<UserDto> {
    await runTransaction(this.sequelize, async (transaction) => {
      const user = await this.load(id, transaction);
      forbiddenCheck(ability).throwUnlessCan('deactivate', subject('User', toUserDto(user)));
      if (actor.id === id && !active)
        throw new AppError('self_deactivation', 400, 'You cannot deactivate your own account');
      user.active = active;
      await user.save({ transaction });
      // Deactivation ends every session the person has, on every app instance.
      if (!active) await Session.destroy({ where: { userId: id }, transaction });
      await appendAudit(
        this.sequelize,
        actor,
        {
          action: active ? 'user.reactivated' : 'user.deactivated',
          entityType: 'User',
          entityId: id,
          payload: { username: user.username },
        },
        transaction,
      );
    });
    return this.dto(await this.load(id));
  }

  private async dto(user: User): Promise<UserDto> {
    return toUserDto(user, await pendingOf(this.grants, user.id));
  }

  private async load(id: number, transaction?: Transaction): Promise<User> {
    const user = await User.findByPk(id, {
      include: [withRoles],
      transaction,
      lock: transaction ? transaction.LOCK.UPDATE : undefined,
    });
    if (!user) throw AppError.notFound(`User ${id}`);
    return user;
  }
}
