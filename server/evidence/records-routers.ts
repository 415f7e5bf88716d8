import type { Router } from 'express';
import type { Sequelize } from 'sequelize';
import type { Config } from '../config';
import { mailRouter } from '../mail/mail.router';
import { SentMailService } from '../mail/sent-mail.service';
import { ObjectStore } from '../attachments/object-store';
import { AttachmentsService } from '../attachments/attachments.service';
import { attachmentsRouter, revisionAttachmentsRouter } from '../attachments/attachments.router';
import { ReportService } from '../reports/report.service';
import { reportRouter } from '../reports/report.router';
import { verifyRouter } from '../verify/verify.router';
import { EvidenceService } from './evidence.service';
import { WorkPool } from '../workers/work-pool';
import { evidenceRouter } from './evidence.router';

const MB = 1024 * 1024;

/**
 * The routers around the sign-off (mail, attachments, reports, evidence packs, verification) and
 * the paths they mount on, for createApp. Paths repeat existing areas (`/api/revisions`): Express
 * tries each router in turn, so these only add routes.
 */
export function recordsRouters(sequelize: Sequelize, config: Config): [string, Router][] {
  const baseUrl = config.PUBLIC_URL ?? `http://${config.HOST}:${config.PORT}`;
  const store = new ObjectStore(config);
  const attachments = new AttachmentsService(sequelize, store, Math.round(config.ATTACHMENT_MAX_MB * MB));
  const work = new WorkPool({ threads: config.WORK_THREADS, memoryMb: config.WORK_MEMORY_MB, queue: config.WORK_QUEUE });
  const reports = new ReportService(config.REPORT_FONT_DIR, work);
  const evidence = new EvidenceService(sequelize, store, reports);
  return [
    ['/api/mail', mailRouter(sequelize, new SentMailService(config.MAIL_FROM, config.SENT_MAIL_SCREEN))],
    ['/api/revisions', revisionAttachmentsRouter(attachments)],
    ['/api/revisions', reportRouter(reports, config.ORG_NAME, baseUrl)],
    ['/api/attachments', attachmentsRouter(attachments)],
    ['/api/calcs', evidenceRouter(evidence, config.ORG_NAME, baseUrl)],
    ['/api/verify', verifyRouter(Math.round(config.EVIDENCE_PACK_MAX_MB * MB), work)],
  ];
}
