import { featureTag } from '../engine/field-places';
import type { FeatureInput } from '../engine';
import type { Axis, Point } from './plot-types';
import { niceAxis } from './ticks';
import { featureMarks } from './feature-marks';

export interface OutlineRect {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface OutlineSegment extends OutlineRect {
  index: number;
  label: string | undefined;
  od: number;
  id: number;
}

export type MarkShape =
  | ({ kind: 'rect' } & OutlineRect)
  | { kind: 'circle'; cx: number; cy: number; r: number }
  | { kind: 'polyline'; points: Point[] }
  | { kind: 'line'; x1: number; y1: number; x2: number; y2: number };

export interface OutlineFeature {
  index: number;
  type: FeatureInput['type'];
  /** Short tag shown on the drawing and in the results tables, e.g. KS1. */
  tag: string;
  name: string;
  at: number;
  /** Outer radius of the section the feature is judged on: where its label leader starts. */
  top: number;
  /** Label row above the shaft, so tags of close features do not overlap. */
  level: number;
  shapes: MarkShape[];
}

export interface ShaftOutline {
  length: number;
  maxRadius: number;
  segments: OutlineSegment[];
  /** Bores of hollow segments, drawn as hidden (dashed) lines. */
  bores: OutlineRect[];
  features: OutlineFeature[];
  x: Axis;
}

export interface OutlineInput {
  segments: readonly { length: number; od: number; id: number; label?: string }[];
  features?: readonly FeatureInput[];
}

// Feature tags live with the engine's field places, so messages and plots tag a feature alike.
export { featureTag };

// Tags closer than this share of the shaft length go on alternate rows.
const LABEL_GAP = 0.07;

function assignLevels(features: OutlineFeature[], length: number): void {
  const lastAt: number[] = [];
  for (const f of [...features].sort((a, b) => a.at - b.at)) {
    let level = lastAt.findIndex((x) => f.at - x >= LABEL_GAP * length);
    if (level < 0) level = lastAt.length;
    lastAt[level] = f.at;
    f.level = level;
  }
}

/**
 * The shaft drawn to scale in its own length unit: one rectangle per segment (a shoulder shows as the
 * end face of the larger one), bores as hidden lines, and each feature marked at its station with a tag.
 */
export function shaftOutline(input: OutlineInput): ShaftOutline {
  let x = 0;
  const segments = input.segments.map((s, index): OutlineSegment => {
    const seg = { index, label: s.label, od: s.od, id: s.id, x, y: -s.od / 2, width: s.length, height: s.od };
    x += s.length;
    return seg;
  });
  const bores = segments.filter((s) => s.id > 0).map((s) => ({ x: s.x, y: -s.id / 2, width: s.width, height: s.id }));
  const features = (input.features ?? []).map((f, index) => featureMarks(f, index, segments));
  for (const f of features) f.tag = featureTag(f.type, f.index);
  assignLevels(features, x);
  return {
    length: x,
    maxRadius: Math.max(0, ...segments.map((s) => s.od / 2)),
    segments,
    bores,
    features,
    x: niceAxis(0, x, 8),
  };
}
