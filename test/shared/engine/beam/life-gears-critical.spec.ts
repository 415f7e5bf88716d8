import { evaluateShaft } from '../../../../shared/engine';
import { ratingLife } from '../../../../shared/engine/beam/bearing-life';
import { expectClose } from '../check-helpers';
import { D, EI, solve } from './beam-helpers';

describe('first bending critical speed', () => {
  it('when a uniform shaft rests on end supports, then it matches ω₁ = π²·√(EI/(ρA·L⁴)) (Blevins, Formulas for Natural Frequency and Mode Shape, Table 8-1)', () => {
    const L = 1000;
    const r = solve({ length: L, supports: [0, L], loads: [], density: 7850 });
    const rhoA = (7850e-12 * (Math.PI * D * D)) / 4; // t/mm
    const omega = Math.PI ** 2 * Math.sqrt(EI / (rhoA * L ** 4));
    expectClose(r.criticalSpeed!.rpm, (omega * 60) / (2 * Math.PI), 1e-5);
    expect(r.criticalSpeed!.method).toMatch(/eigenvalue of the beam model/);
    expect(r.criticalSpeed!.ratio).toBeNull(); // no operating speed entered
    expectClose(r.criticalSpeed!.totalMass, rhoA * L * 1000, 1e-9);
  });

  it('when a uniform shaft runs over two equal spans, then the first mode is antisymmetric, at the one-span frequency (Blevins Table 8-1)', () => {
    const L = 600;
    const r = solve({ length: 2 * L, supports: [0, L, 2 * L], loads: [], density: 7850 });
    const rhoA = (7850e-12 * (Math.PI * D * D)) / 4;
    const omega = Math.PI ** 2 * Math.sqrt(EI / (rhoA * L ** 4));
    // Eight consistent-mass elements a span: within 2e-5 (the symmetric start could never find this mode).
    expectClose(r.criticalSpeed!.rpm, (omega * 60) / (2 * Math.PI), 2e-5);
  });

  it('when a heavy disc sits mid-span, then it approaches the single-mass value √(48·EI/(m·L³)) (single-mass formula, Shigley 9th Table A-9-6 stiffness 48·EI/L³)', () => {
    const L = 800;
    const m = 500; // kg: the shaft (about 12 kg) is light beside it
    const r = solve({ length: L, supports: [0, L], loads: [], masses: [{ at: L / 2, mass: m }], density: 7850 });
    const omega = Math.sqrt((48 * EI) / ((m / 1000) * L ** 3));
    const rpm = (omega * 60) / (2 * Math.PI);
    // The shaft's own mass lowers it a little: 17/35 of it acts at mid-span by Rayleigh's method (Rao, Mechanical
    // Vibrations, effective mass of a beam, from memory).
    const shaft = ((7850e-12 * Math.PI * D * D * L) / 4) * 1000;
    const rayleigh = (Math.sqrt((48 * EI) / (((m + (17 / 35) * shaft) / 1000) * L ** 3)) * 60) / (2 * Math.PI);
    expect(r.criticalSpeed!.rpm).toBeLessThan(rpm);
    expectClose(r.criticalSpeed!.rpm, rayleigh, 1e-3);
  });

  it('when an operating speed is given, then the ratio is critical speed over it', () => {
    const input = { ...solveInput(), speed: 1500 };
    const r = evaluateShaft(input);
    expectClose(r.criticalSpeed!.ratio, r.criticalSpeed!.rpm / 1500);
  });
});

function solveInput(): Record<string, unknown> {
  return {
    units: 'SI',
    material: { E: 200, G: 80, Sy: 400, Su: 600 },
    segments: [{ length: 600, od: 40, id: 0 }],
    torques: [],
    supports: [
      { at: 50, kind: 'deep-groove-ball' },
      { at: 550, kind: 'cylindrical-roller' },
    ],
  };
}

