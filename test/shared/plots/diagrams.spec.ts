import { evaluateShaft, type CalcResult } from '../../../shared/engine';
import { shearPlot, torquePlot, twistPlot, twistRatePlot } from '../../../shared/plots';
import { expectClose, loadFixture } from '../engine/check-helpers';

const conveyor: CalcResult = evaluateShaft(loadFixture('five-segment-fatigue.json'));

describe('torque diagram', () => {
  const chart = torquePlot(conveyor);

  it('when drawn, then each piece of the torque diagram is one flat step at its internal torque', () => {
    const t = chart.series[0];
    expect(t.shape).toBe('step');
    expect(t.points).toHaveLength(2 * conveyor.torqueDiagram.length);
    conveyor.torqueDiagram.forEach((p, i) => {
      expect(t.points[2 * i]).toEqual([p.start, p.T]);
      expect(t.points[2 * i + 1]).toEqual([p.end, p.T]);
    });
  });

  it('when the calc has an alternating part, then it is a second, dashed series', () => {
    expect(chart.series.map((s) => [s.id, s.style])).toEqual([
      ['T', 'solid'],
      ['Ta', 'dashed'],
    ]);
  });

  it('when drawn, then axes carry the result units and cover the data with zero on the y axis', () => {
    expect([chart.xUnit, chart.yUnit]).toEqual(['mm', 'N·m']);
    expect(chart.x).toMatchObject({ min: 0, max: 410, ticks: [0, 50, 100, 150, 200, 250, 300, 350, 400] });
    // The drive is at the left end, so the internal torque is negative (right-hand rule convention).
    expect(chart.y.max).toBeGreaterThanOrEqual(0);
    expect(chart.y.min).toBeLessThan(-150.78);
  });
});

describe('shear stress along the shaft', () => {
  it('when drawn, then the largest step equals the largest segment τmax of the results table', () => {
    const chart = shearPlot(conveyor);
    const peak = Math.max(...chart.series[0].points.map((p) => p[1]));
    expectClose(peak, Math.max(...conveyor.segments.map((s) => s.tauMax)), 1e-12);
    expect(chart.yUnit).toBe('MPa');
  });

  it('when a piece carries no torque, then its stress is zero, not NaN', () => {
    const pts = shearPlot(conveyor).series[0].points;
    expect(pts[0]).toEqual([0, 0]);
    expect(pts.every(([x, y]) => Number.isFinite(x) && Number.isFinite(y))).toBe(true);
  });

  it('when a limit is given over part of the shaft, then it is placed there and widens the y axis', () => {
    const chart = shearPlot(conveyor, [{ value: 85.05, label: 'allowable τ (with keyway)', from: 40, to: 160 }]);
    expect(chart.limits).toEqual([{ y: 85.05, x1: 40, x2: 160, label: 'allowable τ (with keyway)' }]);
    expect(chart.y.max).toBeGreaterThanOrEqual(85.05);
  });

  it('when a limit is not finite or lies off the shaft, then it is dropped rather than drawn wrong', () => {
    const chart = shearPlot(conveyor, [
      { value: Number.NaN, label: 'x' },
      { value: 10, label: 'y', from: 500, to: 600 },
    ]);
    expect(chart.limits).toEqual([]);
  });
});

describe('accumulated twist', () => {
  it('when drawn, then it starts at zero and ends at the engine total twist', () => {
    const pts = twistPlot(conveyor).series[0].points;
    expect(pts[0]).toEqual([0, 0]);
    const last = pts[pts.length - 1];
    expect(last[0]).toBe(410);
    expectClose(last[1], conveyor.twistTotal, 1e-12);
  });

  it('when drawn, then every piece end matches twistStart of the next piece', () => {
    const pts = twistPlot(conveyor).series[0].points;
    conveyor.torqueDiagram.slice(1).forEach((p, i) => expect(pts[i + 1][1]).toBeCloseTo(p.twistStart, 12));
  });

  it('when the shaft twists negatively (right-hand rule), then a magnitude limit is drawn on the negative side (common practice, no source)', () => {
    const limits = twistPlot(conveyor, [{ value: 0.5, label: '0.5 deg' }]).limits;
    expect(conveyor.twistTotal).toBeLessThan(0);
    expect(limits.map((l) => l.y)).toEqual([-0.5]);
  });

  it('when the calc is in US units, then the twist still ends at the engine total (deg/ft × in)', () => {
    const us = evaluateShaft(loadFixture('stepped-us.json'));
    const pts = twistPlot(us).series[0].points;
    expectClose(pts[pts.length - 1][1], us.twistTotal, 1e-9);
    expect(twistPlot(us).xUnit).toBe('in');
  });
});

describe('twist per unit length', () => {
  it('when drawn, then each piece shows the magnitude of its twist rate, peaking at the segment maximum', () => {
    const chart = twistRatePlot(conveyor, [{ value: 0.25, label: '0.25 deg/m' }]);
    const ys = chart.series[0].points.map((p) => p[1]);
    expect(Math.min(...ys)).toBeGreaterThanOrEqual(0);
    expectClose(Math.max(...ys), Math.max(...conveyor.segments.map((s) => s.twistPerLength)), 1e-12);
    expect(chart.yUnit).toBe('deg/m');
    expect(chart.limits[0]).toMatchObject({ y: 0.25, x1: 0, x2: 410 });
  });
});
