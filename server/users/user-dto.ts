import type { User } from '../db/models';
import type { SessionUser } from '../../shared/schemas/auth.schema';
import type { UserDto } from '../../shared/schemas/user.schema';
import type { Role } from '../../shared/authz/roles';

export function toSessionUser(user: User): SessionUser {
  return { id: user.id, username: user.username, displayName: user.displayName, email: user.email, roles: user.roles };
}

export function toUserDto(user: User, pendingRoles: Role[] = []): UserDto {
  return {
    ...toSessionUser(user),
    pendingRoles,
    active: user.active,
    secondFactorRequired: user.totpRequired,
    lastSignInAt: user.lastSignInAt ? user.lastSignInAt.toISOString() : null,
    createdAt: user.createdAt.toISOString(),
    version: user.version,
  };
}
