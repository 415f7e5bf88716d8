export interface FieldDifference {
  path: string;
  mine: string;
  theirs: string;
}

type Flat = Map<string, string>;

function flatten(value: unknown, path: string, out: Flat): Flat {
  if (Array.isArray(value)) {
    if (value.length === 0) out.set(path, '(none)');
    value.forEach((v, i) => flatten(v, `${path}[${i}]`, out));
  } else if (value && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>);
    if (entries.length === 0 && path) out.set(path, '(empty)');
    for (const [k, v] of entries) flatten(v, path ? `${path}.${k}` : k, out);
  } else {
    out.set(path, typeof value === 'string' ? value : JSON.stringify(value));
  }
  return out;
}

/**
 * Field-by-field comparison of two calc inputs: every leaf path whose value differs, in the order of
 * the author's version, then paths only the stored version has. "—" marks a field one side lacks.
 */
export function compareInputs(mine: unknown, theirs: unknown): FieldDifference[] {
  const a = flatten(mine, '', new Map());
  const b = flatten(theirs, '', new Map());
  const paths = [...a.keys(), ...[...b.keys()].filter((k) => !a.has(k))];
  return paths
    .filter((p) => a.get(p) !== b.get(p))
    .map((p) => ({ path: p, mine: a.get(p) ?? '—', theirs: b.get(p) ?? '—' }));
}
