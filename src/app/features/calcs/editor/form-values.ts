// Editor form values from a stored calc input (valueToInput in form-to-input.ts goes the other way).
import { matchMaterial } from '../../../../../shared/materials';
import type { EditorValue, MaterialKindOption } from './editor-form';
import type { FeatureType } from './row-forms';
import { toText } from './number-text';
import { inputToShaftValues } from './shaft-values';

type Json = Record<string, unknown>;

const obj = (v: unknown): Json => (v && typeof v === 'object' && !Array.isArray(v) ? (v as Json) : {});
const list = (v: unknown): Json[] => (Array.isArray(v) ? v.map(obj) : []);
const str = (v: unknown): string => (typeof v === 'string' ? v : '');
const FEATURE_TYPES: FeatureType[] = ['shoulder-fillet', 'keyseat', 'ring-groove', 'cross-hole'];
const KINDS: MaterialKindOption[] = ['steel', 'stainless-steel', 'aluminium', 'cast-iron', 'other'];

/**
 * Form values from a stored calc input of any completeness (a new calc may hold `{}`): every field the
 * format knows is carried over, numbers become their text, and missing parts start blank.
 */
export function inputToValue(input: unknown): EditorValue {
  const i = obj(input);
  const m = obj(i['material']);
  const f = obj(i['fatigue']);
  const segments = list(i['segments']);
  return {
    units: i['units'] === 'US' ? 'US' : 'SI',
    title: str(i['title']),
    notes: str(i['notes']),
    material: {
      libraryId: matchMaterial(str(m['name']))?.id ?? '',
      name: str(m['name']),
      kind: KINDS.includes(m['kind'] as MaterialKindOption) ? (m['kind'] as MaterialKindOption) : 'steel',
      E: toText(m['E']),
      G: toText(m['G']),
      nu: toText(m['nu']),
      Sy: toText(m['Sy']),
      Su: toText(m['Su']),
      source: str(m['source']),
      density: toText(m['density']),
    },
    segments: (segments.length ? segments : [{ id: 0 }]).map((s) => ({
      label: str(s['label']),
      length: toText(s['length']),
      od: toText(s['od']),
      id: toText(s['id']),
      material: s['material'] === undefined ? '' : JSON.stringify(s['material']),
    })),
    torques: list(i['torques']).map((t) => ({
      label: str(t['label']),
      at: toText(t['at']),
      mode: 'power' in t ? ('power' as const) : ('torque' as const),
      T: toText(t['T']),
      power: toText(t['power']),
      speed: toText(t['speed']),
      Ta: toText(t['Ta']),
    })),
    features: list(i['features']).map((x) => ({
      type: FEATURE_TYPES.includes(x['type'] as FeatureType) ? (x['type'] as FeatureType) : 'shoulder-fillet',
      label: str(x['label']),
      at: toText(x['at']),
      r: toText(x['r']),
      form: x['form'] === 'sled-runner' ? ('sled-runner' as const) : ('end-mill' as const),
      width: toText(x['width']),
      height: toText(x['height']),
      length: toText(x['length']),
      keySy: toText(x['Sy']),
      depth: toText(x['depth']),
      diameter: toText(x['diameter']),
      Kt: toText(x['Kt']),
      Kts: toText(x['Kts']),
      source: str(x['source']),
    })),
    bending: list(i['bending']).map((b) => ({
      label: str(b['label']),
      at: toText(b['at']),
      Ma: toText(b['Ma']),
      Mm: toText(b['Mm']),
    })),
    ...inputToShaftValues(i),
    fatigue: {
      enabled: i['fatigue'] !== undefined,
      surface: str(f['surface']) || 'machined',
      surfaceTable: str(f['surfaceTable']),
      reliability: toText(f['reliability']),
      temperature: toText(f['temperature']),
      kd: toText(f['kd']),
      kc: toText(f['kc']),
      kf: toText(f['kf']),
      kfOnMidrange: f['kfOnMidrange'] !== false,
      alternatingTorqueFraction: toText(f['alternatingTorqueFraction']),
      SePrime: toText(f['SePrime']),
      SePrimeSource: str(f['SePrimeSource']),
    },
  };
}
