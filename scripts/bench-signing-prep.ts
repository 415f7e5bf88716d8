// Revisions for the signing benchmark, made through the API as the product's own client makes them (a session
// cookie and its CSRF token on every write): before anything is timed, each run gets a calc of its own in the
// state its action needs, with its blockers cleared (the required files attached, the manual items ticked).
import { ApiClient, newTally, type Reply } from './cluster/client';
import { attachRequired, newLedger, sign, tickAll } from './cluster/signoff-steps';
import { DEMO_PASSWORD } from '../server/db/demo-data';

export type Action = 'return' | 'checked' | 'approved';

/** How far each action's revision is taken before the browser acts on it. */
const STEPS: Record<Action, ('submit' | 'tick' | 'check')[]> = {
  return: ['submit'],
  checked: ['submit', 'tick'],
  approved: ['submit', 'tick', 'check'],
};

export interface Prepared {
  action: Action;
  calcId: number;
  revisionId: number;
}

function must(step: string, r: Reply, status: number): any {
  if (r.status !== status) throw new Error(`${step}: ${r.status} ${JSON.stringify(r.body).slice(0, 300)}`);
  return r.body;
}

/**
 * `runs` calcs per action, each a copy of the demo's tail pulley shaft (compliant with its standard, reviewed
 * without an independent model) against the standard's effective version, in the same project, by the demo author;
 * checked by the demo checker.
 */
export async function prepareRevisions(url: string, actions: Action[], runs: number): Promise<Prepared[]> {
  const tally = newTally();
  const [author, checker] = [new ApiClient(url, tally), new ApiClient(url, tally)];
  await author.signIn('author', DEMO_PASSWORD);
  await checker.signIn('checker', DEMO_PASSWORD);
  const found = must('find the demo calc', await author.call('GET', '/api/calcs?q=CV1200-SH-002'), 200);
  const model = found.items.find((c: { number: string }) => c.number === 'CV1200-SH-002');
  if (!model) throw new Error('the demo data is not loaded (npm run seed)');
  const source = must('read the demo revision', await author.call('GET', `/api/revisions/${model.latest.id}`), 200);
  const ruleSets = must('list the standards', await author.call('GET', '/api/rule-sets'), 200);
  const effective = ruleSets.find((r: { code: string; status: string }) => {
    return r.code === source.ruleSet.code && r.status === 'effective';
  });
  if (!effective) throw new Error(`no effective version of ${source.ruleSet.code}`);
  const ledger = newLedger();
  const stamp = Date.now().toString(36).toUpperCase();
  const prepared: Prepared[] = [];
  for (const action of actions) {
    for (let i = 1; i <= runs; i++) {
      const number = `CV1200-SB-${stamp}-${action.slice(0, 3).toUpperCase()}${i}`;
      const created = must(
        `create ${number}`,
        await author.call('POST', '/api/calcs', {
          projectId: model.projectId,
          number,
          title: `Tail pulley shaft, signing bench ${i}`,
          partRef: 'DRG CV1200-3010',
          ruleSetId: effective.id,
          input: source.input,
        }),
        201,
      );
      const rid = created.latest.id as number;
      const start = must('read the new revision', await author.call('GET', `/api/revisions/${rid}`), 200);
      for (const step of STEPS[action]) {
        if (step === 'submit') await attachRequired(author, rid, start, number, ledger);
        if (step === 'submit') await sign(author, rid, 'authored', DEMO_PASSWORD, ledger);
        if (step === 'tick') await tickAll(checker, rid, ledger);
        if (step === 'check') await sign(checker, rid, 'checked', DEMO_PASSWORD, ledger);
      }
      prepared.push({ action, calcId: created.id as number, revisionId: rid });
    }
  }
  return prepared;
}
