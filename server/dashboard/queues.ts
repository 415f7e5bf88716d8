import { Op, literal, type WhereOptions } from 'sequelize';
import type { SessionUser } from '../../shared/schemas/auth.schema';
import { QUEUE_LABELS, type QueueDto, type QueueItem, type QueueKey } from '../../shared/schemas/queue.schema';
import { Calc, Project, Revision, User } from '../db/models';

// Only each calc's newest revision can be waiting for anyone.
const LATEST = literal('`Revision`.`seq` = (SELECT MAX(r2.seq) FROM revisions r2 WHERE r2.calc_id = `Revision`.`calc_id`)');
const notEditedBy = (userId: number) =>
  literal(`NOT EXISTS (SELECT 1 FROM calc_editors e WHERE e.calc_id = \`Revision\`.\`calc_id\` AND e.user_id = ${Number(userId)})`);

function queuesFor(user: SessionUser): Partial<Record<QueueKey, WhereOptions<Revision>>> {
  const q: Partial<Record<QueueKey, WhereOptions<Revision>>> = {};
  if (user.roles.includes('author')) {
    q['my-drafts'] = { authorId: user.id, status: 'draft' };
    q['returned-to-me'] = { authorId: user.id, status: 'returned' };
  }
  if (user.roles.includes('checker')) q['awaiting-my-check'] = { status: 'in_check', [Op.and]: [notEditedBy(user.id)] };
  if (user.roles.includes('approver')) {
    q['awaiting-my-approval'] = { status: 'checked', checkerId: { [Op.ne]: user.id }, [Op.and]: [notEditedBy(user.id)] };
  }
  return q;
}

function toItem(r: Revision & { Calc: Calc & { Project: Project }; author: User }): QueueItem {
  const since = r.status === 'in_check' ? r.submittedAt : r.status === 'checked' ? r.checkedAt : r.updatedAt;
  return {
    calcId: r.calcId, revisionId: r.id, projectCode: r.Calc.Project.code, number: r.Calc.number, title: r.Calc.title,
    revision: r.label, status: r.status, verdict: r.verdict, authorName: r.author.displayName, since: (since ?? r.updatedAt).toISOString(),
  };
}

/** What waits for this person, oldest first, per queue their roles give them. */
export async function queuesOf(user: SessionUser): Promise<QueueDto[]> {
  const entries = Object.entries(queuesFor(user)) as [QueueKey, WhereOptions<Revision>][];
  return Promise.all(entries.map(async ([key, where]) => {
    const rows = await Revision.findAll({
      where: { [Op.and]: [LATEST, where] },
      include: [{ model: Calc, include: [Project] }, { model: User, as: 'author', attributes: ['id', 'displayName'] }],
      order: [['updatedAt', 'ASC']], limit: 500,
    });
    return { key, label: QUEUE_LABELS[key], items: rows.map((r) => toItem(r as never)) };
  }));
}
