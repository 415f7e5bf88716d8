import { evaluateShaft, validateCalcInput, type CalcIssue } from '../../../../shared/engine';
import { loadFixture, numbersIn } from '../check-helpers';

// Every bad input the issue lists is refused naming the field and the reason; good edge cases work.
const base = (): Record<string, any> => JSON.parse(JSON.stringify(loadFixture('two-bearing-gear-pulley.json')));

function issuesOf(input: unknown): CalcIssue[] {
  const r = validateCalcInput(input);
  return r.ok ? [] : r.issues;
}

function refused(mutate: (i: Record<string, any>) => void): CalcIssue[] {
  const input = base();
  mutate(input);
  const issues = issuesOf(input);
  expect(issues.length).toBeGreaterThan(0);
  return issues;
}

describe('bad beam input is refused, naming the field', () => {
  it.each<[string, (i: Record<string, any>) => void, string, RegExp]>([
    [
      'a support off the shaft',
      (i) => {
        i.supports[1].at = 900;
      },
      'supports[1].at',
      /off the shaft/,
    ],
    [
      'one support only',
      (i) => {
        i.supports.pop();
      },
      'supports',
      /one bearing cannot hold/,
    ],
    [
      'no supports with transverse loads',
      (i) => {
        delete i.supports;
      },
      'supports',
      /at least two supports/,
    ],
    [
      'two supports at one station',
      (i) => {
        i.supports[1].at = 20;
      },
      'supports[1].at',
      /same station/,
    ],
    [
      'a load off the shaft',
      (i) => {
        i.loads[0].at = -5;
      },
      'loads[0].at',
      /off the shaft/,
    ],
    [
      'a gear with no torque to transmit',
      (i) => {
        i.loads[0].at = 120;
      },
      'loads[0].T',
      /no torque to transmit/,
    ],
    [
      'a negative mass',
      (i) => {
        i.masses[0].mass = -1;
      },
      'masses[0].mass',
      /./,
    ],
    [
      'a negative density',
      (i) => {
        i.material.density = -7850;
      },
      'material.density',
      /./,
    ],
    [
      'C of zero',
      (i) => {
        i.supports[0].C = 0;
      },
      'supports[0].C',
      /./,
    ],
    [
      'a speed of zero',
      (i) => {
        i.speed = 0;
      },
      'speed',
      /./,
    ],
    [
      'an unknown bearing kind',
      (i) => {
        i.supports[0].kind = 'magic';
      },
      'supports[0].kind',
      /./,
    ],
    [
      'an absurd force',
      (i) => {
        i.loads.push({ at: 200, Fy: 1e300 });
      },
      'loads[2].Fy',
      /outside the range/,
    ],
    [
      'an absurd density',
      (i) => {
        i.material.density = 1e9;
      },
      'material.density',
      /outside the range/,
    ],
  ])('when the input has %s, then it is refused at %s', (_what, mutate, path, message) => {
    const issues = refused(mutate);
    expect(issues).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ path: expect.stringContaining(path), message: expect.stringMatching(message) }),
      ]),
    );
  });

  it('when invalid input reaches evaluateShaft, then it throws the same issues (never a NaN result)', () => {
    const input = base();
    input.supports[1].at = 900;
    expect(() => evaluateShaft(input)).toThrow(/supports\[1\]\.at/);
  });
});

describe('edge cases that must work', () => {
  it('when a shaft on bearings has no transverse loads, then bending is zero and the critical speed is still computed', () => {
    const input = base();
    input.loads = [];
    const r = evaluateShaft(input);
    expect(r.bendingDiagram.every((p) => p.M === 0)).toBe(true);
    expect(r.deflection!.max).toBe(0);
    expect(r.criticalSpeed!.rpm).toBeGreaterThan(0);
    expect(r.supports.every((s) => s.L10 === null && s.F === 0)).toBe(true);
  });

  it('when a v1 file has no supports, then the beam results are empty and nothing else changes', () => {
    const r = evaluateShaft(loadFixture('five-segment-fatigue.json'));
    expect([r.supports, r.loads, r.bendingDiagram, r.deflection, r.criticalSpeed]).toEqual([[], [], [], null, null]);
    expect(r.features.every((f) => f.M === 0)).toBe(true);
  });

  it('when the full fixture is evaluated, then no number is NaN or infinite', () => {
    const r = evaluateShaft(base());
    expect(numbersIn(r).filter(([, v]) => !Number.isFinite(v))).toEqual([]);
  });

  it('when a bearing carries axial load without X and Y, then a warning asks for them', () => {
    const input = base();
    delete input.supports[0].X;
    delete input.supports[0].Y;
    const r = evaluateShaft(input);
    expect(r.warnings).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ path: 'supports[0].X', message: expect.stringMatching(/X and Y are not entered/) }),
      ]),
    );
  });

  it('when hand-entered bending is given as well, then it adds on top of the model moment', () => {
    const input = base();
    const plain = evaluateShaft(input).features[1];
    input.bending = [
      { at: 0, Ma: 50 },
      { at: 440, Ma: 50 },
    ];
    const f = evaluateShaft(input).features[1];
    expect(f.M).toBeCloseTo(plain.M, 9);
    expect(f.Ma).toBeCloseTo(plain.M + 50, 9);
  });
});
