import { formatNumber } from '../engine/number-format';
import type { CalcResult } from '../engine';
import { beamUnit, forceCleaner } from './beam-units';
import type { MarkShape, ShaftOutline } from './outline';

/*
 * Bearings and forces on the outline plot. Stations and bearing marks are in the shaft's length unit,
 * like the outline; arrow lengths are shares (0..1) of the largest force, because a force has no
 * length: the drawing code turns a share into points or pixels. y is up in the plot, z out of it.
 */
const TAGS: Record<string, string> = { force: 'F', gear: 'G', pulley: 'P', sprocket: 'S', coupling: 'C' };
const NAMES: Record<string, string> = {
  force: 'Force',
  gear: 'Gear',
  pulley: 'Belt pulley',
  sprocket: 'Chain sprocket',
  coupling: 'Coupling',
};

/** Tag of a force element by its kind (`force` or none for a plain force), numbered in input order: G1, P2, F3 … */
export function loadTag(kind: string | undefined, index: number): string {
  return `${TAGS[kind ?? 'force'] ?? 'F'}${index + 1}`;
}

export const loadName = (kind: string | undefined): string => NAMES[kind ?? 'force'] ?? 'Force';

export const bearingTag = (index: number): string => `B${index + 1}`;

export interface ForceArrow {
  tag: string;
  /** What the arrow stands for, with its values: "G1 Gear, pinion: Fy −2100 N, Fz 5600 N". */
  name: string;
  at: number;
  /** Outer radius of the shaft at the station: where the arrow head touches. */
  top: number;
  Fy: number;
  Fz: number;
  /** |Fy| and |Fz| as shares of the largest force component in the picture (0..1). */
  yShare: number;
  zShare: number;
  isReaction: boolean;
}

export interface BearingMark {
  tag: string;
  name: string;
  at: number;
  top: number;
  shapes: MarkShape[];
}

export interface ShaftLoads {
  bearings: BearingMark[];
  arrows: ForceArrow[];
  forceUnit: string;
}

function radiusAt(outline: ShaftOutline, at: number): number {
  const eps = 1e-9 * Math.max(1, Math.abs(at));
  const touching = outline.segments.filter((s) => at >= s.x - eps && at <= s.x + s.width + eps);
  return touching.length ? Math.max(...touching.map((s) => s.od / 2)) : outline.maxRadius;
}

// The usual simplified bearing sign of technical drawings: a square with its diagonals on each side of the shaft.
function bearingShapes(at: number, top: number, size: number): MarkShape[] {
  return [1, -1].flatMap((side): MarkShape[] => {
    const y = side > 0 ? top : -top - size;
    return [
      { kind: 'rect', x: at - size / 2, y, width: size, height: size },
      { kind: 'line', x1: at - size / 2, y1: y, x2: at + size / 2, y2: y + size },
      { kind: 'line', x1: at - size / 2, y1: y + size, x2: at + size / 2, y2: y },
    ];
  });
}

/**
 * Whether a result carries the whole-shaft model with at least one bearing. Results stored before
 * format v2 have no `supports` at all, so this is checked rather than assumed.
 */
export function hasBeamModel(result: CalcResult): boolean {
  return Array.isArray((result as Partial<CalcResult>).supports) && result.supports.length > 0;
}

const named = (base: string, label: string | undefined) => (label ? `${base}, ${label}` : base);

/**
 * Bearings at their stations and arrows for the resolved forces: each load as the engine resolved it
 * (a gear's components from its torque), and each bearing's reaction on the shaft, so the picture
 * shows the balance. Empty when the calc has no bearings (a v1 calc).
 */
export function shaftLoads(result: CalcResult, outline: ShaftOutline): ShaftLoads {
  const forceUnit = beamUnit(result, 'Fy');
  const f = (v: number) => formatNumber(v, 4);
  const { supports, loads } = result;
  // Marks scale with the thinnest section, so they never swamp a slender shaft.
  const size = 0.32 * Math.min(...outline.segments.map((s) => s.od / 2), outline.maxRadius || 1);
  const bearings = supports.map((s): BearingMark => {
    const top = radiusAt(outline, s.at);
    return {
      tag: bearingTag(s.index),
      name: named('Bearing', s.label),
      at: s.at,
      top,
      shapes: bearingShapes(s.at, top, size),
    };
  });
  const largest = Math.max(1e-300, ...[...supports, ...loads].flatMap((x) => [Math.abs(x.Fy), Math.abs(x.Fz)]));
  const clean = forceCleaner(result);
  const arrow = (
    tag: string,
    name: string,
    x: { at: number; Fy: number; Fz: number },
    isReaction: boolean,
  ): ForceArrow => {
    const [Fy, Fz] = [clean(x.Fy), clean(x.Fz)];
    return {
      tag,
      at: x.at,
      top: radiusAt(outline, x.at),
      Fy,
      Fz,
      isReaction,
      yShare: Math.abs(Fy) / largest,
      zShare: Math.abs(Fz) / largest,
      name: `${tag} ${name}: Fy ${f(Fy)} ${forceUnit}, Fz ${f(Fz)} ${forceUnit}`,
    };
  };
  return {
    bearings,
    forceUnit,
    arrows: [
      ...loads.map((l) => arrow(loadTag(l.kind, l.index), named(loadName(l.kind), l.label), l, false)),
      ...supports.map((s) => arrow(bearingTag(s.index), 'reaction of the bearing', s, true)),
    ],
  };
}
