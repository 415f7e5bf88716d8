import type { CalcIssue } from './issue-messages';
import { formatNumber as f } from './number-format';
import type { CalcInput, FeatureInput, SegmentInput } from './schema';
import { locate, nearestJoint, segmentBounds, type Location } from './shaft-geometry';
import { UNIT_LABELS } from './units';

/** At a joint a feature is judged on the smaller of the two segments (the weaker section). */
export function governingIndex(loc: Location, segments: readonly { od: number }[]): number {
  return segments[loc.right].od < segments[loc.left].od ? loc.right : loc.left;
}

interface Ctx {
  input: CalcInput;
  bounds: number[];
  len: string;
  out: CalcIssue[];
}

function checkFillet(ft: Extract<FeatureInput, { type: 'shoulder-fillet' }>, loc: Location, p: string, c: Ctx): void {
  if (loc.left === loc.right) {
    const j = nearestJoint(ft.at, c.bounds);
    const hint = j < 0 ? 'this shaft has one segment' : `the nearest joint is at ${f(c.bounds[j])} ${c.len}`;
    c.out.push({ path: `${p}.at`, message: `a shoulder fillet must sit at a joint between two segments; ${hint}` });
    return;
  }
  const a: SegmentInput = c.input.segments[loc.left];
  const b: SegmentInput = c.input.segments[loc.right];
  const step = Math.abs(a.od - b.od) / 2;
  if (step === 0) {
    c.out.push({
      path: `${p}.at`,
      message: `no shoulder at ${f(ft.at)} ${c.len}: both segments have outer diameter ${f(a.od)} ${c.len}`,
    });
  } else if (ft.r > step) {
    c.out.push({
      path: `${p}.r`,
      message: `fillet radius ${f(ft.r)} ${c.len} is larger than the step (D − d)/2 = ${f(step)} ${c.len}`,
    });
  }
}

function checkByType(ft: FeatureInput, seg: SegmentInput, loc: Location, p: string, c: Ctx): void {
  if (ft.type === 'shoulder-fillet') checkFillet(ft, loc, p, c);
  if (ft.type === 'keyseat' && ft.form === 'sled-runner' && ft.Kts === undefined) {
    c.out.push({
      path: `${p}.Kts`,
      message: 'Shigley Table 7-1 gives no Kts for a sled-runner keyseat; enter Kts and its source',
    });
  }
  if (ft.type === 'ring-groove' && ft.depth >= (seg.od - seg.id) / 2) {
    c.out.push({
      path: `${p}.depth`,
      message: `groove depth ${f(ft.depth)} ${c.len} leaves no wall: the wall is ${f((seg.od - seg.id) / 2)} ${c.len} thick`,
    });
  }
  if (ft.type === 'cross-hole') {
    if (ft.diameter >= seg.od) {
      c.out.push({
        path: `${p}.diameter`,
        message: `hole diameter ${f(ft.diameter)} ${c.len} is not smaller than the shaft's ${f(seg.od)} ${c.len}`,
      });
    }
    if (ft.Kt === undefined || ft.Kts === undefined) {
      c.out.push({
        path: `${p}.${ft.Kt === undefined ? 'Kt' : 'Kts'}`,
        message:
          'no published cross-hole fit is built in: enter Kt and Kts (gross-section basis) from a chart, with the source',
      });
    }
  }
}

/** Cross-field checks on features: station, shoulder geometry, entered factors and their sources. */
export function checkFeatures(input: CalcInput): CalcIssue[] {
  const c: Ctx = {
    input,
    bounds: segmentBounds(input.segments.map((s) => s.length)),
    len: UNIT_LABELS[input.units].length,
    out: [],
  };
  (input.features ?? []).forEach((ft, i) => {
    const p = `features[${i}]`;
    const loc = locate(ft.at, c.bounds);
    if (loc.left < 0) {
      c.out.push({
        path: `${p}.at`,
        message: `station ${f(ft.at)} ${c.len} is off the shaft (0 to ${f(c.bounds[c.bounds.length - 1])} ${c.len})`,
      });
      return;
    }
    if ((ft.Kt !== undefined || ft.Kts !== undefined) && !ft.source) {
      c.out.push({
        path: `${p}.source`,
        message: 'an entered Kt or Kts needs its source (book, edition, chart or figure)',
      });
    }
    checkByType(ft, input.segments[governingIndex(loc, input.segments)], loc, p, c);
  });
  return c.out;
}
