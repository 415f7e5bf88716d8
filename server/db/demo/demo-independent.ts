import type { Sequelize } from 'sequelize';
import { Project, RuleSetRecord } from '../models';
import type { CalcsService } from '../../calcs/calcs.service';
import type { ReviewService } from '../../workflow/review.service';
import type { FindingsService } from '../../workflow/findings.service';
import { readRevision } from '../../calcs/revision-read';
import { IndependentModelService } from '../../independent/independent-model.service';
import { hoistDrumShaft } from './demo-handling-shafts';

import type { Person } from './demo-steps';

interface Steps {
  calcs: CalcsService;
  review: ReviewService;
  findings: FindingsService;
  submit: (p: Person, id: number) => Promise<void>;
  tickAll: (p: Person, id: number) => Promise<void>;
  signAs: (p: Person, id: number, meaning: 'authored' | 'checked') => Promise<void>;
}

/**
 * A lifting-duty calc (KFD-ENG-021 asks for an independent model) verified by alternate
 * calculation: the checker takes the far bearing's dynamic rating as 320 kN from the bearing list,
 * the author has 300 kN; the difference becomes a finding, the author answers it (the bearing
 * maker's sheet for the sealed variant gives 300 kN), the checker closes it and signs as checked. Everything is
 * invented.
 */
export async function seedIndependentModelCalc(
  sequelize: Sequelize,
  s: Steps,
  author: Person,
  checker: Person,
): Promise<void> {
  const ruleSet = await RuleSetRecord.findOne({
    where: { code: 'KFD-ENG-021', status: 'effective' },
    order: [['version', 'DESC']],
  });
  const project = await Project.findOne({ where: { code: 'KFD-CV1200' } });
  if (!ruleSet || !project) return;
  const models = new IndependentModelService(sequelize);
  const calc = await s.calcs.create(author.ability, author, {
    projectId: project.id,
    number: 'CV1200-SH-005',
    title: 'Take-up winch drum shaft (lifting duty)',
    partRef: 'DRG CV1200-3050',
    ruleSetId: ruleSet.id,
    input: hoistDrumShaft(),
  });
  const id = calc.latest.id;
  await s.submit(author, id);
  const started = await models.save(checker.ability, checker, id, hoistDrumShaft(320), 0);
  await models.lock(checker.ability, checker, id, started.lockVersion);
  const returned = await readRevision(checker.ability, id);
  await s.review.returnToAuthor(
    checker.ability,
    checker,
    id,
    'One difference between my independent model and the calc: the far bearing rating.',
    returned.lockVersion,
  );
  for (const f of (await readRevision(author.ability, id)).findings) {
    const answer =
      f.clauseRef === 'supports[1].C'
        ? "The drawing calls up the sealed variant of the far bearing; its maker's sheet gives C = 300 kN (320 kN is the open one). Calc unchanged."
        : 'The far bearing is the sealed variant with C = 300 kN (see the bearing finding); nothing to change.';
    await s.findings.answerFinding(author.ability, author, f.id, answer);
  }
  await s.signAs(author, id, 'authored');
  for (const f of (await readRevision(checker.ability, id)).findings)
    await s.findings.closeFinding(checker.ability, checker, f.id);
  await s.tickAll(checker, id);
  await s.signAs(checker, id, 'checked');
}
