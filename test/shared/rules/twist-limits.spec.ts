import { checklistAsync, checklistSync, LIFT, only, rowsOf, shaft, V3 } from './rules-helpers';

const D = 50;
const G = 79300; // MPa, carbon steel, Shigley 9th Table A-5
const J = (Math.PI * D ** 4) / 32; // mm⁴; docs/references.md C-1: 613 592.3 mm⁴
const RAD_PER_DEG = Math.PI / 180;

/** Torque (N·m) giving the twist rate θ′ (deg/m) on the test shaft: θ′ = T/(G·J) [computed]. */
const torqueForTwist = (degPerM: number): number => (((degPerM * RAD_PER_DEG) / 1000) * G * J) / 1000;

describe('twist per unit length', () => {
  it('when 1000 N·m acts on 50 mm, then the actual is 1.177523 °/m (docs/references.md C-6)', () => {
    const [row] = rowsOf(checklistSync(shaft(D, 1000, undefined, {}, 0, 1200), only(V3, ['4.3'])), '4.3');
    expect(row.actual).toBeCloseTo(1.177523, 6);
    expect(row.unit).toBe('deg/m');
  });

  // KFD-ENG-021 §4.2: 0.25 °/m for precision shafts — common practice, no source (docs/references.md, "Rule-set
  // checks").
  it.each([
    [1 - 1e-6, 'pass', 'compliant'],
    [1 + 1e-6, 'fail', 'not-compliant'],
  ] as const)(
    'when θ′ is %s × 0.25 °/m under the lifting standard, then the row is %s and the calc %s',
    async (factor, status, verdict) => {
      const rs = only(LIFT, ['4.2']);
      const input = shaft(D, torqueForTwist(0.25 * factor));
      for (const c of [checklistSync(input, rs), await checklistAsync(input, rs)]) {
        expect(rowsOf(c, '4.2')[0].status).toBe(status);
        expect(c.verdict).toBe(verdict);
      }
    },
  );

  // KFD-ENG-014 v3 §4.2: 1° in a length of 20 diameters — common practice, no source. On d = 50 mm
  // that is 1° per 1000 mm = 1 °/m [computed], i.e. 0.05° over one diameter.
  it.each([
    [1 - 1e-6, 'pass', 'compliant'],
    [1 + 1e-6, 'fail', 'not-compliant'],
  ] as const)(
    'when θ′ is %s × 1 °/m on 50 mm under KFD-ENG-014 v3, then the 1°-in-20-diameters row is %s and the calc %s',
    async (factor, status, verdict) => {
      const rs = only(V3, ['4.2']);
      const input = shaft(D, torqueForTwist(factor));
      for (const c of [checklistSync(input, rs), await checklistAsync(input, rs)]) {
        const [row] = rowsOf(c, '4.2');
        expect(row.status).toBe(status);
        expect(row.limit).toBe(0.05);
        expect(row.actual).toBeCloseTo(0.05 * factor, 12);
        expect(c.verdict).toBe(verdict);
      }
    },
  );

  it('when the precision twist clause (advisory) fails, then the verdict stays compliant and the advisory count says so', () => {
    const c = checklistSync(shaft(D, torqueForTwist(0.3)), only(V3, ['4.3']));
    expect(rowsOf(c, '4.3')[0].status).toBe('fail');
    expect(c.verdict).toBe('compliant');
    expect(c.counts).toMatchObject({ fail: 1, advisoryFail: 1, mandatoryFail: 0 });
  });

  it('when the same shaft is entered in US units, then the row shows deg/ft and the same status and utilisation', () => {
    const rs = only(V3, ['4.3']);
    const si = checklistSync(shaft(D, 1000), rs);
    const us = checklistSync(
      {
        units: 'US',
        material: {
          E: 207 / 6.894757293168361,
          G: 79.3 / 6.894757293168361,
          Sy: 530 / 6.894757293168361,
          Su: 630 / 6.894757293168361,
        },
        segments: [{ length: 1000 / 25.4, od: D / 25.4, id: 0 }],
        torques: [
          { at: 0, T: 1000 / 0.112984829027617 },
          { at: 1000 / 25.4, T: -1000 / 0.112984829027617 },
        ],
      },
      rs,
    );
    const [a, b] = [rowsOf(si, '4.3')[0], rowsOf(us, '4.3')[0]];
    expect(b.unit).toBe('deg/ft');
    expect(b.status).toBe(a.status);
    expect(b.utilisation).toBeCloseTo(a.utilisation!, 9);
    // 1 m = 3.280840 ft (1 in = 25.4 mm exactly): deg/ft = deg/m × 0.3048
    expect(b.actual).toBeCloseTo(a.actual! * 0.3048, 9);
  });
});
