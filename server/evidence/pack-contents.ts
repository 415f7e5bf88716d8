import { Op } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import { CAUTION } from '../../shared/engine';
import { Attachment, AuditEvent, Calc, Project, Revision, RuleSetRecord } from '../db/models';
import { AppError } from '../errors/app-error';
import { readRevision } from '../calcs/revision-read';
import { toAttachmentDto } from '../attachments/attachment-access';
import type { ObjectStore } from '../attachments/object-store';
import type { ReportService } from '../reports/report.service';
import type { ReportContext } from '../reports/report-data';
import { recordJson } from './record-json';
import { blindError } from '../independent/blind-lists';

export type PackFiles = Map<string, Buffer>;

const json = (value: unknown) => Buffer.from(`${JSON.stringify(value, null, 2)}\n`, 'utf8');
const safeName = (s: string) => s.replace(/[^A-Za-z0-9._-]+/g, '-').slice(0, 120);

/** Every audit row about the calc or its revisions, with the hashes that chain it. */
async function auditExcerpt(calcId: number, revisionIds: number[]) {
  const rows = await AuditEvent.findAll({
    where: {
      [Op.or]: [
        { entityType: 'Calc', entityId: String(calcId) },
        { entityType: 'Revision', entityId: { [Op.in]: revisionIds.map(String) } },
      ],
    },
    order: [['id', 'ASC']],
  });
  return rows.map((r) => ({
    id: Number(r.id),
    occurredAt: r.occurredAt.toISOString(),
    actorId: r.actorId,
    actorName: r.actorName,
    action: r.action,
    entityType: r.entityType,
    entityId: r.entityId,
    payload: r.payload,
    diff: r.diff,
    ip: r.ip,
    prevHash: r.prevHash,
    hash: r.hash,
  }));
}

/**
 * The files of a calc's evidence pack: per revision its record (JSON), its report (PDF) and its
 * attachments, plus the audit-trail excerpt. The manifest and seal are added by the caller.
 */
export async function packContents(
  ability: AppAbility,
  calcId: number,
  store: ObjectStore,
  reports: ReportService,
  ctx: ReportContext,
) {
  const calc = (await Calc.findByPk(calcId, { include: [Project] })) as (Calc & { Project: Project }) | null;
  if (!calc) throw AppError.notFound(`Calc ${calcId}`);
  const revisions = await Revision.findAll({
    where: { calcId },
    order: [['seq', 'ASC']],
    include: [{ model: RuleSetRecord, as: 'ruleSet' }],
  });
  const files: PackFiles = new Map();
  for (const revision of revisions) {
    const dir = `revisions/${safeName(revision.label)}`;
    const dto = await readRevision(ability, revision.id);
    if (dto.verification?.blind) throw blindError();
    const attachments = (await Attachment.findAll({ where: { revisionId: revision.id }, order: [['id', 'ASC']] })).map(
      (a) => ({ row: a, dto: toAttachmentDto(a), path: `${dir}/attachments/${a.id}-${safeName(a.fileName)}` }),
    );
    for (const a of attachments) files.set(a.path, await store.get(a.row.storageKey));
    files.set(`${dir}/record.json`, json(recordJson(calc, dto, revision.ruleSet ?? null, attachments)));
    files.set(`${dir}/report.pdf`, (await reports.pdf(ability, revision.id, ctx)).bytes);
  }
  const events = await auditExcerpt(
    calcId,
    revisions.map((r) => r.id),
  );
  files.set(
    'audit-trail.json',
    json({
      note: 'Rows of the hash-chained audit trail about this calc. Each hash = SHA-256(prevHash + RFC 8785 JSON of the row without id and hashes); rows of other records sit between them in the full chain.',
      events,
    }),
  );
  return { calc, files, caution: CAUTION };
}

export function readme(calcLabel: string, exportedBy: string, exportedAt: string): Buffer {
  return Buffer.from(
    [
      `Torquetrail evidence pack: ${calcLabel}`,
      `Exported ${exportedAt} by ${exportedBy}.`,
      '',
      'manifest.json     every file with its SHA-256 and size',
      'manifest.sha256   SHA-256 of manifest.json; the same value is in the audit trail (action evidence.exported)',
      'revisions/<rev>/  record.json (machine-readable record and its content), report.pdf, attachments/',
      'audit-trail.json  the audit-trail rows about this calc, each with its chain hashes',
      '',
      'To verify: upload this zip on the Verify page of Torquetrail, or recompute the hashes yourself.',
      "record.json `contentHash` = SHA-256 of the RFC 8785 canonical JSON of its `content`; each signature's",
      'contentHash must equal it for the signature to hold.',
      '',
      CAUTION,
      '',
    ].join('\n'),
    'utf8',
  );
}
