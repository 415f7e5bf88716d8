import type { UnitSystem } from '../../../../../shared/engine';
import { matchMaterial } from '../../../../../shared/materials';
import type { EditorValue, MaterialKindOption } from './editor-form';
import type { FeatureType } from './row-forms';
import { fromText, toText } from './number-text';
import { inputToShaftValues, shaftValuesToInput } from './shaft-values';

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

/** Copies the named fields that hold something; blank fields are left out so the engine can say what is missing. */
function pick(source: object, numeric: string[], texts: string[] = [], rename: Record<string, string> = {}): Json {
  const out: Json = {};
  const field = (k: string): string => str((source as Json)[k]);
  for (const k of texts) if (field(k).trim()) out[rename[k] ?? k] = field(k).trim();
  for (const k of numeric) {
    const v = fromText(field(k));
    if (v !== undefined) out[rename[k] ?? k] = v;
  }
  return out;
}

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return text;
  }
}

const FEATURE_FIELDS: Record<FeatureType, string[]> = {
  'shoulder-fillet': ['at', 'r'],
  keyseat: ['at', 'r', 'width', 'height', 'length', 'keySy'],
  'ring-groove': ['at', 'depth', 'r', 'width'],
  'cross-hole': ['at', 'diameter'],
};

/** The calc input (interchange format v1) the form describes, as saved and as given to the engine. */
export function valueToInput(v: EditorValue): Json {
  const { libraryId: _library, kind, ...material } = v.material;
  const out: Json = {
    units: v.units satisfies UnitSystem,
    ...(v.title.trim() ? { title: v.title.trim() } : {}),
    ...(v.notes.trim() ? { notes: v.notes } : {}),
    material: { ...pick(material, ['E', 'G', 'Sy', 'Su', 'nu', 'density'], ['name', 'source']), kind },
    segments: v.segments.map((s) => ({
      ...pick(s, ['length', 'od', 'id'], ['label']),
      ...(s.material ? { material: parseJson(s.material) } : {}),
    })),
    torques: v.torques.map((t) =>
      pick(t, t.mode === 'power' ? ['at', 'power', 'speed', 'Ta'] : ['at', 'T', 'Ta'], ['label']),
    ),
    features: v.features.map((x) => ({
      type: x.type,
      ...(x.type === 'keyseat' ? { form: x.form } : {}),
      ...pick(x, [...FEATURE_FIELDS[x.type], 'Kt', 'Kts'], ['label', 'source'], { keySy: 'Sy' }),
    })),
    bending: v.bending.map((b) => pick(b, ['at', 'Ma', 'Mm'], ['label'])),
    ...shaftValuesToInput(v),
  };
  if (v.fatigue.enabled) {
    const f = v.fatigue;
    out['fatigue'] = {
      surface: f.surface,
      ...(f.surfaceTable ? { surfaceTable: f.surfaceTable } : {}),
      ...pick(
        f,
        ['reliability', 'temperature', 'kd', 'kc', 'kf', 'alternatingTorqueFraction', 'SePrime'],
        ['SePrimeSource'],
      ),
      ...(f.kfOnMidrange ? {} : { kfOnMidrange: false }),
    };
  }
  return out;
}
