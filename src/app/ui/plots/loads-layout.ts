import type { MarkShape, ShaftLoads } from '../../../../shared/plots';
import type { OutlineLayout } from './outline-layout';

/** Longest arrow in pixels (the largest force); the shortest drawn is kept visible. */
export const ARROW_PX = 46;
const MIN_ARROW_PX = 9;
/** Room above and below the shaft for arrows and their tags. */
export const LOADS_ROOM = { above: ARROW_PX + 18, below: ARROW_PX + 18 };

export interface PixelArrow { tag: string; d: string; head: string; tagX: number; tagY: number; isReaction: boolean }
export interface PixelOutOfPlane { cx: number; cy: number; r: number; isTowardViewer: boolean; isReaction: boolean; tag: string }
export interface PixelBearing { tag: string; d: string; tagX: number; tagY: number }
export interface LoadsLayout { arrows: PixelArrow[]; outOfPlane: PixelOutOfPlane[]; bearings: PixelBearing[] }

const r1 = (v: number): number => Math.round(v * 10) / 10;

function shapePath(m: MarkShape, X: (x: number) => number, Y: (y: number) => number): string {
  switch (m.kind) {
    case 'rect': return `M${r1(X(m.x))},${r1(Y(m.y))} H${r1(X(m.x + m.width))} V${r1(Y(m.y + m.height))} H${r1(X(m.x))} Z`;
    case 'line': return `M${r1(X(m.x1))},${r1(Y(m.y1))} L${r1(X(m.x2))},${r1(Y(m.y2))}`;
    case 'polyline': return m.points.map(([x, y], i) => `${i ? 'L' : 'M'}${r1(X(x))},${r1(Y(y))}`).join(' ');
    case 'circle': return '';
  }
}

/**
 * Arrows in pixels on an outline already laid out: an in-plane (y) arrow points the way the force acts
 * and ends on the shaft surface (a reaction on the outside of its bearing mark); a force along z is
 * drawn at the centre line as ⊙ (towards the viewer) or ⊗ (away), as drawings usually show it.
 */
export function layoutLoads(loads: ShaftLoads, l: OutlineLayout): LoadsLayout {
  const X = (x: number) => l.shaftLeft + x * l.scale;
  const Y = (y: number) => l.centreY - y * l.scale;
  const bearingAt = new Map(loads.bearings.map((b) => [b.tag, b]));
  const markPx = (tag: string) => {
    const b = bearingAt.get(tag);
    const square = b?.shapes.find((s) => s.kind === 'rect');
    return b && square?.kind === 'rect' ? square.height * l.scale : 0;
  };
  const arrows: PixelArrow[] = [];
  const outOfPlane: PixelOutOfPlane[] = [];
  for (const a of loads.arrows) {
    const x = r1(X(a.at));
    if (a.yShare > 0) {
      const len = Math.max(MIN_ARROW_PX, a.yShare * ARROW_PX);
      const up = a.Fy > 0;
      // An upward force pushes on the underside; a downward one on the top.
      const surface = (up ? Y(-a.top) : Y(a.top)) + (up ? 1 : -1) * (a.isReaction ? markPx(a.tag) : 0);
      const tail = surface + (up ? len : -len);
      const h = up ? -6 : 6;
      arrows.push({
        // A reaction is named by its bearing's tag above the shaft; only applied forces carry a tag at the tail.
        tag: a.isReaction ? '' : a.tag, isReaction: a.isReaction, d: `M${x},${r1(tail)} L${x},${r1(surface)}`,
        head: `M${r1(x - 3.5)},${r1(surface - h)} L${x},${r1(surface)} L${r1(x + 3.5)},${r1(surface - h)} Z`,
        tagX: x, tagY: r1(up ? tail + 11 : tail - 4),
      });
    }
    if (a.zShare > 0) outOfPlane.push({ cx: x, cy: r1(l.centreY), r: 5, isTowardViewer: a.Fz > 0, isReaction: a.isReaction, tag: a.tag });
  }
  const bearings = loads.bearings.map((b): PixelBearing => ({
    tag: b.tag, d: b.shapes.map((m) => shapePath(m, X, Y)).join(' '), tagX: r1(X(b.at)), tagY: r1(Y(b.top) - markPx(b.tag) - 4),
  }));
  return { arrows, outOfPlane, bearings };
}
