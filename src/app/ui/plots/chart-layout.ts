import type { Chart, Point } from '../../../../shared/plots';
import { formatNumber } from '../../../../shared/engine/number-format';

/** Pixel margins: room for monospace tick labels on the left and below. */
export const CHART_MARGIN = { top: 22, right: 18, bottom: 34, left: 62 } as const;

export interface PixelTick {
  at: number;
  label: string;
}
export interface PixelSeries {
  id: string;
  label: string;
  d: string;
  fill: string | null;
  isDashed: boolean;
  isDotted: boolean;
}
export interface PixelLimit {
  x1: number;
  x2: number;
  y: number;
  label: string;
  labelX: number;
  labelY: number;
  labelAnchor: 'start' | 'end';
}

export interface ChartLayout {
  width: number;
  height: number;
  plot: { left: number; right: number; top: number; bottom: number };
  xTicks: PixelTick[];
  yTicks: PixelTick[];
  zeroY: number | null;
  series: PixelSeries[];
  limits: PixelLimit[];
}

const px = (v: number): string => (Math.round(v * 10) / 10).toString();

function path(points: readonly Point[], sx: (x: number) => number, sy: (y: number) => number): string {
  return points.map(([x, y], i) => `${i ? 'L' : 'M'}${px(sx(x))},${px(sy(y))}`).join(' ');
}

/** Tick text: the axis values are already nice numbers, this only trims float noise. */
export function tickLabel(v: number): string {
  return formatNumber(v, 6);
}

/**
 * Places a chart in a `width` × `height` pixel box: scales, ticks, series paths (with a fill down to
 * zero for the first series) and limit lines with their labels kept inside the frame.
 */
export function layoutChart(chart: Chart, width: number, height: number): ChartLayout {
  const m = CHART_MARGIN;
  const plot = { left: m.left, right: width - m.right, top: m.top, bottom: height - m.bottom };
  const sx = (x: number) => plot.left + ((x - chart.x.min) / (chart.x.max - chart.x.min)) * (plot.right - plot.left);
  const sy = (y: number) => plot.bottom - ((y - chart.y.min) / (chart.y.max - chart.y.min)) * (plot.bottom - plot.top);
  const zero = chart.y.min <= 0 && chart.y.max >= 0 ? sy(0) : null;
  const series = chart.series.map((s, i): PixelSeries => {
    const d = path(s.points, sx, sy);
    const first = s.points[0];
    const last = s.points[s.points.length - 1];
    const base = zero ?? plot.bottom;
    const fill =
      i === 0 && first && last ? `${d} L${px(sx(last[0]))},${px(base)} L${px(sx(first[0]))},${px(base)} Z` : null;
    return { id: s.id, label: s.label, d, fill, isDashed: s.style === 'dashed', isDotted: s.style === 'dotted' };
  });
  const limits = chart.limits.map((l): PixelLimit => {
    const [x1, x2] = [sx(l.x1), sx(l.x2)];
    // Labels sit at the right end of the line unless the line ends near the left of the frame.
    const atRight = x2 - plot.left > 140;
    const y = sy(l.y);
    // Above the line, unless that would touch the frame's top edge.
    const labelY = y - plot.top < 16 ? y + 13 : y - 5;
    return {
      x1,
      x2,
      y,
      label: l.label,
      labelX: atRight ? x2 - 4 : x1 + 4,
      labelY,
      labelAnchor: atRight ? 'end' : 'start',
    };
  });
  return {
    width,
    height,
    plot,
    zeroY: zero,
    series,
    limits,
    xTicks: chart.x.ticks.map((t) => ({ at: sx(t), label: tickLabel(t) })),
    yTicks: chart.y.ticks.map((t) => ({ at: sy(t), label: tickLabel(t) })),
  };
}
