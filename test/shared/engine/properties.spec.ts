import fc from 'fast-check';
import { evaluateShaft, twistBetween, type CalcResult } from '../../../shared/engine';
import { polarMoment } from '../../../shared/engine/section';
import { expectClose, numbersIn, simpleShaft } from './check-helpers';

// Property tests (fast-check). Unit factors are NIST SP 811 (from memory), typed here on purpose
// rather than taken from the engine, so the SI/US property is an independent check.
const IN = 25.4;
const LBF_IN = 4.4482216152605 * 0.0254; // N·m
const KSI = 6.894757293168361; // MPa

const segmentArb = fc.record({
  length: fc.double({ min: 5, max: 2000, noNaN: true }),
  od: fc.double({ min: 5, max: 300, noNaN: true }),
  // A bore is 0 or at least 1 % of od: a subnormal bore is refused by the plausible ranges (issue 9, item 7).
  bore: fc.double({ min: 0, max: 0.9, noNaN: true }).map((b) => (b < 0.01 ? 0 : b)),
});
const shaftArb = fc.record({
  segments: fc.array(segmentArb, { minLength: 1, maxLength: 6 }),
  // Subnormal loads would make relative comparisons meaningless; real loads are 0 or far above 1e-6.
  // The engine refuses nonzero loads below 1e-6 N·m (issue 9, item 7); Mm = Ma/2 must stay above it.
  T: fc.double({ min: -5e4, max: 5e4, noNaN: true }).filter((t) => t === 0 || Math.abs(t) > 1e-5),
  Ma: fc.double({ min: 0, max: 5e3, noNaN: true }).filter((m) => m === 0 || m > 1e-5),
  // A share of the length, kept off 0 so the two bending entries never share a station.
  at: fc.double({ min: 0.001, max: 1, noNaN: true }),
});

type Shaft = typeof shaftArb extends fc.Arbitrary<infer S> ? S : never;

function siInput(s: Shaft): Record<string, any> {
  const total = s.segments.reduce((a, g) => a + g.length, 0);
  return {
    units: 'SI',
    material: { E: 207, G: 79.3, Sy: 530, Su: 630 },
    segments: s.segments.map((g) => ({ length: g.length, od: g.od, id: g.od * g.bore })),
    torques: [
      { at: 0, T: s.T },
      { at: s.at * total, T: -s.T },
    ],
    bending: [
      { at: 0, Ma: 0 },
      { at: s.at * total, Ma: s.Ma, Mm: s.Ma / 2 },
    ],
    features: [{ type: 'keyseat', form: 'end-mill', at: s.at * total }],
    fatigue: { surface: 'machined', reliability: 90, alternatingTorqueFraction: 0.2 },
  };
}

function usInput(si: Record<string, any>): Record<string, any> {
  const len = (v: number): number => v / IN;
  return {
    units: 'US',
    material: { E: 207 / KSI, G: 79.3 / KSI, Sy: 530 / KSI, Su: 630 / KSI },
    segments: si.segments.map((g: any) => ({ length: len(g.length), od: len(g.od), id: len(g.id) })),
    torques: si.torques.map((t: any) => ({ at: len(t.at), T: t.T / LBF_IN })),
    bending: si.bending.map((b: any) => ({ at: len(b.at), Ma: b.Ma / LBF_IN, Mm: (b.Mm ?? 0) / LBF_IN })),
    features: si.features.map((f: any) => ({ ...f, at: len(f.at) })),
    fatigue: si.fatigue,
  };
}

describe('engine properties', () => {
  it('when a bore is added, then J is below the solid J of the same outside diameter', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 500, noNaN: true }),
        fc.double({ min: 0.01, max: 0.99, noNaN: true }),
        (od, ratio) => polarMoment(od, od * ratio) < polarMoment(od, 0),
      ),
    );
  });

  it('when the diameter scales by k, then τmax scales by 1/k³', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 200, noNaN: true }),
        fc.double({ min: 0.2, max: 5, noNaN: true }),
        fc.double({ min: 1, max: 1e5, noNaN: true }),
        (d, k, T) => {
          const t1 = evaluateShaft(simpleShaft(d, T)).segments[0].tauMax;
          const t2 = evaluateShaft(simpleShaft(d * k, T)).segments[0].tauMax;
          expectClose(t2 * k ** 3, t1, 1e-9);
        },
      ),
    );
  });

  it('when twist is split at any station, then the parts add up to the whole and to Σ T·L/(G·J)', () => {
    fc.assert(
      fc.property(shaftArb, fc.double({ min: 0, max: 1, noNaN: true }), (s, split) => {
        const r: CalcResult = evaluateShaft(siInput(s));
        const x = split * r.length;
        const tol = 1e-9 * Math.max(1e-12, ...r.segments.map((g) => Math.abs(g.twist)));
        expect(Math.abs(twistBetween(r, 0, x) + twistBetween(r, x, r.length) - r.twistTotal)).toBeLessThanOrEqual(
          tol * 10,
        );
        const bySegments = r.segments.reduce((a, g) => a + g.twist, 0);
        expect(Math.abs(bySegments - r.twistTotal)).toBeLessThanOrEqual(tol * 10);
      }),
    );
  });

  it('when the same shaft is entered in SI and in US units, then the physical answers are the same', () => {
    fc.assert(
      fc.property(shaftArb, (s) => {
        const si = evaluateShaft(siInput(s));
        const us = evaluateShaft(usInput(siInput(s)));
        expectClose(us.twistTotal, si.twistTotal, 1e-9);
        us.segments.forEach((g, i) => {
          expectClose(g.J * IN ** 4, si.segments[i].J, 1e-9);
          if (si.segments[i].tauMax > 0) expectClose(g.tauMax * KSI, si.segments[i].tauMax, 1e-9);
          if (si.segments[i].twistPerLength > 0)
            expectClose(g.twistPerLength / 0.3048, si.segments[i].twistPerLength, 1e-9);
        });
        const [fs, fu] = [si.features[0].fatigueSafety!, us.features[0].fatigueSafety!];
        if (fs.goodman !== null) expectClose(fu.goodman, fs.goodman, 1e-9);
        if (si.features[0].yieldSafety !== null)
          expectClose(us.features[0].yieldSafety, si.features[0].yieldSafety, 1e-9);
      }),
    );
  });

  it('when any valid shaft is evaluated, then no output number is NaN or infinite', () => {
    fc.assert(
      fc.property(shaftArb, (s) => {
        expect(numbersIn(evaluateShaft(siInput(s))).filter(([, v]) => !Number.isFinite(v))).toEqual([]);
      }),
    );
  });
});
