import { ENGINE_VERSION, evaluateShaft, twistBetween, type CalcResult } from '../../../shared/engine';
import { expectClose, loadFixture, numbersIn } from './check-helpers';

describe('evaluateShaft on the five-segment conveyor shaft (keyseat, fillet, ring groove, fatigue)', () => {
  const r: CalcResult = evaluateShaft(loadFixture('five-segment-fatigue.json'));

  it('when evaluated, then no number anywhere in the result is NaN or infinite', () => {
    const bad = numbersIn(r).filter(([, v]) => !Number.isFinite(v));
    expect(bad).toEqual([]);
  });

  it('when evaluated, then the result carries version, caution, units and a formula for each field', () => {
    expect(r.engineVersion).toBe(ENGINE_VERSION);
    expect(r.caution).toMatch(/never replace.*qualified engineer/);
    expect(r.fields.J).toEqual({ unit: 'mm⁴', formula: expect.stringMatching(/π/) });
    expect(r.fields.twistPerLength.unit).toBe('deg/m');
    expect(r.fields.T.unit).toBe('N·m');
    expect(r.warnings).toEqual([]);
  });

  it('when evaluated, then each segment has the facts the rule sets need', () => {
    const keys = [
      'index',
      'start',
      'end',
      'od',
      'id',
      'isHollow',
      'J',
      'Zp',
      'T',
      'tauMax',
      'tauInner',
      'gamma',
      'twist',
      'twistPerLength',
      'hasKeyseat',
      'sigmaVonMises',
      'tauTresca',
      'yieldSafety',
      'fatigueSafety',
    ];
    for (const s of r.segments) for (const k of keys) expect(s).toHaveProperty(k);
    expect(r.segments.map((s) => s.hasKeyseat)).toEqual([false, true, false, false, false]);
    expect(r.segments.map((s) => [s.start, s.end])).toEqual([
      [0, 40],
      [40, 160],
      [160, 220],
      [220, 370],
      [370, 410],
    ]);
  });

  it('when the fillet at 160 mm is recomputed by hand from the published equations, then the engine agrees', () => {
    // Independent route: Norton rows 1.2/1.5 interpolated, Peterson polynomial, Eq. 6-35, Eq. 6-18 and
    // Shigley 9th Eq. 7-8 in its 16/(πd³) form (solid d), all in N·mm, mm, MPa.
    const [D, d, rr] = [55, 45, 1.5];
    const rd = rr / d;
    const k12 = 0.97098 * rd ** -0.21796;
    const Kt = k12 + ((0.93836 * rd ** -0.25759 - k12) * (D / d - 1.2)) / 0.3;
    const tr = (D - d) / 2 / rr;
    const x = (D - d) / D;
    const c = [
      0.905 + 0.783 * Math.sqrt(tr) - 0.075 * tr,
      -0.437 - 1.969 * Math.sqrt(tr) + 0.553 * tr,
      1.557 + 1.073 * Math.sqrt(tr) - 0.578 * tr,
      -1.061 + 0.171 * Math.sqrt(tr) + 0.086 * tr,
    ];
    const Kts = c[0] + c[1] * x + c[2] * x ** 2 + c[3] * x ** 3;
    const S = 630 / 6.894757293168361;
    const rIn = Math.sqrt(rr / 25.4);
    const q = 1 / (1 + (0.246 - 3.08e-3 * S + 1.51e-5 * S ** 2 - 2.67e-8 * S ** 3) / rIn);
    const qs = 1 / (1 + (0.19 - 2.51e-3 * S + 1.35e-5 * S ** 2 - 2.67e-8 * S ** 3) / rIn);
    const [Kf, Kfs] = [1 + q * (Kt - 1), 1 + qs * (Kts - 1)];
    const Ma = (420e3 * (350 - 160)) / (350 - 100);
    const Tm = ((60 / (2 * Math.PI)) * 15e3 * 1e3) / 950;
    const Ta = 0.1 * Tm;
    const Se = 0.5 * 630 * 4.51 * 630 ** -0.265 * 1.24 * 45 ** -0.107 * 0.814;
    const A = Math.sqrt(4 * (Kf * Ma) ** 2 + 3 * (Kfs * Ta) ** 2);
    const B = Math.sqrt(3 * (Kfs * Tm) ** 2);
    const nGoodman = 1 / ((16 / (Math.PI * d ** 3)) * (A / Se + B / 630));
    const f = r.features[1];
    for (const [actual, expected] of [
      [f.Kt, Kt],
      [f.Kts, Kts],
      [f.q, q],
      [f.qs, qs],
      [f.Kf, Kf],
      [f.Kfs, Kfs],
      [f.Ma, Ma / 1e3],
      [f.Tm, Tm / 1e3],
      [f.endurance?.Se, Se],
      [f.fatigueSafety?.goodman, nGoodman],
    ] as const) {
      expectClose(actual, expected, 1e-9);
    }
  });

  it('when the weakest point is asked, then the keyseat at the gear (100 mm) governs fatigue and yield', () => {
    expect(r.minFatigueSafety?.goodman).toMatchObject({ at: 100, where: 'feature', index: 0 });
    expect(r.minYieldSafety).toMatchObject({ at: 100, where: 'feature', index: 0 });
    const fs = r.features[0].fatigueSafety!;
    // Shigley's ordering for the same stresses: Soderberg ≤ Goodman ≤ Gerber, ASME-elliptic (Fig. 6-27, from memory).
    expect(fs.soderberg! <= fs.goodman! && fs.goodman! <= fs.gerber! && fs.goodman! <= fs.asmeElliptic!).toBe(true);
  });

  it('when twist is summed, then segments, the torque diagram and twistBetween agree', () => {
    const sum = r.segments.reduce((a, s) => a + s.twist, 0);
    expectClose(r.twistTotal, sum, 1e-12);
    expectClose(twistBetween(r, 0, r.length), r.twistTotal, 1e-12);
    const last = r.torqueDiagram[r.torqueDiagram.length - 1];
    expectClose(last.twistStart + (last.twistPerLength * (last.end - last.start)) / 1000, r.twistTotal, 1e-12);
  });

  it('when the same input is evaluated twice, then the results are identical (no hidden state)', () => {
    expect(evaluateShaft(loadFixture('five-segment-fatigue.json'))).toEqual(r);
  });
});
