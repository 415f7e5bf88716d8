import fc from 'fast-check';
import { evaluateShaft, type CalcResult } from '../../../../shared/engine';

// Property tests of the beam model (fast-check): linearity in load, superposition of the two
// planes, and Maxwell's reciprocal theorem (Timoshenko & Gere, Mechanics of Materials, from memory).
const share = (lo: number, hi: number): fc.Arbitrary<number> => fc.integer({ min: lo, max: hi }).map((n) => n / 1000);
const segmentArb = fc.record({
  length: fc.double({ min: 20, max: 400, noNaN: true }),
  od: fc.double({ min: 15, max: 120, noNaN: true }),
});
const caseArb = fc.record({
  segments: fc.array(segmentArb, { minLength: 1, maxLength: 5 }),
  // Stations as thousandths of the length (two supports, two load points), so two stations either
  // coincide or lie clearly apart: stations closer than the merge tolerance are one node by design.
  s1: share(0, 450),
  s2: share(550, 1000),
  p: share(0, 1000),
  q: share(0, 1000),
  // Forces are 0 or at least 1 mN: the engine refuses implausibly tiny ones (beam-ranges.ts), as it should.
  Fy: fc.double({ min: -5e4, max: 5e4, noNaN: true }).filter((f) => f === 0 || Math.abs(f) >= 1e-3),
  Fz: fc.double({ min: -5e4, max: 5e4, noNaN: true }).filter((f) => f === 0 || Math.abs(f) >= 1e-3),
  k: fc.double({ min: 0.1, max: 100, noNaN: true }),
});
type Case = typeof caseArb extends fc.Arbitrary<infer C> ? C : never;

const total = (c: Case): number => c.segments.reduce((s, g) => s + g.length, 0);

function run(c: Case, loads: { at: number; Fy?: number; Fz?: number }[]): CalcResult {
  const L = total(c);
  return evaluateShaft({
    units: 'SI',
    material: { E: 207, G: 79.3, Sy: 500, Su: 700 },
    torques: [],
    segments: c.segments.map((s) => ({ ...s, id: 0 })),
    supports: [
      { at: c.s1 * L, kind: 'deep-groove-ball' },
      { at: c.s2 * L, kind: 'deep-groove-ball' },
    ],
    loads: loads.map((l) => ({ ...l, at: l.at * L })),
  });
}

const close = (a: number, b: number, scale: number): boolean => Math.abs(a - b) <= 1e-9 * scale + 1e-15;

describe('beam model properties', () => {
  it('when every load is scaled by k, then reactions, deflections and moments scale by k', () => {
    fc.assert(
      fc.property(caseArb, (c) => {
        const a = run(c, [{ at: c.p, Fy: c.Fy, Fz: c.Fz }]);
        const b = run(c, [{ at: c.p, Fy: c.k * c.Fy, Fz: c.k * c.Fz }]);
        const f = Math.abs(c.Fy) + Math.abs(c.Fz);
        return (
          close(b.supports[0].Fy, c.k * a.supports[0].Fy, c.k * f) &&
          close(b.loads[0].y, c.k * a.loads[0].y, c.k * Math.abs(a.deflection!.max) + 1e-300) &&
          close(b.deflection!.max, c.k * a.deflection!.max, c.k * a.deflection!.max)
        );
      }),
      { numRuns: 60 },
    );
  });

  it('when the y and z forces are solved apart, then together they are the sum (planes superpose)', () => {
    fc.assert(
      fc.property(caseArb, (c) => {
        const both = run(c, [{ at: c.p, Fy: c.Fy, Fz: c.Fz }]);
        const y = run(c, [{ at: c.p, Fy: c.Fy }]);
        const z = run(c, [{ at: c.p, Fz: c.Fz }]);
        const scale = both.deflection!.max + 1e-300;
        return (
          close(both.loads[0].y, y.loads[0].y, scale) &&
          close(both.loads[0].z, z.loads[0].z, scale) &&
          close(both.supports[1].F, Math.hypot(y.supports[1].F, z.supports[1].F), Math.abs(c.Fy) + Math.abs(c.Fz))
        );
      }),
      { numRuns: 60 },
    );
  });

  it('when a unit load moves between two stations, then the deflection at the other is the same (Maxwell)', () => {
    fc.assert(
      fc.property(caseArb, (c) => {
        const atP = run(c, [
          { at: c.p, Fy: 1 },
          { at: c.q, Fy: 0 },
        ]);
        const atQ = run(c, [
          { at: c.p, Fy: 0 },
          { at: c.q, Fy: 1 },
        ]);
        return close(atP.loads[1].y, atQ.loads[0].y, Math.max(atP.deflection!.max, atQ.deflection!.max) + 1e-300);
      }),
      { numRuns: 60 },
    );
  });

  it('when any shaft is solved, then every number is finite and the forces balance', () => {
    fc.assert(
      fc.property(caseArb, (c) => {
        const r = run(c, [{ at: c.p, Fy: c.Fy, Fz: c.Fz }]);
        const sumY = r.supports.reduce((s, p) => s + p.Fy, 0) + c.Fy;
        const json = JSON.stringify(r);
        // 1e-7: a very short element beside long ones (a load 0.1 mm from a joint) costs a few digits of conditioning.
        return (
          Math.abs(sumY) <= 1e-7 * (Math.abs(c.Fy) + 1) &&
          !/NaN|Infinity|null,"p"/.test(json) &&
          Number.isFinite(r.criticalSpeed!.rpm)
        );
      }),
      { numRuns: 60 },
    );
  });
});
