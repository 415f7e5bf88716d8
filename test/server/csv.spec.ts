import { parse } from 'csv-parse/sync';
import { isoUtc, neutralise, toCsv, type CsvColumn } from '../../server/http/csv';

// The one CSV writer every export uses: OWASP formula neutralising, numbers kept numeric, ISO dates.
interface Row {
  name: string;
  count: number | string;
  at: Date | null;
}
const columns: CsvColumn<Row>[] = [
  { header: 'name', value: (r) => r.name },
  { header: 'count (pieces)', value: (r) => r.count, numeric: true },
  { header: 'at (UTC, ISO 8601)', value: (r) => r.at },
];

describe('CSV export writer', () => {
  it.each(['=1+1', '+1+1', '-1+1', '@SUM(A1)', '\t=1', '\r=1', '=HYPERLINK("http://x","y")'])(
    'when a text cell starts with a formula trigger (%j), then it gets a leading single quote',
    (hostile) => {
      expect(neutralise(hostile)).toBe(`'${hostile}`);
      const [, row] = parse(toCsv(columns, [{ name: hostile, count: 1, at: null }]), {
        relax_column_count: true,
      }) as string[][];
      expect(row[0]).toBe(`'${hostile}`);
    },
  );

  it('when a numeric column holds a negative number, then it stays a bare number; a string there is neutralised', () => {
    const csv = toCsv(columns, [
      { name: 'a', count: -3.5, at: null },
      { name: 'b', count: '-2+3', at: null },
    ]);
    expect(csv.split('\r\n')[1]).toBe('"a",-3.5,""');
    expect(csv.split('\r\n')[2]).toBe('"b","\'-2+3",""');
  });

  it('when a cell is a date, then it is ISO 8601 in UTC; quotes, commas and line breaks round-trip', () => {
    const at = new Date(Date.UTC(2026, 11, 2, 4, 30, 0));
    const csv = toCsv(columns, [{ name: 'He said "hi", then\r\nleft', count: 2, at }], ['closing = note']);
    const rows = parse(csv, { relax_column_count: true, skip_empty_lines: true }) as string[][];
    expect(rows[0]).toEqual(['name', 'count (pieces)', 'at (UTC, ISO 8601)']);
    expect(rows[1]).toEqual(['He said "hi", then\r\nleft', '2', '2026-12-02T04:30:00.000Z']);
    expect(rows[2]).toEqual(['closing = note']);
    expect(isoUtc('2026-12-02T05:30:00+01:00')).toBe('2026-12-02T04:30:00.000Z');
  });
});
