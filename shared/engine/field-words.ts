/*
 * The screens' words for the calc input's entries, fields and panels, and for request fields: one table each, read by
 * field-places.ts (which turns a path into a place) for the client, the server's error bodies and the report.
 */

// Entry lists of the calc input as the editor titles their rows.
export const ENTRIES: Record<string, string> = {
  segments: 'Segment',
  torques: 'Torque',
  features: 'Feature',
  bending: 'Bending moment',
  supports: 'Bearing',
  loads: 'Force',
  masses: 'Mass',
};

// Field keys as the form labels them.
export const FIELD_WORDS: Record<string, string> = {
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
export const GROUPS: Record<string, string> = {
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

// Request fields as the forms label them (the calc header, sign-in, signing, findings, returns).
export const REQUEST_FIELDS: Record<string, string> = {
  text: 'Finding',
  answer: 'Answer',
  // A period's ends (audit trail, review health): the screens' own words.
  from: 'From',
  to: 'To',
  // The audit trail's other filters, as its screen labels them.
  userId: 'Person',
  calcId: 'Calc',
  entityType: 'Record type',
  action: 'Action',
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

/** A map's own entry only: a key such as `constructor` or `__proto__` must not find Object's members. */
export function own(map: Record<string, string>, key: string): string | undefined {
  return Object.hasOwn(map, key) ? map[key] : undefined;
}
