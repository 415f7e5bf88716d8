import { DataTypes, type QueryInterface } from 'sequelize';

const time = (allowNull = false) => ({ type: DataTypes.DATE(3), allowNull });
const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
const ref = (model: string, allowNull = false) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model, key: 'id' },
  onDelete: 'RESTRICT',
});
const json = (allowNull = false) => ({ type: DataTypes.TEXT('long'), allowNull });

export const REVISION_STATES = [
  'draft',
  'in_check',
  'returned',
  'checked',
  'approved',
  'superseded',
  'withdrawn',
] as const;

/** Design standards, calcs, revisions and their sign-off records (MariaDB DDL commits implicitly). */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('rule_sets', {
    id,
    code: { type: DataTypes.STRING(40), allowNull: false },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    title: { type: DataTypes.STRING(200), allowNull: false },
    status: { type: DataTypes.ENUM('draft', 'effective', 'retired'), allowNull: false, defaultValue: 'draft' },
    effective_date: { type: DataTypes.DATEONLY, allowNull: true },
    document: json(),
    content_hash: { type: DataTypes.CHAR(64), allowNull: false },
    created_by: ref('users', true),
    proposed_by: ref('users', true),
    confirmed_by: ref('users', true),
    lock_version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    created_at: time(),
    updated_at: time(),
  });
  await qi.addIndex('rule_sets', ['code', 'version'], { unique: true });

  await qi.createTable('calcs', {
    id,
    project_id: ref('projects'),
    number: { type: DataTypes.STRING(40), allowNull: false },
    title: { type: DataTypes.STRING(200), allowNull: false },
    part_ref: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
    created_by: ref('users'),
    created_at: time(),
    updated_at: time(),
  });
  await qi.addIndex('calcs', ['project_id', 'number'], { unique: true });

  await qi.createTable('revisions', {
    id,
    calc_id: ref('calcs'),
    seq: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    label: { type: DataTypes.STRING(8), allowNull: false },
    status: { type: DataTypes.ENUM(...REVISION_STATES), allowNull: false, defaultValue: 'draft' },
    author_id: ref('users'),
    checker_id: ref('users', true),
    approver_id: ref('users', true),
    rule_set_id: ref('rule_sets'),
    input: json(),
    result: json(true),
    checklist: json(true),
    manual_items: json(),
    verdict: { type: DataTypes.STRING(20), allowNull: true },
    content_hash: { type: DataTypes.CHAR(64), allowNull: true },
    reason_for_change: { type: DataTypes.TEXT, allowNull: false },
    lock_version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    submitted_at: time(true),
    checked_at: time(true),
    approved_at: time(true),
    created_at: time(),
    updated_at: time(),
  });
  await qi.addIndex('revisions', ['calc_id', 'seq'], { unique: true });
  await qi.addIndex('revisions', ['status']);

  // Everyone who ever edited a calc: none of them may check or approve any revision of it.
  await qi.createTable('calc_editors', {
    calc_id: { ...ref('calcs'), primaryKey: true },
    user_id: { ...ref('users'), primaryKey: true },
    first_edit_at: time(),
  });

  await qi.createTable('findings', {
    id,
    revision_id: ref('revisions'),
    clause_ref: { type: DataTypes.STRING(120), allowNull: true },
    text: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.ENUM('open', 'answered', 'closed'), allowNull: false, defaultValue: 'open' },
    raised_by: ref('users'),
    answer: { type: DataTypes.TEXT, allowNull: true },
    answered_by: ref('users', true),
    answered_at: time(true),
    closed_by: ref('users', true),
    closed_at: time(true),
    created_at: time(),
    updated_at: time(),
  });

  await qi.createTable('signatures', {
    id,
    revision_id: ref('revisions'),
    user_id: ref('users'),
    printed_name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.STRING(20), allowNull: false },
    meaning: { type: DataTypes.ENUM('authored', 'checked', 'approved'), allowNull: false },
    signed_at: time(),
    content_hash: { type: DataTypes.CHAR(64), allowNull: false },
    idempotency_key: { type: DataTypes.STRING(64), allowNull: false, unique: true },
  });
  // A revision can be signed "authored" again after a return, so uniqueness rests on the idempotency key.
  await qi.addIndex('signatures', ['revision_id', 'meaning']);

  await qi.createTable('mail_outbox', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    event: { type: DataTypes.STRING(40), allowNull: false },
    recipient: { type: DataTypes.STRING(190), allowNull: false },
    subject: { type: DataTypes.STRING(250), allowNull: false },
    body: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.ENUM('pending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
    attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    next_attempt_at: time(),
    sent_at: time(true),
    last_error: { type: DataTypes.TEXT, allowNull: true },
    created_at: time(),
  });
  await qi.addIndex('mail_outbox', ['status', 'next_attempt_at']);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const t of ['mail_outbox', 'signatures', 'findings', 'calc_editors', 'revisions', 'calcs', 'rule_sets'])
    await qi.dropTable(t);
}
