import { CalcInputError, evaluateShaft, validateCalcInput } from '../../../shared/engine';
import { loadFixture } from './check-helpers';

// Bad input must name the field path, the value with its unit and the reason (issue 3, "Bad input").
const base = (): Record<string, any> => ({
  units: 'SI',
  material: { E: 207, G: 79.3, Sy: 530, Su: 630 },
  segments: [
    { length: 100, od: 60, id: 0 },
    { length: 100, od: 50, id: 0 },
  ],
  torques: [
    { at: 0, T: 500 },
    { at: 200, T: -500 },
  ],
});

type Change = (i: Record<string, any>) => void;

const cases: [string, Change, string, string | RegExp][] = [
  [
    'id ≥ od',
    (i) => {
      i.segments[1].id = 52;
    },
    'segments[1].id',
    'inner diameter 52 mm is not smaller than outer diameter 50 mm',
  ],
  [
    'zero length',
    (i) => {
      i.segments[0].length = 0;
    },
    'segments[0].length',
    'length must be greater than 0 mm, got 0 mm',
  ],
  [
    'negative diameter',
    (i) => {
      i.segments[0].od = -60;
    },
    'segments[0].od',
    'outer diameter must be greater than 0 mm, got -60 mm',
  ],
  [
    'negative inner diameter',
    (i) => {
      i.segments[0].id = -1;
    },
    'segments[0].id',
    'inner diameter must be at least 0 mm, got -1 mm',
  ],
  [
    'text for a number',
    (i) => {
      i.segments[0].od = '60';
    },
    'segments[0].od',
    'outer diameter must be a number in mm, got the text "60"',
  ],
  [
    'a decimal comma',
    (i) => {
      i.segments[0].od = '62,5';
    },
    'segments[0].od',
    'outer diameter must be a number in mm, got the text "62,5"; write it with a decimal point (62.5), commas are not read as numbers',
  ],
  [
    'NaN',
    (i) => {
      i.torques[0].T = Number.NaN;
    },
    'torques[0].T',
    'torque must be a number in N·m, got NaN',
  ],
  [
    'Infinity',
    (i) => {
      i.segments[1].length = Infinity;
    },
    'segments[1].length',
    /length must be a number in mm/,
  ],
  [
    'missing material',
    (i) => {
      delete i.material;
    },
    'material',
    'material is missing (an object)',
  ],
  [
    'missing Sy',
    (i) => {
      delete i.material.Sy;
    },
    'material.Sy',
    'yield strength is missing (a number in MPa)',
  ],
  [
    'Sy above Su',
    (i) => {
      i.material.Sy = 700;
    },
    'material.Sy',
    'yield strength 700 MPa exceeds ultimate strength 630 MPa',
  ],
  [
    'unbalanced torques',
    (i) => {
      i.torques[1].T = -400;
    },
    'torques',
    /do not balance: they sum to 100 N·m .* a further -100 N·m/,
  ],
  [
    'torque off the shaft',
    (i) => {
      i.torques[1].at = 250;
    },
    'torques[1].at',
    'station 250 mm is off the shaft (0 to 200 mm)',
  ],
  [
    'bending off the shaft',
    (i) => {
      i.bending = [{ at: -5, Ma: 10 }];
    },
    'bending[0].at',
    'station -5 mm is off the shaft (0 to 200 mm)',
  ],
  [
    'power without speed',
    (i) => {
      i.torques[0] = { at: 0, power: 5 };
    },
    'torques[0].speed',
    'speed is missing (a number in rpm)',
  ],
  [
    'zero speed',
    (i) => {
      i.torques[0] = { at: 0, power: 5, speed: 0 };
    },
    'torques[0].speed',
    'speed must be greater than 0 rpm, got 0 rpm',
  ],
  [
    'unknown field',
    (i) => {
      i.segments[0].odd = 3;
    },
    'segments[0].odd',
    'unknown field "odd" (check the spelling)',
  ],
  [
    'unknown units',
    (i) => {
      i.units = 'metric';
    },
    'units',
    'units must be one of "SI", "US", got the text "metric"',
  ],
  [
    'unknown feature',
    (i) => {
      i.features = [{ type: 'spline', at: 10 }];
    },
    'features[0].type',
    /type must be one of "shoulder-fillet", "keyseat", "ring-groove", "cross-hole", got the text "spline"/,
  ],
  [
    'fillet radius above the step',
    (i) => {
      i.features = [{ type: 'shoulder-fillet', at: 100, r: 8 }];
    },
    'features[0].r',
    'fillet radius 8 mm is larger than the step (D − d)/2 = 5 mm',
  ],
  [
    'fillet off a joint',
    (i) => {
      i.features = [{ type: 'shoulder-fillet', at: 90, r: 1 }];
    },
    'features[0].at',
    'a shoulder fillet must sit at a joint between two segments; the nearest joint is at 100 mm',
  ],
  [
    'fillet without a step',
    (i) => {
      i.segments[1].od = 60;
      i.features = [{ type: 'shoulder-fillet', at: 100, r: 1 }];
    },
    'features[0].at',
    /no shoulder at 100 mm/,
  ],
  [
    'feature off the shaft',
    (i) => {
      i.features = [{ type: 'keyseat', form: 'end-mill', at: 201 }];
    },
    'features[0].at',
    /off the shaft/,
  ],
  [
    'entered Kt without source',
    (i) => {
      i.features = [{ type: 'keyseat', form: 'end-mill', at: 50, Kt: 2.5 }];
    },
    'features[0].source',
    /needs its source/,
  ],
  [
    'Kt below 1',
    (i) => {
      i.features = [{ type: 'keyseat', form: 'end-mill', at: 50, Kt: 0.8, source: 'x' }];
    },
    'features[0].Kt',
    /at least 1/,
  ],
  [
    'sled runner without Kts',
    (i) => {
      i.features = [{ type: 'keyseat', form: 'sled-runner', at: 50 }];
    },
    'features[0].Kts',
    /gives no Kts for a sled-runner/,
  ],
  [
    'cross hole without factors',
    (i) => {
      i.features = [{ type: 'cross-hole', at: 50, diameter: 6 }];
    },
    'features[0].Kt',
    /no published cross-hole fit is built in/,
  ],
  [
    'groove deeper than the wall',
    (i) => {
      i.segments[0].id = 50;
      i.features = [{ type: 'ring-groove', at: 50, depth: 6, r: 0.2 }];
    },
    'features[0].depth',
    'groove depth 6 mm leaves no wall: the wall is 5 mm thick',
  ],
  [
    'reliability not in Table 6-5',
    (i) => {
      i.fatigue = { surface: 'machined', reliability: 98 };
    },
    'fatigue.reliability',
    /must be one of 50, 90, 95, 99, 99.9, 99.99, got 98/,
  ],
  [
    'kd and temperature',
    (i) => {
      i.fatigue = { surface: 'machined', kd: 0.9, temperature: 300 };
    },
    'fatigue.kd',
    'give either kd or temperature, not both',
  ],
  [
    'Ta and a fraction',
    (i) => {
      i.torques[0].Ta = 50;
      i.torques[1].Ta = -50;
      i.fatigue = { surface: 'ground', alternatingTorqueFraction: 0.2 };
    },
    'fatigue.alternatingTorqueFraction',
    /either/,
  ],
  [
    'empty segment list',
    (i) => {
      i.segments = [];
    },
    'segments',
    'segments needs at least 1 entry',
  ],
];