describe('bearing basic rating life (ISO 281:2007 §6, from memory)', () => {
  it('when a ball bearing has C = 30.7 kN and P = 5 kN, then L10 = (C/P)³ and L10h = 10⁶·L10/(60·n)', () => {
    const life = ratingLife('deep-groove-ball', 30700, 5000, 0, undefined, undefined, 1500);
    expectClose(life.L10, (30.7 / 5) ** 3);
    expectClose(life.L10h, ((30.7 / 5) ** 3 * 1e6) / (60 * 1500));
  });

  it('when a roller bearing is loaded, then the exponent is 10/3', () => {
    expectClose(ratingLife('cylindrical-roller', 44000, 4000, 0, undefined, undefined, null).L10, 11 ** (10 / 3));
  });

  it('when there is an axial load with X and Y, then P = X·Fr + Y·Fa', () => {
    expectClose(ratingLife('deep-groove-ball', 30000, 2000, 1000, 0.56, 1.6, 1000).P, 0.56 * 2000 + 1.6 * 1000);
  });

  it('when a plain bearing or an unloaded one is asked, then no life is stated (null, never Infinity)', () => {
    expect(ratingLife('plain', 30000, 2000, 0, undefined, undefined, 1000).L10).toBeNull();
    expect(ratingLife('deep-groove-ball', 30000, 0, 0, undefined, undefined, 1000).L10).toBeNull();
  });

  it('when the shaft is solved, then each bearing life uses its own reaction and the operating speed', () => {
    const input = {
      ...solveInput(),
      speed: 1000,
      supports: [
        { at: 50, kind: 'deep-groove-ball', C: 20 },
        { at: 550, kind: 'deep-groove-ball', C: 20 },
      ],
      loads: [{ at: 300, Fy: -4000 }],
    };
    const r = evaluateShaft(input);
    expectClose(r.supports[0].F, 2000);
    expectClose(r.supports[0].L10, 10 ** 3);
    expectClose(r.supports[0].L10h, (1000 * 1e6) / (60 * 1000));
  });
});

describe('gear and belt forces (Shigley 9th Eqs. 13-36 and 13-40, from memory; Mott for the belt factor)', () => {
  const shaft = (load: Record<string, unknown>, T = 100): Record<string, unknown> => ({
    ...solveInput(),
    torques: [
      { at: 300, T },
      { at: 0, T: -T },
    ],
    loads: [{ at: 300, ...load }],
  });

  it('when a spur gear transmits T with d = 100 mm, then Wt = 2T/d and Wr = Wt·tan 20°', () => {
    const l = evaluateShaft(shaft({ kind: 'gear', pitchDiameter: 100 })).loads[0];
    // Mesh point on +y: the tangential force is along +z for a positive torque, the radial force towards the axis.
    expectClose(l.Fz, 2000);
    expectClose(l.Fy, -2000 * Math.tan((20 * Math.PI) / 180));
    expect(l.Fx).toBe(0);
  });

  it('when the gear is helical (ψ = 30°, φn = 20°), then Wr = Wt·tan φn/cos ψ and Wa = Wt·tan ψ', () => {
    const l = evaluateShaft(shaft({ kind: 'gear', pitchDiameter: 100, helixAngle: 30, direction: 90 })).loads[0];
    const psi = Math.PI / 6;
    expectClose(l.Fy, -2000); // mesh point on +z: tangential force along −y
    expectClose(l.Fz, (-2000 * Math.tan(Math.PI / 9)) / Math.cos(psi));
    expectClose(l.Fx, 2000 * Math.tan(psi));
  });

  it("when a helical gear's axial force acts at the pitch radius, then the moment jumps by Wa·d/2 there and closes to zero at the ends", () => {
    const input = {
      ...shaft({ kind: 'gear', pitchDiameter: 100, helixAngle: 30 }),
      supports: [
        { at: 50, kind: 'deep-groove-ball', locating: true },
        { at: 550, kind: 'deep-groove-ball' },
      ],
    };
    const r = evaluateShaft(input);
    const at = r.bendingDiagram.filter((p) => p.at === 300);
    expectClose(Math.abs(at[1].My - at[0].My), (r.loads[0].Fx * 0.1) / 2, 1e-9);
    const end = r.bendingDiagram[r.bendingDiagram.length - 1];
    expect(Math.abs(end.My) + Math.abs(end.Mz)).toBeLessThan(1e-9);
    expectClose(r.supports[0].Fa, r.loads[0].Fx);
  });

  it('when a V-belt pulley transmits T, then the shaft load is 1.5 × 2T/D in the pull direction', () => {
    const l = evaluateShaft(shaft({ kind: 'pulley', diameter: 200, direction: 90 })).loads[0];
    expectClose(l.Fz, 1.5 * 1000);
    expect(l.Fy).toBe(0);
  });

  it('when a coupling has no entered force, then it loads the shaft with nothing', () => {
    const l = evaluateShaft(shaft({ kind: 'coupling' })).loads[0];
    expect([l.Fy, l.Fz, l.Fx]).toEqual([0, 0, 0]);
  });
});
