// The calc input (interchange format v1) an editor form describes: trimmed text, numbers read from their text.
import type { UnitSystem } from '../../../../../shared/engine';
import type { EditorValue } from './editor-form';
import type { FeatureType } from './row-forms';
import { fromText } from './number-text';
import { shaftValuesToInput } from './shaft-values';

type Json = Record<string, unknown>;

const str = (v: unknown): string => (typeof v === 'string' ? v : '');

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
