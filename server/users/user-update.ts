import { subject } from '@casl/ability';
import type { Sequelize, Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { Role } from '../../shared/authz/roles';
import type { UpdateUserRequest, UserDto } from '../../shared/schemas/user.schema';
import type { User } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { toUserDto } from './user-dto';
import type { RoleGrantsService } from './role-grants.service';
import { forbiddenCheck } from '../authz/forbidden-check';

const EDITABLE_FIELDS = ['displayName', 'email', 'secondFactorRequired'] as const;
type EditableField = (typeof EDITABLE_FIELDS)[number];

/**
 * An administrator's edit of one account (`user` locked by the caller): its fields, and its roles through the
 * second-person grants. Each field and the roles are checked against the ability separately.
 */
export async function applyUserUpdate(
  sequelize: Sequelize,
  grants: RoleGrantsService,
  { ability, actor }: { ability: AppAbility; actor: Actor },
  user: User,
  dto: UpdateUserRequest,
  transaction: Transaction,
): Promise<void> {
  const before = toUserDto(user);
  // Checked before the version and even when no field is given, so a bare `{ version }` is no back door.
  forbiddenCheck(ability).throwUnlessCan('update', subject('User', before));
  if (user.version !== dto.version)
    throw AppError.conflict(`User ${user.username} was changed by someone else; reload and try again`);
  const rolesChange = dto.roles && !sameRoles(dto.roles, [...before.roles, ...(await pendingOf(grants, user.id))]);
  if (rolesChange && actor.id === user.id)
    throw new AppError('own_roles', 403, 'Nobody changes their own roles; ask another administrator');
  const fields = EDITABLE_FIELDS.filter((f) => dto[f] !== undefined);
  assertMayChange(ability, before, fields, !!rolesChange);
  if (rolesChange) await grants.changeRoles(actor as Actor & { id: number }, user, dto.roles!, transaction);
  user.set({
    displayName: dto.displayName ?? user.displayName,
    email: dto.email ?? user.email,
    totpRequired: dto.secondFactorRequired ?? user.totpRequired,
  });
  user.changed('updatedAt', true);
  await user.save({ transaction });
  // Role changes have their own audit entries (requested, granted, removed), one per role.
  const after = { ...before, ...dto };
  const payload = { before: pick(before, fields), after: pick(after, fields) };
  if (fields.length)
    await appendAudit(
      sequelize,
      actor,
      { action: 'user.updated', entityType: 'User', entityId: user.id, payload },
      transaction,
    );
}

/** Roles asked for this person that still wait for a second person's confirmation. */
export async function pendingOf(grants: RoleGrantsService, id: number): Promise<Role[]> {
  return (await grants.pendingRolesOf([id])).get(id) ?? [];
}

function assertMayChange(ability: AppAbility, before: UserDto, fields: EditableField[], rolesChange: boolean): void {
  for (const field of [...fields, ...(rolesChange ? ['roles' as const] : [])])
    forbiddenCheck(ability).throwUnlessCan('update', subject('User', before), field);
  if (rolesChange) forbiddenCheck(ability).throwUnlessCan('assignRoles', subject('User', before));
}

function sameRoles(a: readonly Role[], b: readonly Role[]): boolean {
  return new Set(a).size === new Set(b).size && a.every((r) => b.includes(r));
}

function pick<T extends object>(obj: T, keys: readonly string[]): Partial<T> {
  return Object.fromEntries(Object.entries(obj).filter(([k]) => keys.includes(k))) as Partial<T>;
}