describe('validateCalcInput', () => {
  it.each(cases)('when the input has %s, then the issue names %s', (_name, change, path, message) => {
    const input = base();
    change(input);
    const result = validateCalcInput(input);
    expect(result.ok).toBe(false);
    const issue = !result.ok && result.issues.find((i) => i.path === path);
    expect(issue).toBeTruthy();
    if (issue) expect(issue.message).toMatch(message);
  });

  it('when the input is not an object, then one issue says so', () => {
    expect(validateCalcInput('shaft')).toEqual({
      ok: false,
      issues: [{ path: '(input)', message: 'a calc input must be a JSON object' }],
    });
  });

  it('when a US input is wrong, then the message uses US units', () => {
    const r = validateCalcInput(loadFixture('invalid/missing-material.json'));
    expect(!r.ok && r.issues).toEqual([
      { path: 'material.Sy', message: 'yield strength is missing (a number in ksi)' },
      { path: 'segments[0].length', message: 'length must be greater than 0 in, got 0 in' },
    ]);
  });

  it('when evaluateShaft gets bad input, then it throws CalcInputError carrying the issues', () => {
    const input = base();
    input.segments[1].id = 52;
    expect(() => evaluateShaft(input)).toThrow(CalcInputError);
    try {
      evaluateShaft(input);
    } catch (e) {
      expect((e as CalcInputError).issues[0].path).toBe('segments[1].id');
    }
  });

  it('when a valid input is checked, then the value comes back unchanged', () => {
    const input = base();
    expect(validateCalcInput(input)).toEqual({ ok: true, value: input });
  });
});
