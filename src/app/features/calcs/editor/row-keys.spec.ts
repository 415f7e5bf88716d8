import { FormArray, FormControl } from '@angular/forms';
import { rowKey, takeOverRowKeys } from './row-keys';

const list = (...values: string[]) => new FormArray(values.map((v) => new FormControl(v)));

describe('row keys', () => {
  it('when rows move, then each keeps its key; a new row gets a key of its own', () => {
    const rows = list('a', 'b');
    const [a, b] = rows.controls.map(rowKey);
    rows.insert(0, rows.at(1));
    rows.removeAt(2);
    rows.push(new FormControl('c'));

    expect(rows.controls.map(rowKey).slice(0, 2)).toEqual([b, a]);
    expect(new Set(rows.controls.map(rowKey)).size).toBe(3);
  });

  it('when a list replaces another, then its rows take the old keys by place, and rows past the end new ones', () => {
    const old = list('a', 'b');
    const fresh = list('x', 'y', 'z');
    takeOverRowKeys(old, fresh);

    expect(fresh.controls.slice(0, 2).map(rowKey)).toEqual(old.controls.map(rowKey));
    expect(old.controls.map(rowKey)).not.toContain(rowKey(fresh.at(2)));
  });
});
