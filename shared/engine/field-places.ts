import type { FeatureInput } from './schema';
import { ENTRIES, FIELD_WORDS, GROUPS, REQUEST_FIELDS, own } from './field-words';

const TAGS: Record<FeatureInput['type'], string> = {
  'shoulder-fillet': 'SF',
  keyseat: 'KS',
  'ring-groove': 'RG',
  'cross-hole': 'CH',
};

/** Short tag of a feature (1-based, as people count): KS1, SF2 … */
export function featureTag(type: FeatureInput['type'], index: number): string {
  return `${TAGS[type] ?? 'F'}${index + 1}`;
}

/*
 * Internal paths (`segments[2].od`, `torques[0].speed`, `input.fatigue.kd`) in the words the screens
 * use, so every message, on screen or from the server, names a field as the form labels it. One
 * mapping for the client, the server's error bodies, checklist warnings and the report.
 */

const ENTRY = /^(segments|torques|features|bending|supports|loads|masses)\[(\d+)\]((?:\.\w+)*)/;

function fieldWords(rest: string): string[] {
  return rest
    .split('.')
    .filter(Boolean)
    .map((k) => own(FIELD_WORDS, k) ?? k);
}

/**
 * Where an input path sits, in the screen's words, counted from 1: "Segment 2, outer ⌀",
 * "Segment 1, material, yield strength", "Fatigue, kd entered"; a feature by the tag the screen
 * and plots show (KS1, SF2) when its type is known.
 */
export function placeOf(path: string, featureTypes: readonly string[] = []): string {
  const m = ENTRY.exec(path);
  if (m) {
    const index = Number(m[2]);
    const type = m[1] === 'features' ? featureTypes[index] : undefined;
    const where = type
      ? `Feature ${featureTag(type as Parameters<typeof featureTag>[0], index)}`
      : `${ENTRIES[m[1]]} ${index + 1}`;
    return [where, ...fieldWords(m[3])].join(', ');
  }
  const [head, ...rest] = path.split('.');
  const group = head.replace(/\[\d+\]$/, '');
  const words = own(GROUPS, group);
  if (words === undefined) return path;
  return [words, ...fieldWords(rest.join('.'))].join(', ');
}

/**
 * A field key of an API error body (`input.segments[2].od`, `params.itemId`, `reasonForChange`) as
 * the screen names it; keys nobody labels keep their own name rather than vanish.
 */
export function fieldLabel(key: string, featureTypes: readonly string[] = []): string {
  if (key === '' || key === 'record') return 'Request';
  if (key.startsWith('input.')) return placeOf(key.slice('input.'.length), featureTypes);
  if (key === 'input') return 'Calc input';
  if (key.startsWith('params.')) return `The address (${own(REQUEST_FIELDS, key.slice(7)) ?? key.slice(7)})`;
  if (key.startsWith('query.')) return own(REQUEST_FIELDS, key.slice(6)) ?? key.slice(6);
  return own(REQUEST_FIELDS, key) ?? placeOf(key, featureTypes);
}

/** `torques[1].at` and its kin inside a free text, each replaced by its place ("Torque 2, station"). */
export function namePathsIn(text: string, featureTypes: readonly string[] = []): string {
  return text.replace(/\b(?:segments|torques|features|bending|supports|loads|masses)\[\d+\](?:\.\w+)*/g, (p) =>
    placeOf(p, featureTypes),
  );
}
