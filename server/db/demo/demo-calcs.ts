import type { Sequelize } from 'sequelize';
import { RuleSetRecord } from '../models';
import { LifecycleService } from '../../calcs/lifecycle.service';
import { conveyorHeadShaft } from './demo-handling-shafts';
import { mixerShaft, slurryPumpShaft } from './demo-process-shafts';
import type { AttachmentsService } from '../../attachments/attachments.service';
import { DEMO_DRAWING } from './demo-files';
import { seedIndependentModelCalc } from './demo-independent';
import { DemoSteps, personOf, type Person } from './demo-steps';

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
  const [hale, okafor, lindqvist, marsh] = await Promise.all(['author', 'checker', 'approver', 'senior'].map(personOf));
  const ruleSetId = (await RuleSetRecord.findOne({
    where: { code: 'KFD-ENG-014', status: 'effective' },
    order: [['version', 'DESC']],
  }))!.id;
  const s = new DemoSteps(sequelize, baseUrl, attachments, ruleSetId);
  await seedPumpShafts(sequelize, s, hale, okafor, lindqvist, marsh);
  await seedConveyorAndMixer(s, hale, okafor, marsh);
  // The lifting-duty standard also asks for the proof-load test plan on file.
  const attachPlan = async (p: Person, id: number) => {
    const plan = await DEMO_DRAWING('KFD-TP-0450', 'Proof-load test plan, winch drum shaft');
    await s.attach(p, id, plan, 'proof-load-test-plan.pdf', { kind: 'other', note: 'Proof-load test plan' });
  };
  const submit = async (p: Person, id: number) => {
    await attachPlan(p, id);
    await s.submit(p, id);
  };
  await seedIndependentModelCalc(sequelize, { ...stepsOf(s), submit }, hale, okafor);
}

/** Revision A approved, then revision B (a smaller impeller seat) approved, superseding A. */
async function seedPumpShafts(
  sequelize: Sequelize,
  s: DemoSteps,
  hale: Person,
  okafor: Person,
  lindqvist: Person,
  marsh: Person,
): Promise<void> {
  const lifecycle = new LifecycleService(sequelize, s.calcs);
  const pumpA = await s.start(
    hale,
    'KFD-SP450',
    'SP450-SH-001',
    'Pump drive shaft',
    'DRG SP450-2101',
    slurryPumpShaft(),
  );
  await s.release(pumpA, hale, okafor, lindqvist);
  const calcId = (await s.readAs(hale, pumpA)).calcId;
  const why = 'Impeller seat reduced to 50 mm to suit the new impeller hub';
  const pumpB = await lifecycle.newRevision(hale.ability, hale, calcId, why);
  const pumpBRev = await s.readAs(hale, pumpB.id);
  await s.calcs.save(hale.ability, hale, pumpB.id, { input: slurryPumpShaft(50), lockVersion: pumpBRev.lockVersion });
  await s.release(pumpB.id, hale, marsh, lindqvist);
}

/** In check with an open finding, checked, a draft, and one returned to its author. */
async function seedConveyorAndMixer(s: DemoSteps, hale: Person, okafor: Person, marsh: Person): Promise<void> {
  const head = await s.start(
    hale,
    'KFD-CV1200',
    'CV1200-SH-001',
    'Head pulley shaft',
    'DRG CV1200-3004',
    conveyorHeadShaft(),
  );
  await s.submit(hale, head);
  await s.findings.raiseFinding(
    okafor.ability,
    okafor,
    head,
    'Attach the Peterson chart page behind the sled-runner Kts of 1.6 and state the keyseat depth used.',
    { clauseRef: '6.5', anchorPath: 'features[1]' },
  );
  const tail = await s.start(
    marsh,
    'KFD-CV1200',
    'CV1200-SH-002',
    'Tail pulley shaft',
    'DRG CV1200-3010',
    conveyorHeadShaft(125),
  );
  await s.submit(marsh, tail);
  await s.tickAll(okafor, tail);
  await s.signAs(okafor, tail, 'checked');
  const optionB = 'Agitator shaft, reduced hub seat option';
  await s.start(hale, 'KFD-MX80', 'MX80-SH-001', optionB, 'DRG MX80-1200 option B', mixerShaft(55));
  const stub = await s.start(
    hale,
    'KFD-MX80',
    'MX80-SH-002',
    'Agitator shaft, standard hub seat',
    'DRG MX80-1200',
    mixerShaft(),
  );
  await s.submit(hale, stub);
  const stubRev = await s.readAs(okafor, stub);
  await s.review.returnToAuthor(
    okafor.ability,
    okafor,
    stub,
    'The impeller side load of 580 N looks low for an 80 m³ tank; show where it comes from ' +
      '(hydraulic side load at the design liquid level).',
    stubRev.lockVersion,
  );
}

function stepsOf(s: DemoSteps) {
  return { calcs: s.calcs, review: s.review, findings: s.findings, tickAll: s.tickAll, signAs: s.signAs };
}
