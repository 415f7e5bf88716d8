import { evaluateShaft, fromSI, toSI, torqueFromPower } from '../../../shared/engine';
import { expectClose } from './check-helpers';

describe('torque from power and speed', () => {
  it('when 10 kW runs at 1450 rpm, then T = 65.85722 N·m (docs/references.md C-8 [computed], P = T·ω)', () => {
    expectClose(torqueFromPower(10, 1450, 'SI'), 65.85722);
  });

  it('when 1 hp runs at 63 025.357 rpm, then T = 1 lbf·in (Shigley Eq. 3-44 constant 63 025, from memory; docs/references.md)', () => {
    expectClose(torqueFromPower(1, 63025.357, 'US'), 1, 1e-7);
    expectClose(torqueFromPower(20, 1750, 'US'), (63025 * 20) / 1750, 1e-5);
  });

  it('when the power is negative (taken off), then the torque is negative', () => {
    expect(torqueFromPower(-10, 1450, 'SI')).toBeCloseTo(-65.85722, 5);
  });

  it('when a power entry drives the shaft, then the resolved torque is listed with its origin', () => {
    const r = evaluateShaft({
      units: 'SI',
      material: { E: 207, G: 79.3, Sy: 530, Su: 630 },
      segments: [{ length: 300, od: 30, id: 0 }],
      torques: [
        { at: 0, power: 10, speed: 1450 },
        { at: 300, power: -10, speed: 1450 },
      ],
    });
    expectClose(r.torques[0].T, 65.85722);
    expect(r.torques[0].isFromPower).toBe(true);
    // Internal torque: −Σ external torques left of the section (right-hand rule convention).
    expectClose(r.segments[0].T, -65.85722);
  });
});

describe('unit conversions (NIST SP 811 factors, from memory; 1 in = 25.4 mm exact)', () => {
  it.each([
    ['length', 1, 25.4],
    ['torque', 1, 0.1129848290276167], // 1 lbf·in = 4.4482216152605 N × 0.0254 m
    ['stress', 1, 6.894757293168361], // 1 ksi in MPa
    ['modulus', 1, 6.894757293168361], // 1 Mpsi in GPa
    ['power', 1, 0.7456998715822702], // 1 hp in kW
    ['J', 1, 25.4 ** 4],
    ['twistPerLength', 1, 1 / 0.3048], // 1 deg/ft in deg/m
  ] as const)('when 1 US unit of %s is converted, then it equals the SI value', (q, us, si) => {
    expectClose(toSI(us, q), si, 1e-12);
    expectClose(fromSI(si, q), us, 1e-12);
  });

  it("when 0.08 deg/ft is converted, then it is 0.2624672 deg/m (Schaum's Outline of Machine Design limit, docs/references.md)", () => {
    expectClose(toSI(0.08, 'twistPerLength'), 0.2624672, 1e-6);
  });

  it('when a temperature is converted, then 20 °C is 68 °F', () => {
    expectClose(fromSI(20, 'temperature'), 68, 1e-12);
    expectClose(toSI(212, 'temperature'), 100, 1e-12);
  });
});
