import { TestBed } from '@angular/core/testing';
import { evaluateShaft } from '../../../../shared/engine';
import { shaftOutline, shearPlot } from '../../../../shared/plots';
import { CHART_MARGIN, layoutChart } from './chart-layout';
import { describeChart, summariseChart } from './chart-summary';
import { layoutOutline } from './outline-layout';
import { DiagramChart } from './diagram-chart';

// An invented stepped shaft: 40 mm then 50 mm, 800 N·m between stations 20 and 280.
const INPUT = {
  units: 'SI' as const,
  material: { E: 207, G: 79.3, Sy: 530, Su: 630 },
  segments: [
    { length: 100, od: 40, id: 0 },
    { length: 200, od: 50, id: 20 },
  ],
  torques: [
    { at: 20, T: 800 },
    { at: 280, T: -800 },
  ],
  features: [{ type: 'shoulder-fillet' as const, at: 100, r: 2 }],
};
const result = evaluateShaft(INPUT);
const chart = shearPlot(result, [{ value: 60, label: '§4.1 allowable τ 60 MPa' }]);

describe('chart layout in pixels', () => {
  const l = layoutChart(chart, 600, 200);

  it('when laid out, then every tick and the limit line sit inside the plot frame', () => {
    for (const t of l.xTicks) expect(t.at).toBeGreaterThanOrEqual(CHART_MARGIN.left - 1e-9);
    for (const t of l.xTicks) expect(t.at).toBeLessThanOrEqual(600 - CHART_MARGIN.right + 1e-9);
    expect(l.limits[0].y).toBeGreaterThan(l.plot.top);
    expect(l.limits[0].y).toBeLessThan(l.plot.bottom);
    expect(l.series[0].d.startsWith('M')).toBe(true);
    expect(l.series[0].fill).toMatch(/Z$/);
  });

  it('when a chart is summarised, then the aria text names the range and the limit, and the rows give each stretch', () => {
    expect(describeChart(chart)).toMatch(
      /^Shear stress along the shaft, along 300 mm: .*limit §4\.1 allowable τ 60 MPa at 60 MPa\.$/,
    );
    expect(summariseChart(chart)[0].rows[0]).toEqual({ where: '0–20 mm', value: '0' });
  });
});

describe('shaft outline layout', () => {
  it('when laid out, then x and y share one scale, so the drawing is to scale', () => {
    const l = layoutOutline(shaftOutline(INPUT), 640);
    const [a, b] = l.segments;
    expect(a.w / 100).toBeCloseTo(b.w / 200, 2); // pixels are rounded to 0.1
    expect(a.h / 40).toBeCloseTo(a.w / 100, 1);
    expect(l.bores).toHaveLength(1);
    expect(l.features[0].tag).toBe('SF1');
  });
});

describe('DiagramChart', () => {
  it('when rendered, then it is one image with a descriptive label and a hidden data table', () => {
    const fixture = TestBed.createComponent(DiagramChart);
    fixture.componentRef.setInput('chart', chart);
    fixture.detectChanges();
    const svg: SVGElement = fixture.nativeElement.querySelector('svg');
    expect(svg.getAttribute('role')).toBe('img');
    expect(svg.getAttribute('aria-label')).toContain('allowable τ');
    expect(fixture.nativeElement.querySelector('.tt-visually-hidden table caption').textContent).toContain(
      'Shear stress τmax (MPa)',
    );
    expect(fixture.nativeElement.querySelector('.limit-label').textContent).toContain('§4.1');
  });
});
