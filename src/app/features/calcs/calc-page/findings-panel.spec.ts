import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { FindingDto, RevisionDto } from '../../../../../shared/schemas/calc-dto';
import type { SessionUser } from '../../../../../shared/schemas/auth.schema';
import { FindingsPanel } from './findings-panel';
import { countFindings, findingsTabLabel } from './finding-counts';
import { planActions } from './revision-actions';
import { mountComponent } from '../../../../../test/support/client-harness';

const person = { id: 2, name: 'Idris Penhallow' };
function finding(id: number, status: FindingDto['status'], answer: string | null = null): FindingDto {
  return {
    id,
    clauseRef: null,
    text: `Point ${id}`,
    status,
    raisedBy: person,
    createdAt: '2026-12-01T10:00:00Z',
    answer,
    answeredBy: answer ? { id: 1, name: 'Morwenna Hale' } : null,
    answeredAt: answer ? '2026-12-01T11:00:00Z' : null,
    closedBy: null,
    closedAt: null,
  } as FindingDto;
}
const REVISION = {
  id: 7,
  calcId: 3,
  status: 'returned',
  author: { id: 1, name: 'Morwenna Hale' },
  editorIds: [1],
  result: {},
  verdict: 'compliant',
  findings: [finding(3, 'answered', 'Chart cited in the notes'), finding(4, 'open')],
} as unknown as RevisionDto;

let d: Awaited<ReturnType<typeof mountComponent<FindingsPanel>>>;

beforeEach(async () => {
  d = await mountComponent(FindingsPanel, { inputs: { revision: REVISION, canAnswer: true } });
});
afterEach(() => d.http.verify());

describe('findings', () => {
  it('when a finding is already answered, then it offers no second answer; only the open one does', async () => {
    const loader = d.loader;
    const answerButtons = await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Answer' }));
    expect(answerButtons).toHaveLength(1);
    expect(d.element.textContent).not.toContain('Your answer to F3');
    expect(d.element.textContent).toContain('Your answer to F4');
  });

  it('when the author clicks Answer twice, then one request is sent and the text is cleared once stored', async () => {
    const loader = d.loader;
    await (await loader.getHarness(MatInputHarness)).setValue('Fillet radius raised to 3 mm');
    const button = await loader.getHarness(MatButtonHarness.with({ text: 'Answer' }));
    await button.click();
    expect(await button.isDisabled()).toBe(true);
    const req = d.http.expectOne({ method: 'POST', url: '/api/findings/4/answer' });
    req.flush({
      ...REVISION,
      findings: [REVISION.findings[0], finding(4, 'answered', 'Fillet radius raised to 3 mm')],
    });
    await d.settle();
    expect(d.element.textContent).not.toContain('Fillet radius raised to 3 mm'.repeat(2));
  });

  it('when one finding is answered and one open, then the tab and the status line give the same counts, and they move with answers', () => {
    const me = { id: 1, username: 'mh', displayName: 'Morwenna Hale', roles: ['author'] } as unknown as SessionUser;
    expect(findingsTabLabel(countFindings(REVISION))).toBe('Findings (1 open, 1 answered)');
    expect(planActions(REVISION, me, true).nextStep).toBe('Answer the 1 open finding(s) before resubmitting.');
    const after = { ...REVISION, findings: [REVISION.findings[0], finding(4, 'answered', 'done')] };
    expect(findingsTabLabel(countFindings(after))).toBe('Findings (2 answered)');
    expect(planActions(after, me, true).actions.has('submit')).toBe(true);
  });
});
