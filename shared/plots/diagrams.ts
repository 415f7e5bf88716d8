import { fromBase, toBase } from '../engine/units';
import type { CalcResult } from '../engine';
import type { Chart, LimitLine, PlacedLimit, Point, Series } from './plot-types';
import { niceAxis, valueRange } from './ticks';

// A little headroom above the largest value keeps a peak off the frame and its label readable.
const HEADROOM = 0.06;

function placeLimits(limits: readonly LimitLine[], length: number): PlacedLimit[] {
  return limits
    .filter((l) => Number.isFinite(l.value))
    .map((l) => ({ y: l.value, x1: Math.max(0, l.from ?? 0), x2: Math.min(length, l.to ?? length), label: l.label }))
    .filter((l) => l.x2 > l.x1);
}

/** A chart along the whole shaft: x from 0 to its length, y fitted to the series and the limits. */
export function chart(
  result: CalcResult,
  title: string,
  y: { label: string; unit: string },
  series: Series[],
  limits: readonly LimitLine[],
): Chart {
  const placed = placeLimits(limits, result.length);
  const [lo, hi] = valueRange([...series.flatMap((s) => s.points.map((p) => p[1])), ...placed.map((l) => l.y)], true);
  const pad = (hi - lo) * HEADROOM;
  // The x axis ends where the shaft ends: a diagram drawn past the last segment would suggest more shaft.
  const xAxis = niceAxis(0, result.length, 8);
  const x = { ...xAxis, max: result.length, ticks: xAxis.ticks.filter((t) => t <= result.length * (1 + 1e-9)) };
  return {
    title,
    xLabel: 'Station',
    xUnit: result.fields['at']?.unit ?? '',
    yLabel: y.label,
    yUnit: y.unit,
    x,
    y: niceAxis(lo < 0 ? lo - pad : lo, hi > 0 ? hi + pad : hi, 5),
    series,
    limits: placed,
  };
}

function steps(result: CalcResult, value: (piece: CalcResult['torqueDiagram'][number]) => number): Point[] {
  return result.torqueDiagram.flatMap(
    (p) =>
      [
        [p.start, value(p)],
        [p.end, value(p)],
      ] as Point[],
  );
}

/** Internal torque along the shaft (a step at each applied torque), with the alternating part if any. */
export function torquePlot(result: CalcResult, limits: readonly LimitLine[] = []): Chart {
  const series: Series[] = [
    { id: 'T', label: 'Internal torque T', points: steps(result, (p) => p.T), shape: 'step', style: 'solid' },
  ];
  if (result.torqueDiagram.some((p) => p.Ta !== 0)) {
    series.push({
      id: 'Ta',
      label: 'Alternating torque Ta',
      points: steps(result, (p) => p.Ta),
      shape: 'step',
      style: 'dashed',
    });
  }
  return chart(result, 'Torque diagram', { label: 'Torque', unit: result.fields['T']?.unit ?? '' }, series, limits);
}

/**
 * Nominal τmax = |T|·c/J along the shaft. Each piece scales its segment's τmax by its own torque, so
 * the plot agrees with the results table to the last digit whatever the unit system.
 */
export function shearPlot(result: CalcResult, limits: readonly LimitLine[] = []): Chart {
  const tau = (p: CalcResult['torqueDiagram'][number]): number => {
    const seg = result.segments[p.segment];
    return seg && seg.T !== 0 ? (seg.tauMax * Math.abs(p.T)) / Math.abs(seg.T) : 0;
  };
  const series: Series[] = [
    { id: 'tau', label: 'Shear stress τmax', points: steps(result, tau), shape: 'step', style: 'solid' },
  ];
  return chart(
    result,
    'Shear stress along the shaft',
    { label: 'τmax', unit: result.fields['tauMax']?.unit ?? '' },
    series,
    limits,
  );
}

/** Twist of a piece over `dx` stations, in degrees, through the engine's own unit factors. */
function twistOver(result: CalcResult, perLength: number, dx: number): number {
  const radPerMm = toBase(perLength, 'twistPerLength', result.units);
  return fromBase(radPerMm * toBase(dx, 'length', result.units), 'angle', result.units);
}

/** Accumulated angle of twist from the left end: linear on each piece (twistStart + rate × distance). */
export function twistPlot(result: CalcResult, limits: readonly LimitLine[] = []): Chart {
  const points: Point[] = [];
  for (const p of result.torqueDiagram) {
    if (points.length === 0) points.push([p.start, p.twistStart]);
    points.push([p.end, p.twistStart + twistOver(result, p.twistPerLength, p.end - p.start)]);
  }
  const series: Series[] = [{ id: 'phi', label: 'Accumulated twist φ', points, shape: 'line', style: 'solid' }];
  // Twist is signed (right-hand rule) while limits are magnitudes: draw them on the side the shaft turns.
  const side = result.twistTotal < 0 ? -1 : 1;
  const shown = limits.map((l) => ({ ...l, value: side * l.value }));
  return chart(
    result,
    'Accumulated angle of twist',
    { label: 'φ', unit: result.fields['twistStart']?.unit ?? 'deg' },
    series,
    shown,
  );
}

/** Twist rate |T|/(G·J) along the shaft (a step per piece), where per-length twist limits are judged. */
export function twistRatePlot(result: CalcResult, limits: readonly LimitLine[] = []): Chart {
  const series: Series[] = [
    {
      id: 'rate',
      label: 'Twist per length',
      points: steps(result, (p) => Math.abs(p.twistPerLength)),
      shape: 'step',
      style: 'solid',
    },
  ];
  return chart(
    result,
    'Twist per unit length',
    { label: 'dφ/dx', unit: result.fields['twistPerLength']?.unit ?? '' },
    series,
    limits,
  );
}
