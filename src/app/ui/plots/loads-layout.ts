import type { MarkShape, ShaftLoads } from '../../../../shared/plots';
import type { OutlineLayout } from './outline-layout';

/** Longest arrow in pixels (the largest force); the shortest drawn is kept visible. */
export const ARROW_PX = 46;
const MIN_ARROW_PX = 9;
const TAG_PX = 18;
/** Height of the strip under the side view that shows the x–z plane and its forces. */
const PLAN_PX = 2 * ARROW_PX + 2 * TAG_PX;
/** Room above and below the shaft: y arrows and their tags, then the x–z strip below. */
export const LOADS_ROOM = { above: ARROW_PX + TAG_PX, below: ARROW_PX + TAG_PX + PLAN_PX };

export interface PixelArrow {
  tag: string;
  d: string;
  head: string;
  tagX: number;
  tagY: number;
  isReaction: boolean;
}
export interface PixelBearing {
  tag: string;
  d: string;
  tagX: number;
  tagY: number;
}
export interface PlanStrip {
  y: number;
  x1: number;
  x2: number;
  labelY: number;
  arrows: PixelArrow[];
  supports: string[];
}
export interface LoadsLayout {
  arrows: PixelArrow[];
  bearings: PixelBearing[];
  plan: PlanStrip;
}

const r1 = (v: number): number => Math.round(v * 10) / 10;

function shapePath(m: MarkShape, X: (x: number) => number, Y: (y: number) => number): string {
  switch (m.kind) {
    case 'rect':
      return `M${r1(X(m.x))},${r1(Y(m.y))} H${r1(X(m.x + m.width))} V${r1(Y(m.y + m.height))} H${r1(X(m.x))} Z`;
    case 'line':
      return `M${r1(X(m.x1))},${r1(Y(m.y1))} L${r1(X(m.x2))},${r1(Y(m.y2))}`;
    case 'polyline':
      return m.points.map(([x, y], i) => `${i ? 'L' : 'M'}${r1(X(x))},${r1(Y(y))}`).join(' ');
    case 'circle':
      return '';
  }
}

/** An arrow at x whose head ends at `tip`, pointing up (towards smaller pixel y) when `up`. */
function arrowAt(x: number, tip: number, share: number, up: boolean, tag: string, isReaction: boolean): PixelArrow {
  const len = Math.max(MIN_ARROW_PX, share * ARROW_PX);
  const tail = tip + (up ? len : -len);
  const h = up ? -6 : 6;
  return {
    tag,
    isReaction,
    d: `M${r1(x)},${r1(tail)} L${r1(x)},${r1(tip)}`,
    head: `M${r1(x - 3.5)},${r1(tip - h)} L${r1(x)},${r1(tip)} L${r1(x + 3.5)},${r1(tip - h)} Z`,
    tagX: r1(x),
    tagY: r1(up ? tail + 11 : tail - 4),
  };
}

/**
 * Arrows in pixels on an outline already laid out. In the side view (x–y plane) an arrow points the
 * way Fy acts and ends on the shaft surface (a reaction on the outside of its bearing mark). Below it,
 * a strip shows the x–z plane on the same stations, z upwards, with Fz as arrows ending on the axis.
 * Reactions carry no tag of their own: the bearing's tag names them.
 */
export function layoutLoads(loads: ShaftLoads, l: OutlineLayout): LoadsLayout {
  const X = (x: number) => l.shaftLeft + x * l.scale;
  const Y = (y: number) => l.centreY - y * l.scale;
  const markPx = (tag: string) => {
    const square = loads.bearings.find((b) => b.tag === tag)?.shapes.find((s) => s.kind === 'rect');
    return square?.kind === 'rect' ? square.height * l.scale : 0;
  };
  const planY = r1(l.axisY - 12 - PLAN_PX / 2);
  const arrows: PixelArrow[] = [];
  const planArrows: PixelArrow[] = [];
  for (const a of loads.arrows) {
    const tag = a.isReaction ? '' : a.tag;
    if (a.yShare > 0) {
      // An upward force pushes on the underside; a downward one on the top.
      const up = a.Fy > 0;
      const tip = (up ? Y(-a.top) : Y(a.top)) + (up ? 1 : -1) * (a.isReaction ? markPx(a.tag) : 0);
      arrows.push(arrowAt(X(a.at), tip, a.yShare, up, tag, a.isReaction));
    }
    if (a.zShare > 0)
      planArrows.push(arrowAt(X(a.at), planY + (a.Fz > 0 ? 2 : -2), a.zShare, a.Fz > 0, tag, a.isReaction));
  }
  const bearings = loads.bearings.map((b): PixelBearing => ({
    tag: b.tag,
    d: b.shapes.map((m) => shapePath(m, X, Y)).join(' '),
    tagX: r1(X(b.at)),
    tagY: r1(Y(b.top) - markPx(b.tag) - 4),
  }));
  // In the strip a bearing is a small square on the axis, like its side-view mark seen end-on.
  const supports = loads.bearings.map((b) => `M${r1(X(b.at) - 3)},${r1(planY - 3)} h6 v6 h-6 Z`);
  return {
    arrows,
    bearings,
    plan: {
      y: planY,
      x1: r1(l.shaftLeft),
      x2: r1(l.shaftRight),
      labelY: r1(planY - PLAN_PX / 2 + 10),
      arrows: planArrows,
      supports,
    },
  };
}
