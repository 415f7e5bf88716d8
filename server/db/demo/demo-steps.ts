import { randomUUID } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { createAppAbility, defineRulesFor } from '../../../shared/authz/app-ability';
import { Project, User, UserRole } from '../models';
import { CalcsService } from '../../calcs/calcs.service';
import { WorkflowService } from '../../workflow/workflow.service';
import { ReviewService } from '../../workflow/review.service';
import { FindingsService } from '../../workflow/findings.service';
import { readRevision } from '../../calcs/revision-read';
import { DEMO_PASSWORD } from '../demo-data';
import type { AttachmentsService } from '../../attachments/attachments.service';
import type { UploadFields } from '../../../shared/schemas/attachment.schema';
import { DEMO_CERTIFICATE, DEMO_DRAWING } from './demo-files';

export type Person = Awaited<ReturnType<typeof personOf>>;

/** A demo user as the services see them: actor fields and their ability. */
export async function personOf(username: string) {
  const user = await User.findOne({ where: { username }, include: [{ model: UserRole, as: 'roleRows' }] });
  if (!user) throw new Error(`demo user ${username} is missing`);
  const roles = user.roles;
  return {
    id: user.id,
    name: user.displayName,
    ip: null,
    roles,
    ability: createAppAbility(defineRulesFor({ id: user.id, roles })),
  };
}

/**
 * The demo's steps through the real services: start a calc, attach its documents, submit, tick the manual items,
 * sign. Each step is an arrow property, so a step can be handed on as a plain function.
 */
export class DemoSteps {
  readonly calcs: CalcsService;
  readonly review: ReviewService;
  readonly findings: FindingsService;
  private readonly workflow: WorkflowService;

  constructor(
    sequelize: Sequelize,
    baseUrl: string,
    private readonly attachments: AttachmentsService,
    private readonly ruleSetId: number,
  ) {
    this.calcs = new CalcsService(sequelize);
    this.workflow = new WorkflowService(sequelize, baseUrl);
    this.review = new ReviewService(sequelize, this.workflow);
    this.findings = new FindingsService(sequelize);
  }

  readAs = (p: Person, id: number) => readRevision(p.ability, id);

  /** A new calc under the demo standard; returns its first revision's id. */
  start = async (p: Person, code: string, number: string, title: string, partRef: string, input: object) => {
    const projectId = (await Project.findOne({ where: { code } }))!.id;
    const dto = {
      projectId,
      number,
      title,
      partRef,
      ruleSetId: this.ruleSetId,
      input: input as Record<string, unknown>,
    };
    return (await this.calcs.create(p.ability, p, dto)).latest.id;
  };

  signAs = async (p: Person, id: number, meaning: 'authored' | 'checked' | 'approved') => {
    const rev = await this.readAs(p, id);
    const request = { password: DEMO_PASSWORD, meaning, idempotencyKey: randomUUID(), lockVersion: rev.lockVersion };
    await this.workflow.sign(p.ability, p, id, request);
  };

  tickAll = async (p: Person, id: number) => {
    for (const item of ((await this.readAs(p, id)).checklist as { manual?: { id: string }[] } | null)?.manual ?? []) {
      await this.review.setManualItem(p.ability, p, id, item.id, true, 'Seen in the demo record');
    }
  };

  // The standard's manual items ask for a drawing and a material certificate on file.
  attachDocuments = async (p: Person, id: number) => {
    const rev = await this.readAs(p, id);
    const input = rev.input as { material?: { name?: string } };
    const calc = await this.calcs.get(p.ability, rev.calcId);
    const drawing = await DEMO_DRAWING(calc.partRef, calc.title);
    const drawingName = `${calc.partRef.replace(/\s+/g, '-')}.pdf`;
    await this.attach(p, id, drawing, drawingName, { kind: 'drawing', note: 'Released drawing' });
    const certificate = await DEMO_CERTIFICATE(input.material?.name ?? 'steel', `KF-${2200 + id}`);
    await this.attach(p, id, certificate, `certificate-${id}.pdf`, {
      kind: 'material-certificate',
      note: 'Mill certificate for the bar used',
    });
  };

  submit = async (p: Person, id: number) => {
    await this.attachDocuments(p, id);
    await this.signAs(p, id, 'authored');
  };

  /** Submitted by `author`, ticked and checked by `checker`, approved by `approver`. */
  release = async (id: number, author: Person, checker: Person, approver: Person) => {
    await this.submit(author, id);
    await this.tickAll(checker, id);
    await this.signAs(checker, id, 'checked');
    await this.signAs(approver, id, 'approved');
  };

  attach = async (p: Person, id: number, buffer: Buffer, originalname: string, fields: UploadFields) => {
    await this.attachments.upload(p.ability, p, id, { buffer, originalname }, fields);
  };
}
