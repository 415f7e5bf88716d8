import { parseStrictJson } from '../../../shared/json/strict-json';

// Issue 9, items 9 and 11. Refusing duplicate keys and accepting a BOM (U+FEFF): common practice, no
// source (docs/references.md, "Reading JSON", which notes what RFC 8259 leaves open).
describe('parseStrictJson', () => {
  it('when a key appears twice, then it is refused with the path and both positions', () => {
    expect(parseStrictJson('{\n  "units": "SI",\n  "units": "US"\n}')).toEqual({ ok: false, issue: {
      path: 'units', message: expect.stringMatching(/the key "units" appears twice in one object \(line 2, column 3 and line 3, column 3\)/) } });
  });

  it('when the duplicate is nested in a list, then the path leads to it', () => {
    const r = parseStrictJson('{"segments":[{"od":1},{"od":2,"id":0,"od":3}]}');
    expect(r).toEqual({ ok: false, issue: expect.objectContaining({ path: 'segments[1].od' }) });
  });

  it('when equal keys sit in different objects, then that is fine', () => {
    expect(parseStrictJson('{"a":{"x":1},"b":{"x":2},"c":[{"x":3},{"x":4}]}')).toEqual({ ok: true, value: { a: { x: 1 }, b: { x: 2 }, c: [{ x: 3 }, { x: 4 }] } });
  });

  it('when the text starts with a UTF-8 byte-order mark, then it parses as without one', () => {
    expect(parseStrictJson('\uFEFF{"units":"SI"}')).toEqual({ ok: true, value: { units: 'SI' } });
  });

  it('when the text is not JSON, then the message names invisible characters instead of printing them', () => {
    const r = parseStrictJson('\u200B{"units":"SI"}');
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.issue.path).toBe('(input)');
      expect(r.issue.message).toMatch(/^not valid JSON: .*U\+200B/);
      expect(r.issue.message).not.toMatch(/\u200B/);
    }
  });

  it('when the value is a scalar or a list, then it is returned as JSON.parse would', () => {
    expect(parseStrictJson('3')).toEqual({ ok: true, value: 3 });
    expect(parseStrictJson('[1,{"a":null}]')).toEqual({ ok: true, value: [1, { a: null }] });
  });
});
