import integrate from 'integrate-adaptive-simpson';
import { evaluateShaft } from '../../../../shared/engine';
import { expectClose } from '../check-helpers';

/*
 * Independent route for a stepped shaft: reactions by hand statics, M(x)/EI(x) integrated twice
 * with a general-purpose adaptive Simpson package, constants from zero deflection at the two
 * bearings. Nothing of the engine is used but its answer.
 */
const E = 207_000; // MPa
const segs = [
  { length: 60, od: 40 },
  { length: 140, od: 55 },
  { length: 200, od: 65 },
  { length: 120, od: 50 },
  { length: 80, od: 38 },
];
const bounds = segs.reduce((b, s) => [...b, b[b.length - 1] + s.length], [0]);
const [A, B] = [30, 480];
const loads = [
  { at: 130, F: -3500 },
  { at: 320, F: 1200 },
  { at: 560, F: -900 },
];

function reactions(): [number, number] {
  // ΣM about A and ΣF = 0.
  const RB = -loads.reduce((s, l) => s + l.F * (l.at - A), 0) / (B - A);
  return [-loads.reduce((s, l) => s + l.F, 0) - RB, RB];
}

function moment(x: number): number {
  const [RA, RB] = reactions();
  const acts = [...loads, { at: A, F: RA }, { at: B, F: RB }];
  return acts.reduce((m, a) => (a.at < x ? m + a.F * (x - a.at) : m), 0);
}

function EI(x: number): number {
  const i = Math.max(0, bounds.findIndex((b, k) => k > 0 && x <= b) - 1);
  return (E * Math.PI * segs[i].od ** 4) / 64;
}

const breaks = [...new Set([...bounds, A, B, ...loads.map((l) => l.at)])].sort((a, b) => a - b);

// ∫ from 0 to x of f, split at the breakpoints so each piece is smooth. The package's tolerance is
// absolute, so the integrands are scaled by S to order one and the results scaled back.
const S = 1e6;
// `f` gets the piece's midpoint too, so EI is taken from the segment the piece lies in (not from
// the neighbour at a shared end).
function piecewise(f: (s: number, mid: number) => number, x: number, tol: number): number {
  let sum = 0;
  for (let k = 0; k < breaks.length - 1 && breaks[k] < x; k++) {
    const [a, b] = [breaks[k], Math.min(x, breaks[k + 1])];
    sum += integrate((s) => f(s, (a + b) / 2), a, b, tol, 40);
  }
  return sum;
}

const scaledSlope = (x: number): number => piecewise((s, mid) => (S * moment(s)) / EI(mid), x, 1e-9);
const slopeNoConstant = (x: number): number => scaledSlope(x) / S;
const Y = (x: number): number => piecewise(scaledSlope, x, 1e-7) / S;

describe('stepped-shaft deflection by an independent route (double integration of M/EI)', () => {
  const input = {
    units: 'SI',
    material: { E: E / 1000, G: 80, Sy: 500, Su: 700 },
    segments: segs.map((s) => ({ ...s, id: 0 })),
    torques: [],
    supports: [
      { at: A, kind: 'deep-groove-ball' },
      { at: B, kind: 'cylindrical-roller' },
    ],
    loads: loads.map((l) => ({ at: l.at, Fy: l.F })),
  };
  const r = evaluateShaft(input);
  const theta0 = -(Y(B) - Y(A)) / (B - A);
  const c = -Y(A) - theta0 * A;
  const y = (x: number): number => Y(x) + theta0 * x + c;

  it('when solved, then the reactions match hand statics', () => {
    const [RA, RB] = reactions();
    expectClose(r.supports[0].Fy, RA, 1e-9);
    expectClose(r.supports[1].Fy, RB, 1e-9);
  });

  it('when solved, then the deflection at every load matches the integrated curve', () => {
    loads.forEach((l, i) => expectClose(r.loads[i].y, y(l.at), 1e-6));
  });

  it('when solved, then the slope at each bearing matches θ0 + ∫ M/EI', () => {
    expectClose(r.supports[0].slopeY, theta0 + slopeNoConstant(A), 1e-6);
    expectClose(r.supports[1].slopeY, theta0 + slopeNoConstant(B), 1e-6);
  });

  it('when solved, then every point of the curve matches, ends included', () => {
    for (const p of r.deflectionCurve)
      expect(Math.abs(p.y - y(p.at))).toBeLessThanOrEqual(1e-6 * r.deflection!.max + 1e-12);
  });

  it('when solved, then the moment diagram matches hand statics at every station', () => {
    for (const p of r.bendingDiagram) expect(Math.abs(p.My * 1000 - moment(p.at))).toBeLessThanOrEqual(1e-6 * 2e6);
  });
});
