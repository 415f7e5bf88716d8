import type { RuleSet } from '../../../../shared/rules';
import ruleSetDocument from '../../../../rules/kfd-eng-014-v3.json';
import { ruleSetProblems } from './rule-set-messages';

const DOC = ruleSetDocument as unknown as RuleSet;
const refused = (fieldErrors: Record<string, string[]>) => ({
  status: 400,
  code: 'validation',
  message: 'Invalid input',
  fieldErrors,
});

describe("standard-draft messages in the screen's words", () => {
  it('when the change summary is empty, then the message names it as the form does, on its tab, without "1 characters"', () => {
    expect(ruleSetProblems(refused({ 'document.changeSummary': ['must have at least 1 characters'] }), DOC)).toEqual([
      { text: 'What changes in this version (Clauses tab): is empty', tab: 0 },
    ]);
  });

  it("when the third clause's text is refused, then it is named by its clause number (§4.2), not its position from zero", () => {
    expect(DOC.clauses[2].id).toBe('4.2');
    expect(ruleSetProblems(refused({ 'document.clauses[2].text': ['is too long'] }), DOC)).toEqual([
      { text: '§4.2 clause text (Clauses tab): is too long', tab: 0 },
    ]);
  });
});
