import type { AbstractControl, FormArray } from '@angular/forms';

/*
 * What the editor's lists track their rows by (`@for (row of …; track rowKey(row))`). A row keeps its key when it
 * moves, so its fields move with it, as tracking the row itself did. A form built to replace the one on screen (load,
 * restore, unit change) takes over the old rows' keys place by place: the row views stay and are bound to the new
 * rows, instead of every row being torn down and built again (the cost Angular's NG0956 warning names).
 */
const keys = new WeakMap<AbstractControl, number>();
let lastKey = 0;

export function rowKey(row: AbstractControl): number {
  let key = keys.get(row);
  if (key === undefined) keys.set(row, (key = ++lastKey));
  return key;
}

/** Each row of `fresh` takes the key of the row at its place in `old`; rows past the old list's end get new ones. */
export function takeOverRowKeys(old: FormArray, fresh: FormArray): void {
  fresh.controls.forEach((row, i) => {
    if (i < old.length) keys.set(row, rowKey(old.at(i)));
  });
}
