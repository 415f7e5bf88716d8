/*
 * Plain plot geometry in data units (the calc's own units), free of any framework or DOM, so the
 * editor's SVG and the PDF report draw the same shapes. y grows upwards, as on paper.
 */
export type Point = readonly [x: number, y: number];

export interface Axis {
  min: number;
  max: number;
  step: number;
  ticks: number[];
}

export interface Series {
  id: string;
  label: string;
  points: Point[];
  /** `step`: a piecewise-constant quantity (vertical jumps are real); `line`: linear between points. */
  shape: 'step' | 'line';
  /** Line style, so series stay apart in grey print too. */
  style: 'solid' | 'dashed' | 'dotted';
}

/** A limit to draw as a horizontal line, over the whole shaft or only from `from` to `to`. */
export interface LimitLine {
  value: number;
  label: string;
  from?: number;
  to?: number;
}

export interface PlacedLimit {
  y: number;
  x1: number;
  x2: number;
  label: string;
}

export interface Chart {
  title: string;
  xLabel: string;
  xUnit: string;
  yLabel: string;
  yUnit: string;
  x: Axis;
  y: Axis;
  series: Series[];
  limits: PlacedLimit[];
}
