import { randomUUID } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { createAppAbility, defineRulesFor } from '../../../shared/authz/app-ability';
import { Project, RuleSetRecord, User, UserRole } from '../models';
import { CalcsService } from '../../calcs/calcs.service';
import { LifecycleService } from '../../calcs/lifecycle.service';
import { WorkflowService } from '../../workflow/workflow.service';
import { ReviewService } from '../../workflow/review.service';
import { FindingsService } from '../../workflow/findings.service';
import { readRevision } from '../../calcs/revision-read';
import { conveyorHeadShaft, mixerShaft, slurryPumpShaft } from './demo-shafts';
import { DEMO_PASSWORD } from '../demo-data';
import { AttachmentsService } from '../../attachments/attachments.service';
import { DEMO_CERTIFICATE, DEMO_DRAWING } from './demo-files';
import { seedIndependentModelCalc } from './demo-independent';

type Person = Awaited<ReturnType<typeof personOf>>;

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
 * Walks the invented Kestrel Fen Drives calcs through the real workflow services, so that a
 * newcomer finds every state: draft (one failing its standard), in check with an open finding,
 * returned, checked, approved and superseded. Every step leaves its audit entries and mails.
 */
export async function seedDemoCalcs(
  sequelize: Sequelize,
  baseUrl: string,
  attachments: AttachmentsService,
): Promise<void> {
  const calcs = new CalcsService(sequelize);
  const workflow = new WorkflowService(sequelize, baseUrl);
  const review = new ReviewService(sequelize, workflow);
  const findings = new FindingsService(sequelize);
  const lifecycle = new LifecycleService(sequelize, calcs);
  const [hale, okafor, lindqvist, marsh] = await Promise.all(['author', 'checker', 'approver', 'senior'].map(personOf));
  const ruleSetId = (await RuleSetRecord.findOne({
    where: { code: 'KFD-ENG-014', status: 'effective' },
    order: [['version', 'DESC']],
  }))!.id;
  const project = async (code: string) => (await Project.findOne({ where: { code } }))!.id;
  const readAs = (p: Person, id: number) => readRevision(p.ability, id);

  const start = async (
    author: Person,
    code: string,
    number: string,
    title: string,
    partRef: string,
    input: Record<string, unknown>,
  ) =>
    (
      await calcs.create(author.ability, author, {
        projectId: await project(code),
        number,
        title,
        partRef,
        ruleSetId,
        input,
      })
    ).latest.id;
  const signAs = async (p: Person, id: number, meaning: 'authored' | 'checked' | 'approved') => {
    const rev = await readAs(p, id);
    await workflow.sign(p.ability, p, id, {
      password: DEMO_PASSWORD,
      meaning,
      idempotencyKey: randomUUID(),
      lockVersion: rev.lockVersion,
    });
  };
  const tickAll = async (p: Person, id: number) => {
    for (const item of ((await readAs(p, id)).checklist as { manual?: { id: string }[] } | null)?.manual ?? []) {
      await review.setManualItem(p.ability, p, id, item.id, true, 'Seen in the demo record');
    }
  };
  // The standard's manual items ask for a drawing and a material certificate on file.
  const attachDocuments = async (p: Person, id: number) => {
    const rev = await readAs(p, id);
    const input = rev.input as { material?: { name?: string } };
    const calc = await calcs.get(p.ability, rev.calcId);
    await attachments.upload(
      p.ability,
      p,
      id,
      {
        buffer: await DEMO_DRAWING(calc.partRef, calc.title),
        originalname: `${calc.partRef.replace(/\s+/g, '-')}.pdf`,
      },
      { kind: 'drawing', note: 'Released drawing' },
    );
    await attachments.upload(
      p.ability,
      p,
      id,
      {
        buffer: await DEMO_CERTIFICATE(input.material?.name ?? 'steel', `KF-${2200 + id}`),
        originalname: `certificate-${id}.pdf`,
      },
      { kind: 'material-certificate', note: 'Mill certificate for the bar used' },
    );
  };
  const submit = async (p: Person, id: number) => {
    await attachDocuments(p, id);
    await signAs(p, id, 'authored');
  };
  const release = async (id: number, checker: Person) => {
    await submit(hale, id);
    await tickAll(checker, id);
    await signAs(checker, id, 'checked');
    await signAs(lindqvist, id, 'approved');
  };

  const pumpA = await start(hale, 'KFD-SP450', 'SP450-SH-001', 'Pump drive shaft', 'DRG SP450-2101', slurryPumpShaft());
  await release(pumpA, okafor);
  const pumpB = await lifecycle.newRevision(
    hale.ability,
    hale,
    (await readAs(hale, pumpA)).calcId,
    'Impeller seat reduced to 50 mm to suit the new impeller hub',
  );
  const pumpBRev = await readAs(hale, pumpB.id);
  await calcs.save(hale.ability, hale, pumpB.id, { input: slurryPumpShaft(50), lockVersion: pumpBRev.lockVersion });
  await release(pumpB.id, marsh);

  const head = await start(
    hale,
    'KFD-CV1200',
    'CV1200-SH-001',
    'Head pulley shaft',
    'DRG CV1200-3004',
    conveyorHeadShaft(),
  );
  await submit(hale, head);
  await findings.raiseFinding(
    okafor.ability,
    okafor,
    head,
    'Attach the Peterson chart page behind the sled-runner Kts of 1.6 and state the keyseat depth used.',
    { clauseRef: '6.5', anchorPath: 'features[1]' },
  );

  const tail = await start(
    marsh,
    'KFD-CV1200',
    'CV1200-SH-002',
    'Tail pulley shaft',
    'DRG CV1200-3010',
    conveyorHeadShaft(125),
  );
  await submit(marsh, tail);
  await tickAll(okafor, tail);
  await signAs(okafor, tail, 'checked');

  await start(
    hale,
    'KFD-MX80',
    'MX80-SH-001',
    'Agitator shaft, reduced hub seat option',
    'DRG MX80-1200 option B',
    mixerShaft(55),
  );

  const stub = await start(
    hale,
    'KFD-MX80',
    'MX80-SH-002',
    'Agitator shaft, standard hub seat',
    'DRG MX80-1200',
    mixerShaft(),
  );
  await submit(hale, stub);
  const stubRev = await readAs(okafor, stub);
  await review.returnToAuthor(
    okafor.ability,
    okafor,
    stub,
    'The impeller side load of 580 N looks low for an 80 m³ tank; show where it comes from (hydraulic side load at the design liquid level).',
    stubRev.lockVersion,
  );

  // The lifting-duty standard also asks for the proof-load test plan on file.
  const attachPlan = async (p: Person, id: number) => {
    await attachments.upload(
      p.ability,
      p,
      id,
      {
        buffer: await DEMO_DRAWING('KFD-TP-0450', 'Proof-load test plan, winch drum shaft'),
        originalname: 'proof-load-test-plan.pdf',
      },
      { kind: 'other', note: 'Proof-load test plan' },
    );
  };
  await seedIndependentModelCalc(
    sequelize,
    {
      calcs,
      review,
      findings,
      submit: async (p, id) => {
        await attachPlan(p, id);
        await submit(p, id);
      },
      tickAll,
      signAs,
    },
    hale,
    okafor,
  );
}
