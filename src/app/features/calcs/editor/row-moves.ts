import type { FormArray } from '@angular/forms';

/** Moves row `index` by `step` (−1 up, +1 down) as one change, so the live results update once. */
export function moveRow(rows: FormArray, index: number, step: -1 | 1): void {
  const to = index + step;
  if (to < 0 || to >= rows.length) return;
  const row = rows.at(index);
  rows.removeAt(index, { emitEvent: false });
  rows.insert(to, row);
}
