import { evaluateShaft, type CalcInput } from '../../../shared/engine';
import { bendingPlot, deflectionPlot, hasBeamModel, shaftLoads, shaftOutline, slopePlot } from '../../../shared/plots';

// An invented countershaft: bearings at 20 and 380 mm, a spur gear at 120 and a V-belt pulley at 300.
const COUNTERSHAFT: CalcInput = {
  units: 'SI',
  material: { E: 207, G: 79.3, Sy: 530, Su: 630 },
  segments: [
    { length: 40, od: 40, id: 0 },
    { length: 300, od: 50, id: 0 },
    { length: 60, od: 40, id: 0 },
  ],
  torques: [
    { at: 120, T: 400 },
    { at: 300, T: -400 },
  ],
  supports: [
    { at: 20, kind: 'deep-groove-ball', C: 30 },
    { at: 380, kind: 'cylindrical-roller', C: 45 },
  ],
  loads: [
    { at: 120, kind: 'gear', pitchDiameter: 160, direction: 0, label: 'pinion' },
    { at: 300, kind: 'pulley', diameter: 250, direction: 90 },
  ],
  speed: 900,
};

const result = evaluateShaft(COUNTERSHAFT);
const outline = shaftOutline(COUNTERSHAFT);
const loads = shaftLoads(result, outline);

describe('bearings and forces on the outline plot', () => {
  it('when a calc has bearings, then each is marked at its station on the shaft surface, tagged B1, B2', () => {
    expect(loads.bearings.map((b) => [b.tag, b.at, b.top])).toEqual([
      ['B1', 20, 20],
      ['B2', 380, 20],
    ]);
    const upper = loads.bearings[0].shapes[0];
    expect(upper.kind === 'rect' && [upper.y, upper.x + upper.width / 2]).toEqual([20, 20]);
  });

  it('when forces are drawn, then there is an arrow per load and per reaction, tagged by element kind, the largest at full length', () => {
    expect(loads.arrows.map((a) => a.tag)).toEqual(['G1', 'P2', 'B1', 'B2']);
    expect(Math.max(...loads.arrows.flatMap((a) => [a.yShare, a.zShare]))).toBeCloseTo(1, 12);
    expect(loads.arrows[0].name).toMatch(/^G1 Gear, pinion: Fy .* N, Fz .* N$/);
    expect(loads.arrows.filter((a) => a.isReaction).map((a) => a.at)).toEqual([20, 380]);
  });

  it('when the arrows are summed, then applied forces and reactions balance in both planes, as the picture should show', () => {
    const sum = (k: 'Fy' | 'Fz') => loads.arrows.reduce((s, a) => s + a[k], 0);
    const scale = Math.max(...loads.arrows.map((a) => Math.hypot(a.Fy, a.Fz)));
    expect(Math.abs(sum('Fy')) / scale).toBeLessThan(1e-9);
    expect(Math.abs(sum('Fz')) / scale).toBeLessThan(1e-9);
  });

  it('when a calc has no bearings, or a stored result predates them, then there is no model to draw', () => {
    const v1 = evaluateShaft({ ...COUNTERSHAFT, supports: undefined, loads: undefined });
    expect(hasBeamModel(v1)).toBe(false);
    const { supports: _s, ...stored } = result;
    expect(hasBeamModel(stored as typeof result)).toBe(false);
    expect(hasBeamModel(result)).toBe(true);
  });
});

describe('bending, deflection and slope diagrams', () => {
  it('when the bending moment is plotted, then the resultant is √(My² + Mz²) at every station and zero at the outer bearings', () => {
    const c = bendingPlot(result);
    const [M, My, Mz] = c.series;
    expect(c.series.map((s) => s.style)).toEqual(['solid', 'dashed', 'dotted']);
    M.points.forEach(([x, m], i) => {
      expect(My.points[i][0]).toBe(x);
      expect(m).toBeCloseTo(Math.hypot(My.points[i][1], Mz.points[i][1]), 9);
    });
    const at = (x: number) => M.points.find((p) => Math.abs(p[0] - x) < 1e-9)?.[1];
    expect(at(20)).toBeCloseTo(0, 6);
    expect(at(380)).toBeCloseTo(0, 6);
    expect(c.yUnit).toBe(result.fields['M']?.unit ?? 'N·m');
  });

  it('when a deflection limit applies at a gear, then it is a short line centred on the gear station, and shaft-wide limits span the shaft', () => {
    const c = deflectionPlot(result, [
      { at: 120, value: 0.1, label: '§6.1 0.1 mm' },
      { at: null, value: 0.2, label: 'overall' },
    ]);
    expect(c.limits[0]).toEqual({ y: 0.1, x1: 120 - 8, x2: 120 + 8, label: '§6.1 0.1 mm' });
    expect(c.limits[1]).toMatchObject({ y: 0.2, x1: 0, x2: 400 });
    const largest = Math.max(...c.series[0].points.map((p) => p[1]));
    expect(largest).toBeCloseTo(result.deflection!.max, 9);
  });

  it('when the slope is plotted, then its values at the bearings are the ones in the reaction table', () => {
    const c = slopePlot(result);
    for (const s of result.supports) {
      const p = c.series[0].points.find(([x]) => Math.abs(x - s.at) < 1e-9);
      expect(p?.[1]).toBeCloseTo(s.slope, 12);
    }
  });
});

describe('limits from the standard on the deflection and slope plots', () => {
  const row = (clauseId: string, at: number | null, limit: number, unit: string) => ({
    clauseId,
    clauseTitle: '',
    reference: '',
    severity: 'mandatory',
    status: 'pass',
    location: { scope: 'shaft', index: null, at, label: '' },
    actual: 0,
    limit,
    unit,
    utilisation: 0,
    utilisationBasis: 'actual/limit',
    message: '',
    warnings: [],
  });
  const ruleSet = {
    clauses: [
      { id: '6.1', measure: { actual: 'gearDeflection' } },
      { id: '6.2', measure: { actual: 'bearingSlope' } },
      { id: '4.1', measure: { actual: 'tauMax' } },
    ],
  };
  const checklist = {
    rows: [
      row('6.1', 120, 0.13, 'mm'),
      row('6.2', 20, 1, 'mrad'),
      row('6.2', 380, 1, 'mrad'),
      row('4.1', 40, 60, 'MPa'),
    ],
  };

  it("when clauses measure a deflection or a slope, then each row becomes a limit at its station, in the curve's unit, the clause named once", async () => {
    const { shaftLimits } = await import('../../../shared/plots');
    expect(shaftLimits(checklist as never, ruleSet as never, result, 'deflection')).toEqual([
      { at: 120, value: 0.13, label: '§6.1 0.13 mm' },
    ]);
    const slope = shaftLimits(checklist as never, ruleSet as never, result, 'slope');
    expect(slope.map((l) => [l.at, l.value, l.label])).toEqual([
      [20, 0.001, '§6.2 1 mrad'],
      [380, 0.001, '1 mrad'],
    ]);
  });

  it('when a pulley pulls straight along z, then its arrow has no stub in y from round-off', () => {
    const pulley = loads.arrows.find((a) => a.tag === 'P2')!;
    expect(pulley.Fy).toBe(0);
    expect(pulley.yShare).toBe(0);
  });
});
