import { evaluateShaft, twistBetween } from '../../../shared/engine';
import { expectClose, loadFixture, simpleShaft } from './check-helpers';

// docs/references.md C-4 to C-7 [computed] from τmax = T·c/J and θ = T·L/(G·J), G = 79.3 GPa
// (Shigley 9th Table A-5 carbon steel [sourced]).
describe('torsion of a uniform shaft', () => {
  it('when a solid 50 mm shaft carries 1000 N·m over 1.2 m, then τmax, θ and θ/L match docs/references.md C-4 and C-6', () => {
    const r = evaluateShaft(loadFixture('solid-si.json'));
    const s = r.segments[0];
    expectClose(s.J, 613592.3);
    expectClose(s.tauMax, 40.74367);
    // +1000 N·m at the left end, −1000 N·m at the right: the right end turns clockwise seen from +x
    // relative to the left (right-hand rule), so the signed twist is negative.
    expectClose(s.twist, -1.413028);
    expectClose(s.twistPerLength, 1.177523);
    expectClose(r.twistTotal, -1.413028);
    expect(s.tauInner).toBe(0);
  });

  it('when a hollow 60/40 mm shaft carries the same, then τ outer/inner and θ match docs/references.md C-5 and C-7', () => {
    const r = evaluateShaft(loadFixture('hollow-si.json'));
    const s = r.segments[0];
    expectClose(s.tauMax, 29.38245);
    expectClose(s.tauInner, 19.5883);
    expectClose(s.twist, -0.8491755);
    expect(s.isHollow).toBe(true);
  });

  it('when the shear strain is reported, then γ = τ/G (Hooke in shear)', () => {
    const s = evaluateShaft(simpleShaft(50, 1000)).segments[0];
    expectClose(s.gamma, 40.74367 / 79300);
  });
});

describe('torque diagram', () => {
  // Sign convention under test: internal torque = −Σ external torques left of the section (the torque
  // of the right part on the left part's cut face, along +x), so twist follows the right-hand rule.
  // Common practice of mechanics of materials, no source (docs/references.md, "Sign convention for torque and twist").
  const stepped = {
    units: 'SI',
    material: { E: 207, G: 79.3, Sy: 530, Su: 630 },
    segments: [
      { length: 200, od: 40, id: 0 },
      { length: 300, od: 50, id: 0 },
    ],
    torques: [
      { at: 0, T: 600 },
      { at: 350, T: -400 },
      { at: 500, T: -200 },
    ],
  };

  it('when a load is taken off mid-segment, then the segment reports its largest torque and twist adds over the pieces', () => {
    const r = evaluateShaft(stepped);
    expect(r.segments.map((s) => s.T)).toEqual([-600, -600]);
    expect(r.torqueDiagram.map((p) => [p.start, p.end, p.T])).toEqual([
      [0, 200, -600],
      [200, 350, -600],
      [350, 500, -200],
    ]);
    // Independent: θ = Σ T·L/(G·J) in N·mm, mm, MPa, mm⁴ → rad → deg.
    const J = (d: number): number => (Math.PI * d ** 4) / 32;
    const expected =
      -((600e3 * 200) / (79300 * J(40)) + (600e3 * 150) / (79300 * J(50)) + (200e3 * 150) / (79300 * J(50))) *
      (180 / Math.PI);
    expectClose(r.twistTotal, expected, 1e-12);
    expectClose(twistBetween(r, 0, 500), expected, 1e-12);
  });

  it('when twist is asked between two stations, then it is the integral between them and changes sign with direction', () => {
    const r = evaluateShaft(stepped);
    expectClose(twistBetween(r, 0, 350) + twistBetween(r, 350, 500), r.twistTotal, 1e-12);
    expectClose(twistBetween(r, 400, 100), -twistBetween(r, 100, 400), 1e-12);
    expect(twistBetween(r, 250, 250)).toBe(0);
    expect(() => twistBetween(r, 0, 600)).toThrow('station 600 mm is off the shaft (0 to 500 mm)');
  });

  it('when the largest stress is sought, then maxShear names its segment and station', () => {
    const r = evaluateShaft(stepped);
    expect(r.maxShear.segment).toBe(0);
    expect(r.maxShear.at).toBe(0);
    expectClose(r.maxShear.value, (600e3 * 16) / (Math.PI * 40 ** 3), 1e-12);
  });
});
