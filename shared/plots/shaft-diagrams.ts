import type { CalcResult } from '../engine';
import { beamUnit } from './beam-units';
import { chart } from './diagrams';
import type { Chart, LimitLine, Point, Series } from './plot-types';

/*
 * Diagrams of the whole-shaft model: the bending moment in each plane and the resultant, and the
 * deflection and slope curves with the standard's limits drawn at the stations they judge.
 */

/** A clause limit at one station (a gear's deflection, a bearing's slope), or over the shaft when `at` is null. */
export interface StationLimit {
  at: number | null;
  value: number;
  label: string;
}

// A limit that applies at a station is drawn as a short line centred on it, wide enough to see.
const STATION_SPAN = 0.04;

function placed(result: CalcResult, limits: readonly StationLimit[]): LimitLine[] {
  const half = (STATION_SPAN * result.length) / 2;
  return limits.map((l) =>
    l.at === null
      ? { value: l.value, label: l.label }
      : { value: l.value, label: l.label, from: l.at - half, to: l.at + half },
  );
}

function series(id: string, label: string, points: Point[], style: Series['style']): Series {
  return { id, label, points, shape: 'line', style };
}

/**
 * Bending moment along the shaft from the bearings and forces: My from the y-forces (x–y plane), Mz
 * from the z-forces, and the resultant M = √(My² + Mz²) that the fatigue check uses.
 */
export function bendingPlot(result: CalcResult): Chart {
  const d = result.bendingDiagram;
  const unit = beamUnit(result, 'M');
  return chart(
    result,
    'Bending moment from the forces',
    { label: 'M', unit },
    [
      series(
        'M',
        'Resultant M',
        d.map((p) => [p.at, p.M] as const),
        'solid',
      ),
      series(
        'My',
        'My, x–y plane',
        d.map((p) => [p.at, p.My] as const),
        'dashed',
      ),
      series(
        'Mz',
        'Mz, x–z plane',
        d.map((p) => [p.at, p.Mz] as const),
        'dotted',
      ),
    ],
    [],
  );
}

/**
 * The curve is sampled between stations while the engine finds the largest deflection exactly; the
 * largest point is put on the curve, so the plot's peak is the figure in the table, not a bit below it.
 */
function withLargest(points: Point[], largest: CalcResult['deflection']): Point[] {
  if (!largest || points.some(([x]) => Math.abs(x - largest.at) < 1e-9 * Math.max(1, Math.abs(x)))) return points;
  const i = points.findIndex(([x]) => x > largest.at);
  return i < 0
    ? [...points, [largest.at, largest.max]]
    : [...points.slice(0, i), [largest.at, largest.max], ...points.slice(i)];
}

/** Transverse deflection along the shaft: the resultant and its y and z parts, with deflection limits. */
export function deflectionPlot(result: CalcResult, limits: readonly StationLimit[] = []): Chart {
  const c = result.deflectionCurve;
  const unit = beamUnit(result, 'deflection');
  return chart(
    result,
    'Deflection of the shaft',
    { label: 'δ', unit },
    [
      series(
        'd',
        'Resultant δ',
        withLargest(
          c.map((p) => [p.at, p.deflection] as const),
          result.deflection,
        ),
        'solid',
      ),
      series(
        'y',
        'δy',
        c.map((p) => [p.at, p.y] as const),
        'dashed',
      ),
      series(
        'z',
        'δz',
        c.map((p) => [p.at, p.z] as const),
        'dotted',
      ),
    ],
    placed(result, limits),
  );
}

/** Resultant slope along the shaft, where the slope limits at the bearings are judged. */
export function slopePlot(result: CalcResult, limits: readonly StationLimit[] = []): Chart {
  const c = result.deflectionCurve;
  const unit = beamUnit(result, 'slope');
  return chart(
    result,
    'Slope of the shaft',
    { label: 'θ', unit },
    [
      series(
        'slope',
        'Resultant slope θ',
        c.map((p) => [p.at, p.slope] as const),
        'solid',
      ),
    ],
    placed(result, limits),
  );
}
