import { Op } from 'sequelize';
import type { RoleGrantDto } from '../../shared/schemas/role-grant.schema';
import { User, type RoleGrant } from '../db/models';

/** Role requests as the screens show them, each person named (one query for all the people involved). */
export async function toRoleGrantDtos(grants: RoleGrant[]): Promise<RoleGrantDto[]> {
  const ids = [...new Set(grants.flatMap((g) => [g.userId, g.requestedBy, ...(g.decidedBy ? [g.decidedBy] : [])]))];
  const people = new Map(
    (await User.findAll({ where: { id: { [Op.in]: ids.length ? ids : [0] } } })).map((u) => [u.id, u]),
  );
  const ref = (id: number) => ({ id, name: people.get(id)?.displayName ?? 'unknown' });
  return grants.map((g) => ({
    id: g.id,
    user: { ...ref(g.userId), username: people.get(g.userId)?.username ?? '' },
    role: g.role,
    status: g.status,
    requestedBy: ref(g.requestedBy),
    requestedAt: g.createdAt.toISOString(),
    decidedBy: g.decidedBy ? ref(g.decidedBy) : null,
    decidedAt: g.decidedAt ? g.decidedAt.toISOString() : null,
  }));
}
