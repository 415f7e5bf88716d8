import type { AppAbility } from '../../shared/authz/app-ability';
import type { CalcResult } from '../../shared/engine';
import type { Checklist, RuleSet } from '../../shared/rules';
import type { CalcDto, RevisionDto } from '../../shared/schemas/calc-dto';
import type { AttachmentDto } from '../../shared/schemas/attachment.schema';
import { Attachment, Calc, Project, Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import { REVISION_INCLUDE, toCalcDto } from '../calcs/calc-mapping';
import { readRevision } from '../calcs/revision-read';
import { toAttachmentDto } from '../attachments/attachment-access';
import { loadRuleSet } from '../rule-sets/rule-set-cache';
import { blindError } from '../independent/blind-lists';

/** Everything one calc report prints, gathered once so the layout code never queries. */
export interface ReportData {
  organisation: string;
  generatedAt: Date;
  generatedBy: string;
  verifyUrl: string;
  calc: CalcDto;
  revision: RevisionDto;
  result: CalcResult | null;
  checklist: Checklist | null;
  ruleSet: RuleSet;
  input: Record<string, unknown>;
  attachments: AttachmentDto[];
}

export interface ReportContext {
  organisation: string;
  baseUrl: string;
  generatedBy: string;
}

export async function loadReportData(ability: AppAbility, revisionId: number, ctx: ReportContext): Promise<ReportData> {
  const revision = await readRevision(ability, revisionId);
  if (revision.verification?.blind) throw blindError();
  const calc = await Calc.findByPk(revision.calcId, { include: [Project] });
  if (!calc) throw AppError.notFound(`Calc ${revision.calcId}`);
  const [revisions, attachments, ruleSet] = await Promise.all([
    Revision.findAll({ where: { calcId: calc.id }, include: REVISION_INCLUDE }),
    Attachment.findAll({ where: { revisionId }, order: [['id', 'ASC']] }),
    loadRuleSet(revision.ruleSet.id),
  ]);
  return {
    organisation: ctx.organisation,
    generatedAt: new Date(),
    generatedBy: ctx.generatedBy,
    verifyUrl: `${ctx.baseUrl}/verify/${revision.contentHash ?? ''}`,
    calc: toCalcDto(calc, revisions),
    revision,
    result: (revision.result ?? null) as CalcResult | null,
    checklist: (revision.checklist ?? null) as Checklist | null,
    ruleSet: ruleSet.doc,
    input: revision.input,
    attachments: attachments.map(toAttachmentDto),
  };
}
