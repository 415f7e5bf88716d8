import {
  CalcInputError,
  evaluateShaft,
  evaluateValidInput,
  validateCalcInput,
  type CalcInput,
} from '../../../shared/engine';
import { PLAUSIBLE_RANGES } from '../../../shared/engine/plausible-ranges';
import { safetyFactor } from '../../../shared/engine/combined';
import { fatigueSafety } from '../../../shared/engine/fatigue-criteria';
import { numbersIn } from './check-helpers';

// Issue 9, items 7 and 8. The plausible ranges are common practice, no source (docs/references.md,
// "Plausible input ranges"); the finite-result property is what they guarantee.
type Units = 'SI' | 'US';
const MATERIAL = { SI: { E: 207, G: 79.3, Sy: 530, Su: 630 }, US: { E: 30, G: 11.5, Sy: 77, Su: 91 } };

function calc(units: Units, od: number, T: number, extra: Record<string, unknown> = {}): Record<string, any> {
  return {
    units,
    material: MATERIAL[units],
    segments: [{ length: 100, od, id: 0 }],
    torques: [
      { at: 0, T },
      { at: 100, T: -T },
    ],
    bending: [{ at: 50, Ma: T }],
    fatigue: { surface: 'machined' },
    ...extra,
  };
}

function issuesOf(input: unknown) {
  const v = validateCalcInput(input);
  return v.ok ? [] : v.issues;
}

describe('item 7: inputs that cannot give finite results are refused, naming the field', () => {
  it.each([
    [
      'SI',
      'a diameter of 1e-90 mm',
      calc('SI', 1e-90, 10),
      'segments[0].od',
      /outer diameter 1e-90 mm .* 0.001 to 100000 mm/,
    ],
    ['SI', 'a diameter of 1e80 mm', calc('SI', 1e80, 10), 'segments[0].od', /outer diameter 1e80 mm/],
    [
      'SI',
      'a torque of 1e300 N·m',
      calc('SI', 50, 1e300),
      'torques[0].T',
      /torque 1e300 N·m .* 0 or from 1e-6 to 1e10 N·m/,
    ],
    [
      'SI',
      'an entered Se′ of 1e-300 MPa',
      calc('SI', 50, 10, { fatigue: { surface: 'machined', SePrime: 1e-300, SePrimeSource: 'x' } }),
      'fatigue.SePrime',
      /1e-300 MPa/,
    ],
    [
      'US',
      'a diameter of 1e-90 in',
      calc('US', 1e-90, 10),
      'segments[0].od',
      /outer diameter 1e-90 in .* 3e-5 to 4000 in/,
    ],
    ['US', 'a torque of 1e300 lbf·in', calc('US', 2, 1e300), 'torques[0].T', /1e300 lbf·in .* 1e-6 to 1e11 lbf·in/],
    [
      'US',
      'a yield strength of 1e-300 ksi',
      { ...calc('US', 2, 10), material: { ...MATERIAL.US, Sy: 1e-300 } },
      'material.Sy',
      /yield strength 1e-300 ksi/,
    ],
    [
      'SI',
      'a temperature below absolute zero',
      calc('SI', 50, 10, { fatigue: { surface: 'machined', temperature: -300 } }),
      'fatigue.temperature',
      /-300 °C/,
    ],
    [
      'SI',
      'a wall of 1e-12 mm',
      { ...calc('SI', 50, 10), segments: [{ length: 100, od: 50, id: 50 - 2e-12 }] },
      'segments[0].id',
      /wall .* thinner/,
    ],
    [
      'SI',
      'Kt = 1e300',
      calc('SI', 50, 10, { features: [{ type: 'keyseat', form: 'end-mill', at: 50, Kt: 1e300, source: 'x' }] }),
      'features[0].Kt',
      /1e300/,
    ],
  ] as const)('when a %s calc has %s, then validation names %s', (_u, _what, input, path, message) => {
    const issue = issuesOf(input).find((i) => i.path === path);
    expect(issue?.message).toMatch(message);
  });

  it('when an input sits at the corners of every range, then every output number is finite and loaded points get a factor', () => {
    for (const units of ['SI', 'US'] as const) {
      const R = PLAUSIBLE_RANGES[units];
      for (const [od, T] of [
        [R.length[0], R.torque[1]],
        [R.length[1], R.torque[0]],
        [R.length[0], R.torque[0]],
        [R.length[1], R.torque[1]],
      ]) {
        const r = evaluateShaft(
          calc(units, od, T, { material: { E: R.modulus[0], G: R.modulus[0], Sy: R.stress[1], Su: R.stress[1] } }),
        );
        expect(numbersIn(r).filter(([, v]) => !Number.isFinite(v))).toEqual([]);
        expect(r.segments[0].yieldSafety).not.toBeNull();
        expect(r.segments[0].fatigueSafety!.goodman).not.toBeNull();
      }
    }
  });

  it('when input that skipped validation overflows, then evaluation throws CalcInputError naming the segment, never a null factor', () => {
    const raw = calc('SI', 1e-200, 1e300) as CalcInput;
    expect(() => evaluateValidInput(raw)).toThrow(CalcInputError);
    try {
      evaluateValidInput(raw);
    } catch (e) {
      expect((e as CalcInputError).issues[0]).toEqual({
        path: 'segments[0]',
        message: expect.stringMatching(/not a finite number/),
      });
    }
  });

  it('when a safety factor meets NaN or an overflow, then it throws; only a stress of exactly 0 gives null (unloaded)', () => {
    expect(safetyFactor(530, 0)).toBeNull();
    expect(() => safetyFactor(530, Number.NaN)).toThrow(/not a finite number/);
    expect(() => safetyFactor(530, 1e-320)).toThrow(/not a finite number/);
    expect(fatigueSafety(0, 0, 300, 630, 530).goodman).toBeNull();
    expect(() => fatigueSafety(Number.NaN, 0, 300, 630, 530)).toThrow(/not a finite number/);
    expect(() => fatigueSafety(1, 0, 1e-320, 630, 530)).toThrow(/not a finite number/);
  });
});

describe('item 8: power at a near-zero speed names the speed field and says what is wrong', () => {
  const power = (speed: number, p = 5): Record<string, any> => ({
    ...calc('SI', 50, 0),
    torques: [
      { at: 0, power: p, speed },
      { at: 100, power: -p, speed },
    ],
  });

  it('when the speed is 1e-300 rpm, then the issue is on torques[0].speed with the plausible range, not a NaN sum on torques', () => {
    const issues = issuesOf(power(1e-300));
    expect(issues).toContainEqual({
      path: 'torques[0].speed',
      message: expect.stringMatching(/speed 1e-300 rpm .* 0.001 to 1e6 rpm/),
    });
    expect(issues.map((i) => i.path)).not.toContain('torques');
    expect(JSON.stringify(issues)).not.toMatch(/NaN|Infinity/);
  });

  it('when a plausible power and speed give an implausible torque, then the speed entry says so with the torque', () => {
    expect(issuesOf(power(0.001, 1e6))).toContainEqual({
      path: 'torques[0].speed',
      message: expect.stringMatching(
        /power 1e6 kW at 0.001 rpm means a torque of 9\.5493e12 N·m, outside 1e-6 to 1e10 N·m/,
      ),
    });
  });
});
