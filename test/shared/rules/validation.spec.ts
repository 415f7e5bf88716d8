import { validateRuleSet } from '../../../shared/rules';
import { RULE_FILES, rawRuleSet } from './rules-helpers';

type Doc = Record<string, any>;

/** KFD-ENG-014 v3 with one change; the clause indices below are those of rules/kfd-eng-014-v3.json. */
function v3(change: (d: Doc) => void): Doc {
  const d = rawRuleSet('kfd-eng-014-v3.json');
  change(d);
  return d;
}
const clause = (d: Doc, id: string): Doc => d.clauses.find((c: Doc) => c.id === id);
const param = (d: Doc, name: string): Doc => d.parameters.find((p: Doc) => p.name === name);

function issuesOf(doc: unknown): { path: string; message: string }[] {
  const r = validateRuleSet(doc);
  if (r.ok) throw new Error('expected the document to be refused');
  return r.issues;
}

describe('validateRuleSet accepts the shipped standards', () => {
  it.each(RULE_FILES)('when %s is validated, then it is accepted', (file) => {
    expect(validateRuleSet(rawRuleSet(file))).toMatchObject({ ok: true });
  });
});

describe('validateRuleSet refuses bad documents, naming the place and the reason', () => {
  it.each<[string, (d: Doc) => void, string, RegExp]>([
    [
      'an unknown fact',
      (d) => {
        clause(d, '4.1').check.all[0].fact = 'tauMaxx';
      },
      'clauses[1].check.all[0].fact',
      /^unknown fact "tauMaxx" for scope segment \(did you mean "tauMax"\?\)$/,
    ],
    [
      'a fact of another scope',
      (d) => {
        clause(d, '4.1').check.all[0].fact = 'Kts';
      },
      'clauses[1].check.all[0].fact',
      /unknown fact "Kts" for scope segment \(it is a fact of scope feature\)/,
    ],
    [
      'an unknown parameter reference',
      (d) => {
        clause(d, '5.1').check.all[0].value.fact = 'param:minYieldSafty';
      },
      'clauses[4].check.all[0].value.fact',
      /^unknown parameter "minYieldSafty" \(did you mean "minYieldSafety"\?\)$/,
    ],
    [
      'a parameter of the wrong type',
      (d) => {
        param(d, 'minYieldSafety').value = 'two';
        delete param(d, 'minYieldSafety').unit;
      },
      'clauses[4].check.all[0].value.fact',
      /parameter "minYieldSafety" is a string, but greaterThanInclusive needs a number/,
    ],
    [
      'a parameter in the wrong unit',
      (d) => {
        param(d, 'maxTwistPerLength').unit = 'deg/ft';
      },
      'clauses[3].check.all[0].value.fact',
      /parameter "maxTwistPerLength" is in deg\/ft but fact "twistPerLength" is in deg\/m \(rule sets use SI units\)/,
    ],
    [
      'a derived fact without its parameter',
      (d) => {
        d.parameters = d.parameters.filter((p: Doc) => p.name !== 'asmeKeywayFactor');
      },
      'clauses[1].check.all[0].value.fact',
      /fact "allowableShear" is computed from parameter "asmeKeywayFactor", which the rule set does not define/,
    ],
    [
      'a duplicate clause id',
      (d) => {
        clause(d, '4.3').id = '4.2';
      },
      'clauses[3].id',
      /^duplicate clause id "4.2" \(also clauses\[2\]\)$/,
    ],
    [
      'a duplicate parameter',
      (d) => {
        d.parameters.push({ ...param(d, 'minYieldSafety') });
      },
      'parameters[13].name',
      /^duplicate parameter "minYieldSafety" \(also parameters\[5\]\)$/,
    ],
    [
      'a duplicate manual item',
      (d) => {
        d.manualItems.push({ id: 'load-cases', text: 'again' });
      },
      'manualItems[3].id',
      /duplicate manual item id "load-cases"/,
    ],
    [
      'a numeric operator on a boolean fact',
      (d) => {
        clause(d, '3.1').check.all[0].operator = 'greaterThan';
      },
      'clauses[0].check.all[0].operator',
      /greaterThan compares numbers, but fact "hasFatigue" is a boolean/,
    ],
    [
      'a value that the fact never takes',
      (d) => {
        clause(d, '6.1').applicability.all[0].value = 'shoulder-filet';
      },
      'clauses[8].applicability.all[0].value',
      /"shoulder-filet" is not a value of fact "type" \(shoulder-fillet, keyseat, ring-groove, cross-hole\)/,
    ],
    [
      'null compared with a fact that is never null',
      (d) => {
        clause(d, '4.1').check.all[0] = { fact: 'tauMax', operator: 'equal', value: null };
      },
      'clauses[1].check.all[0].value',
      /fact "tauMax" is never null/,
    ],
    [
      'an unknown operator',
      (d) => {
        clause(d, '4.1').check.all[0].operator = 'atMost';
      },
      'clauses[1].check.all[0].operator',
      /^must be one of "equal", .*"greaterThanInclusive", got the text "atMost"$/,
    ],
    [
      'a condition without its value',
      (d) => {
        delete clause(d, '4.1').check.all[0].value;
      },
      'clauses[1].check.all[0].value',
      /is missing/,
    ],
    [
      'an empty condition',
      (d) => {
        clause(d, '4.1').check.all[0] = {};
      },
      'clauses[1].check.all[0]',
      /must be a condition/,
    ],
    [
      'a bare fact condition at the root',
      (d) => {
        clause(d, '4.1').check = { fact: 'tauMax', operator: 'greaterThan', value: 0 };
      },
      'clauses[1].check',
      /must be a condition: \{ "all"/,
    ],
    [
      'an empty any',
      (d) => {
        clause(d, '4.1').check = { any: [] };
      },
      'clauses[1].check.any',
      /at least 1 entries/,
    ],
    [
      'a path on a plain fact',
      (d) => {
        clause(d, '4.1').check.all[0].path = '$.value';
      },
      'clauses[1].check.all[0].path',
      /fact "tauMax" is a number, not an object: remove "path"/,
    ],
    [
      'a path to an unknown member',
      (d) => {
        clause(d, '5.3').check.all[0] = {
          fact: 'fatigueSafetyBy',
          path: '$.goodmann',
          operator: 'greaterThan',
          value: 1,
        };
      },
      'clauses[6].check.all[0].path',
      /"goodmann" is not a member of fact "fatigueSafetyBy" \(goodman, asmeElliptic, gerber, soderberg\)/,
    ],
    [
      'a measure in the wrong unit',
      (d) => {
        clause(d, '4.1').measure.unit = 'ksi';
      },
      'clauses[1].measure.unit',
      /fact "tauMax" is in MPa, not "ksi"/,
    ],
    [
      'a measure on a boolean',
      (d) => {
        clause(d, '4.1').measure.actual = 'hasKeyseat';
      },
      'clauses[1].measure.actual',
      /fact "hasKeyseat" is a boolean; a measure needs numbers/,
    ],
    [
      'a limit whose origin the text does not name',
      (d) => {
        clause(d, '5.1').text = 'Yield safety shall be at least 2.';
      },
      'clauses[4].text',
      /name the origin of parameter "minYieldSafety" in the clause text: "house choice"/,
    ],
    [
      'an effective version without a date',
      (d) => {
        d.effectiveDate = null;
      },
      'effectiveDate',
      /status effective needs its effective date/,
    ],
    [
      'a numeric parameter without unit',
      (d) => {
        delete param(d, 'minFatigueSafety').unit;
      },
      'parameters[6].unit',
      /needs its SI unit/,
    ],
    [
      'an unknown field',
      (d) => {
        d.owner = 'x';
      },
      'owner',
      /^unknown field "owner"$/,
    ],
    [
      'a version that is not an integer',
      (d) => {
        d.version = 3.5;
      },
      'version',
      /must be an integer/,
    ],
    [
      'a bad effective date',
      (d) => {
        d.effectiveDate = '2025-13-01';
      },
      'effectiveDate',
      /must be a valid date/,
    ],
    [
      'a bad severity',
      (d) => {
        clause(d, '4.1').severity = 'required';
      },
      'clauses[1].severity',
      /must be one of "mandatory", "advisory"/,
    ],
  ])('when the document has %s, then it is refused', (_name, change, path, message) => {
    const issues = issuesOf(v3(change));
    expect(issues).toContainEqual({ path, message: expect.stringMatching(message) });
  });

  it.each([null, 42, 'text', []])('when the document is %p, then it is refused as not an object', (doc) => {
    expect(issuesOf(doc)).toEqual([{ path: '(document)', message: 'a rule set must be a JSON object' }]);
  });

  it('when several faults exist, then each is reported once with its own path', () => {
    const issues = issuesOf(
      v3((d) => {
        clause(d, '4.1').check.all[0].fact = 'tauMaxx';
        clause(d, '4.3').id = '4.2';
      }),
    );
    expect(issues.map((i) => i.path).sort()).toEqual(['clauses[1].check.all[0].fact', 'clauses[3].id']);
  });
});
