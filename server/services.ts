import type { Sequelize } from 'sequelize';
import type { Config } from './config';
import { CalcsService } from './calcs/calcs.service';
import { LifecycleService } from './calcs/lifecycle.service';
import { WorkflowService } from './workflow/workflow.service';
import { ReviewService } from './workflow/review.service';
import { FindingsService } from './workflow/findings.service';
import { RuleSetsService } from './rule-sets/rule-sets.service';
import { ImpactService } from './rule-sets/impact.service';
import { SentMailService } from './mail/sent-mail.service';
import { ObjectStore } from './attachments/object-store';
import { AttachmentsService } from './attachments/attachments.service';
import { ReportService } from './reports/report.service';
import { EvidenceService } from './evidence/evidence.service';
import { WorkPool } from './workers/work-pool';
import { PackCheckService } from './verify/pack-check.service';
import { IndependentModelService } from './independent/independent-model.service';

const MB = 1024 * 1024;

/** The services the routers share, built once per app (one object store, one worker pool). */
export function createServices(sequelize: Sequelize, config: Config) {
  const baseUrl = config.PUBLIC_URL ?? `http://${config.HOST}:${config.PORT}`;
  const calcs = new CalcsService(sequelize);
  const workflow = new WorkflowService(sequelize, baseUrl);
  const impact = new ImpactService(sequelize);
  const store = new ObjectStore(config);
  const { WORK_THREADS: threads, WORK_MEMORY_MB: memoryMb, WORK_QUEUE: queue } = config;
  const work = new WorkPool({ threads, memoryMb, queue });
  const reports = new ReportService(config.REPORT_FONT_DIR, work);
  return {
    baseUrl,
    calcs,
    workflow,
    impact,
    reports,
    lifecycle: new LifecycleService(sequelize, calcs),
    review: new ReviewService(sequelize, workflow),
    findings: new FindingsService(sequelize),
    ruleSets: new RuleSetsService(sequelize, (actor, id) => impact.notifyIfAffected(actor, id)),
    sentMail: new SentMailService(config.MAIL_FROM, config.SENT_MAIL_SCREEN),
    attachments: new AttachmentsService(sequelize, store, Math.round(config.ATTACHMENT_MAX_MB * MB)),
    evidence: new EvidenceService(sequelize, store, reports),
    independent: new IndependentModelService(sequelize),
    packs: new PackCheckService(Math.round(config.EVIDENCE_PACK_MAX_MB * MB), work),
    /** Ends the worker threads and the object store's sockets, so the process can exit by itself. */
    async close(): Promise<void> {
      store.destroy();
      await work.close();
    },
  };
}
export type Services = ReturnType<typeof createServices>;
