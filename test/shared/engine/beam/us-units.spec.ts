import { evaluateShaft } from '../../../../shared/engine';
import { expectClose, loadFixture } from '../check-helpers';

// The same shaft typed in US units gives the same physical answers. Factors are NIST SP 811
// (from memory), typed here rather than taken from the engine so the check is independent.
const IN = 25.4; // mm
const LBF = 4.4482216152605; // N
const KSI = 6.894757293168361; // MPa
const LB = 0.45359237; // kg
const HP = 0.7456998715822702; // kW

function toUS(si: Record<string, any>): Record<string, any> {
  const us = JSON.parse(JSON.stringify(si));
  us.units = 'US';
  const m = us.material;
  Object.assign(m, {
    E: m.E / KSI,
    G: m.G / KSI,
    Sy: m.Sy / KSI,
    Su: m.Su / KSI,
    density: (m.density * 1e-9 * IN ** 3) / LB,
  });
  for (const s of us.segments) Object.assign(s, { length: s.length / IN, od: s.od / IN, id: s.id / IN });
  for (const t of us.torques) Object.assign(t, { at: t.at / IN, power: t.power / HP });
  for (const s of us.supports) Object.assign(s, { at: s.at / IN, C: (s.C * 1000) / LBF });
  for (const l of us.loads)
    Object.assign(l, {
      at: l.at / IN,
      ...(l.pitchDiameter ? { pitchDiameter: l.pitchDiameter / IN } : {}),
      ...(l.diameter ? { diameter: l.diameter / IN } : {}),
    });
  for (const x of us.masses) Object.assign(x, { at: x.at / IN, mass: x.mass / LB });
  for (const f of us.features) {
    for (const k of ['at', 'r', 'width', 'height', 'length', 'depth', 'diameter']) if (f[k] !== undefined) f[k] /= IN;
    if (f.Sy !== undefined) f.Sy /= KSI;
  }
  return us;
}

describe('SI and US inputs of the same shaft', () => {
  const si = loadFixture('two-bearing-gear-pulley.json') as Record<string, any>;
  const a = evaluateShaft(si);
  const b = evaluateShaft(toUS(si));

  it('when both are solved, then reactions, lives, deflections and the critical speed agree', () => {
    a.supports.forEach((s, i) => {
      expectClose(b.supports[i].F * LBF, s.F, 1e-9);
      expectClose(b.supports[i].slope, s.slope, 1e-9);
      expectClose(b.supports[i].L10h, s.L10h!, 1e-9);
    });
    a.loads.forEach((l, i) => expectClose(b.loads[i].deflection * IN, l.deflection, 1e-9));
    expectClose(b.deflection!.max * IN, a.deflection!.max, 1e-8);
    expectClose(b.criticalSpeed!.rpm, a.criticalSpeed!.rpm, 1e-8);
    expectClose(b.criticalSpeed!.totalMass * LB, a.criticalSpeed!.totalMass, 1e-9);
  });

  it('when both are solved, then the moments at the features agree (lbf·in against N·m)', () => {
    a.features.forEach((f, i) => expectClose((b.features[i].M * LBF * IN) / 1000, f.M, 1e-9));
  });

  it('when fields are read, then the new numbers carry the unit of their system', () => {
    expect([a.fields.F.unit, a.fields.C.unit, a.fields.mass.unit, a.fields.L10h.unit, a.fields.slope.unit]).toEqual([
      'N',
      'kN',
      'kg',
      'h',
      'rad',
    ]);
    expect([b.fields.F.unit, b.fields.C.unit, b.fields.mass.unit, b.fields.deflection.unit, b.fields.My.unit]).toEqual([
      'lbf',
      'lbf',
      'lb',
      'in',
      'lbf·in',
    ]);
    for (const name of [
      'Fy',
      'Fz',
      'F',
      'Fa',
      'slope',
      'L10',
      'L10h',
      'deflection',
      'max',
      'rpm',
      'ratio',
      'My',
      'Mz',
      'M',
    ]) {
      expect(a.fields[name]?.formula).toBeTruthy();
    }
  });
});
