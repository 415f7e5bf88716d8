import type { MarkShape, ShaftOutline } from '../../../../shared/plots';
import { formatNumber } from '../../../../shared/engine/number-format';
import { tickLabel, type PixelTick } from './chart-layout';

const SIDE = 24;
const ROW = 17;
const AXIS = 34;
/** A short, thick shaft would otherwise grow taller than the screen; it is scaled down instead. */
const MAX_SHAFT_PX = 230;

export interface PixelRect {
  x: number;
  y: number;
  w: number;
  h: number;
}
export interface PixelSegment extends PixelRect {
  index: number;
  diameter: string | null;
}
export type PixelShape =
  | { kind: 'rect'; x: number; y: number; w: number; h: number }
  | { kind: 'circle'; cx: number; cy: number; r: number }
  | { kind: 'path'; d: string };
export interface PixelFeature {
  tag: string;
  name: string;
  x: number;
  top: number;
  bottom: number;
  labelY: number;
  shapes: PixelShape[];
}

export interface OutlineLayout {
  width: number;
  height: number;
  centreY: number;
  shaftLeft: number;
  shaftRight: number;
  axisY: number;
  /** Pixels per length unit, the same on both axes. */
  scale: number;
  segments: PixelSegment[];
  bores: PixelRect[];
  features: PixelFeature[];
  ticks: PixelTick[];
}

const r1 = (v: number): number => Math.round(v * 10) / 10;

/**
 * Lays the outline out at one scale for both axes, so the picture is the shaft to scale. `room` keeps
 * pixels free above and below the shaft for force arrows.
 */
export function layoutOutline(o: ShaftOutline, width: number, room = { above: 0, below: 0 }): OutlineLayout {
  const levels = Math.max(0, ...o.features.map((f) => f.level + 1));
  const top = 8 + levels * ROW + (levels ? 6 : 0) + room.above;
  let s = o.length > 0 ? (width - 2 * SIDE) / o.length : 1;
  if (2 * o.maxRadius * s > MAX_SHAFT_PX) s = MAX_SHAFT_PX / (2 * o.maxRadius);
  const left = (width - o.length * s) / 2;
  const cy = top + o.maxRadius * s + 4;
  const X = (x: number) => r1(left + x * s);
  const Y = (y: number) => r1(cy - y * s);
  const rect = (x: number, y: number, w: number, h: number): PixelRect => ({
    x: X(x),
    y: Y(y + h),
    w: r1(w * s),
    h: r1(h * s),
  });
  const shape = (m: MarkShape): PixelShape => {
    switch (m.kind) {
      case 'rect': {
        const p = rect(m.x, m.y, m.width, m.height);
        return { kind: 'rect', ...p };
      }
      case 'circle':
        return { kind: 'circle', cx: X(m.cx), cy: Y(m.cy), r: r1(Math.max(1.5, m.r * s)) };
      case 'line':
        return { kind: 'path', d: `M${X(m.x1)},${Y(m.y1)} L${X(m.x2)},${Y(m.y2)}` };
      case 'polyline':
        return { kind: 'path', d: m.points.map(([x, y], i) => `${i ? 'L' : 'M'}${X(x)},${Y(y)}`).join(' ') };
    }
  };
  const axisY = cy + o.maxRadius * s + 12 + room.below;
  return {
    width,
    height: axisY + AXIS,
    centreY: cy,
    shaftLeft: X(0),
    shaftRight: X(o.length),
    axisY,
    scale: s,
    segments: o.segments.map((g) => {
      const p = rect(g.x, g.y, g.width, g.height);
      const text = g.id > 0 ? `⌀${formatNumber(g.od, 4)}/${formatNumber(g.id, 4)}` : `⌀${formatNumber(g.od, 4)}`;
      // A diameter is written inside its segment only where it fits; the hidden table has them all.
      return { ...p, index: g.index, diameter: p.w >= text.length * 7 + 6 && p.h >= 15 ? text : null };
    }),
    bores: o.bores.map((b) => rect(b.x, b.y, b.width, b.height)),
    features: o.features.map((f) => ({
      tag: f.tag,
      name: f.name,
      x: X(f.at),
      top: Y(f.top),
      bottom: Y(-f.top),
      labelY: 8 + (levels - f.level) * ROW - 4,
      shapes: f.shapes.map(shape),
    })),
    ticks: o.x.ticks.filter((t) => t <= o.length * 1.0001).map((t) => ({ at: X(t), label: tickLabel(t) })),
  };
}
