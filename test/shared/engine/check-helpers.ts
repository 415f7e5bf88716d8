import { readFileSync } from 'node:fs';
import { join } from 'node:path';

/** Relative closeness: |actual − expected| ≤ rel·|expected| (docs/references.md uses 1e-6 unless noted). */
export function expectClose(actual: number | null | undefined, expected: number, rel = 1e-6): void {
  expect(typeof actual).toBe('number');
  expect(Math.abs((actual as number) - expected)).toBeLessThanOrEqual(rel * Math.abs(expected));
}

export function loadFixture(name: string): unknown {
  return JSON.parse(readFileSync(join(__dirname, '..', '..', 'fixtures', 'calcs', name), 'utf8'));
}

/** Every number anywhere in a value, with its path, so tests can assert none is NaN or infinite. */
export function numbersIn(value: unknown, path = '', out: [string, number][] = []): [string, number][] {
  if (typeof value === 'number') out.push([path, value]);
  else if (Array.isArray(value)) value.forEach((v, i) => numbersIn(v, `${path}[${i}]`, out));
  else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) numbersIn(v, path ? `${path}.${k}` : k, out);
  }
  return out;
}

/** A one-segment solid SI shaft carrying torque T (N·m) end to end. */
export function simpleShaft(od: number, T: number, length = 1000, id = 0): Record<string, unknown> {
  return {
    units: 'SI',
    material: { E: 207, G: 79.3, Sy: 530, Su: 630 },
    segments: [{ length, od, id }],
    torques: [
      { at: 0, T },
      { at: length, T: -T },
    ],
  };
}
