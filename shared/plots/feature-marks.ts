import type { FeatureInput } from '../engine';
import type { Point } from './plot-types';
import type { MarkShape, OutlineFeature, OutlineSegment } from './outline';

const NAMES: Record<FeatureInput['type'], string> = {
  'shoulder-fillet': 'Shoulder fillet',
  keyseat: 'Keyseat',
  'ring-groove': 'Ring groove',
  'cross-hole': 'Cross hole',
};

// The engine judges a feature at a joint on the smaller segment; the drawing marks the same section.
function sectionAt(at: number, segments: readonly OutlineSegment[]): OutlineSegment | undefined {
  const eps = 1e-9 * Math.max(1, at);
  const touching = segments.filter((s) => at >= s.x - eps && at <= s.x + s.width + eps);
  return touching.sort((a, b) => a.od - b.od)[0];
}

/** Quarter circle as points (a PDF writer and SVG both draw polylines; 9 points look round at any scale). */
function quarter(cx: number, cy: number, r: number, fromDeg: number): Point[] {
  return Array.from({ length: 9 }, (_, i) => {
    const a = ((fromDeg + (i * 90) / 8) * Math.PI) / 180;
    return [cx + r * Math.cos(a), cy + r * Math.sin(a)] as const;
  });
}

function mirrored(points: Point[]): Point[] {
  return points.map(([px, py]) => [px, -py] as const);
}

function filletShapes(
  f: Extract<FeatureInput, { type: 'shoulder-fillet' }>,
  segments: readonly OutlineSegment[],
): MarkShape[] {
  const eps = 1e-9 * Math.max(1, f.at);
  const left = segments.find((s) => Math.abs(s.x + s.width - f.at) <= eps);
  const right = segments.find((s) => Math.abs(s.x - f.at) <= eps);
  if (!left || !right || left.od === right.od) return [];
  const rs = Math.min(left.od, right.od) / 2;
  // The fillet runs from the smaller diameter's surface into the shoulder face.
  const top = left.od < right.od ? quarter(f.at - f.r, rs + f.r, f.r, -90) : quarter(f.at + f.r, rs + f.r, f.r, 180);
  return [
    { kind: 'polyline', points: top },
    { kind: 'polyline', points: mirrored(top) },
  ];
}

function keyseatShapes(f: Extract<FeatureInput, { type: 'keyseat' }>, top: number, seg: OutlineSegment): MarkShape[] {
  // Drawn only when length and key height are entered; the seat depth is taken as h/2, the usual proportion.
  if (f.length === undefined || f.height === undefined) return [];
  const x1 = Math.max(seg.x, f.at - f.length / 2);
  const x2 = Math.min(seg.x + seg.width, f.at + f.length / 2);
  return [{ kind: 'rect', x: x1, y: top - f.height / 2, width: x2 - x1, height: f.height / 2 }];
}

function grooveShapes(f: Extract<FeatureInput, { type: 'ring-groove' }>, top: number): MarkShape[] {
  const w = f.width ?? 0;
  return [1, -1].map((side): MarkShape =>
    w > 0
      ? { kind: 'rect', x: f.at - w / 2, y: side > 0 ? top - f.depth : -top, width: w, height: f.depth }
      : { kind: 'line', x1: f.at, y1: side * top, x2: f.at, y2: side * (top - f.depth) },
  );
}

function shapesOf(f: FeatureInput, top: number, seg: OutlineSegment, segments: readonly OutlineSegment[]): MarkShape[] {
  switch (f.type) {
    case 'shoulder-fillet':
      return filletShapes(f, segments);
    case 'keyseat':
      return keyseatShapes(f, top, seg);
    case 'ring-groove':
      return grooveShapes(f, top);
    case 'cross-hole':
      return [{ kind: 'circle', cx: f.at, cy: 0, r: f.diameter / 2 }];
  }
}

/** Marks of one feature at its station, in the shaft's length unit; tag and level are set by the caller. */
export function featureMarks(f: FeatureInput, index: number, segments: readonly OutlineSegment[]): OutlineFeature {
  const seg = sectionAt(f.at, segments);
  const top = seg ? seg.od / 2 : 0;
  const name = f.type === 'keyseat' ? `${NAMES[f.type]}, ${f.form}` : NAMES[f.type];
  return {
    index,
    type: f.type,
    tag: '',
    name: f.label ? `${name}, ${f.label}` : name,
    at: f.at,
    top,
    level: 0,
    shapes: seg ? shapesOf(f, top, seg, segments) : [],
  };
}
