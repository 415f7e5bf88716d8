import { governingIndex } from './check-features';
import type { Model, Seg } from './model';
import type { FeatureInput } from './schema';
import { sectionProps } from './section';
import { locate } from './shaft-geometry';
import { KEYSEAT_R_OVER_D } from './table-7-1';

/** Dimensions that set a feature's factors and nominal stresses (internal mm). */
export interface FeatureGeometry {
  seg: Seg;
  /** Larger diameter at a shoulder, null elsewhere. */
  D: number | null;
  /** Diameter of the section that carries the nominal stress. */
  d: number;
  di: number;
  /** Notch radius for the notch sensitivity. */
  r: number;
  Z: number;
  Zp: number;
}

function geometry(seg: Seg, D: number | null, d: number, r: number, Z: number, Zp: number): FeatureGeometry {
  return { seg, D, d, di: seg.id, r, Z, Zp };
}

/**
 * Nominal sections follow the basis of each published factor: the smaller diameter at a shoulder,
 * the root (net) diameter at a ring groove, the full (gross) section at keyseats and cross holes.
 */
export function featureGeometry(model: Model, ft: FeatureInput): FeatureGeometry {
  const len = model.k.length;
  const loc = locate(ft.at * len, model.bounds);
  const seg = model.segs[governingIndex(loc, model.segs)];
  switch (ft.type) {
    case 'shoulder-fillet': {
      const D = Math.max(model.segs[loc.left].od, model.segs[loc.right].od);
      return geometry(seg, D, seg.od, ft.r * len, seg.Z, seg.Zp);
    }
    case 'keyseat':
      return geometry(seg, null, seg.od, ft.r === undefined ? KEYSEAT_R_OVER_D * seg.od : ft.r * len, seg.Z, seg.Zp);
    case 'ring-groove': {
      const root = seg.od - 2 * ft.depth * len;
      const net = sectionProps(root, seg.id);
      return geometry(seg, null, root, ft.r * len, net.Z, net.Zp);
    }
    case 'cross-hole':
      return geometry(seg, null, seg.od, (ft.diameter * len) / 2, seg.Z, seg.Zp);
  }
}
