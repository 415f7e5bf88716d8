import type { FeatureInput } from './schema';

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

// Entry lists of the calc input as the editor titles their rows.
const ENTRIES: Record<string, string> = {
  segments: 'Segment',
  torques: 'Torque',
  features: 'Feature',
  bending: 'Bending moment',
  supports: 'Bearing',
  loads: 'Force',
  masses: 'Mass',
};

// Field keys as the form labels them.
const FIELD_WORDS: Record<string, string> = {
  at: 'station',
  T: 'torque',
  Ta: 'alternating torque',
  power: 'power',
  speed: 'speed',
  length: 'length',
  od: 'outer ⌀',
  id: 'inner ⌀',
  r: 'radius',
  width: 'width',
  height: 'height',
  depth: 'depth',
  diameter: 'hole ⌀',
  Ma: 'alternating moment',
  Mm: 'midrange moment',
  Kt: 'Kt',
  Kts: 'Kts',
  Sy: 'yield strength',
  Su: 'ultimate strength',
  E: "Young's modulus",
  G: 'shear modulus',
  label: 'label',
  kind: 'kind',
  C: 'load rating C',
  X: 'X factor',
  Y: 'Y factor',
  Fx: 'axial force',
  Fy: 'force Fy',
  Fz: 'force Fz',
  mass: 'mass',
  pitchDiameter: 'pitch ⌀',
  pressureAngle: 'pressure angle',
  helixAngle: 'helix angle',
  pullFactor: 'pull factor',
  direction: 'direction',
  material: 'material',
  nu: "Poisson's ratio",
  name: 'name',
  source: 'source',
  surface: 'surface finish',
  reliability: 'reliability',
  surfaceTable: 'Table 6-2 edition',
  temperature: 'temperature',
  alternatingTorqueFraction: 'alternating torque share',
  kd: 'temperature factor kd',
  kc: 'load factor kc',
  kf: 'miscellaneous factor kf',
  SePrime: 'endurance limit Se′',
  SePrimeSource: 'source of Se′',
  kfOnMidrange: 'Kf, Kfs on midrange stresses',
  type: 'type',
  form: 'form',
  J: 'polar moment',
  tauMax: 'τmax',
};

// Top-level groups of the calc input, as the editor's panels are headed.
const GROUPS: Record<string, string> = {
  material: 'Material',
  fatigue: 'Fatigue',
  torques: 'Torques',
  segments: 'Segments',
  units: 'Units',
  '(input)': 'Calc input',
  notes: 'Notes',
  title: 'Heading',
  features: 'Features',
  bending: 'Bending moments',
  supports: 'Bearings',
  loads: 'Forces',
  masses: 'Masses',
  speed: 'Operating speed',
  methods: 'Methods',
  beam: 'Beam model',
};

/** A map's own entry only: a key such as `constructor` or `__proto__` must not find Object's members. */
function own(map: Record<string, string>, key: string): string | undefined {
  return Object.hasOwn(map, key) ? map[key] : undefined;
}

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

// Request fields as the forms label them (the calc header, sign-in, signing, findings, returns).
const REQUEST_FIELDS: Record<string, string> = {
  text: 'Finding',
  answer: 'Answer',
  // A period's ends (audit trail, review health): the screens' own words.
  from: 'From',
  to: 'To',
  reason: 'Reason',
  reasonForChange: 'Reason for the change',
  password: 'Your password',
  oneTimeCode: 'One-time code',
  currentPassword: 'Current password',
  newPassword: 'New password',
  number: 'Calc number',
  title: 'Title',
  partRef: 'Part or drawing reference',
  projectId: 'Project',
  ruleSetId: 'Design standard',
  // Both a project's code and a one-time code are sent as `code`: the label must fit both forms.
  code: 'Code',
  name: 'Name',
  username: 'Username',
  email: 'Email',
  roles: 'Roles',
  clauseRef: 'Checklist row',
  anchorPath: 'Concerns',
  lockVersion: 'the version you opened',
  note: 'Note',
  done: 'Done',
  kind: 'Kind',
  file: 'File',
  q: 'Search',
  after: 'Page',
  // Lists page with Material's paginator ("Items per page") or "Show 25 more" (review health).
  size: 'Items per page',
  changeSummary: 'What changes in this version',
  effectiveDate: 'Effective date',
  meaning: 'Meaning',
};

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
