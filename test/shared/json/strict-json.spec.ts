import fc from 'fast-check';
import { duplicateKeyPath, jsonValueProblem, parseStrictJson } from '../../../shared/json/strict-json';
import { nonFinitePath, stringifyFinite } from '../../../shared/json/finite-json';

describe('parseStrictJson', () => {
  it('when JSON has no problem, then it parses exactly as JSON.parse does', () => {
    // fc.json may produce keys such as "__proto__"; those are refused on purpose, so leave them out.
    const ok = fc.json({ maxDepth: 6 }).filter((t) => !/"(__proto__|constructor|prototype)"\s*:/.test(t));
    fc.assert(fc.property(ok, (text) => {
      const parsed = parseStrictJson(text);
      if (parsed.ok) expect(parsed.value).toEqual(JSON.parse(text));
      else expect(parsed.problem.message).toMatch(/twice|lone surrogate/);
    }), { numRuns: 500 });
  });

  it.each([
    ['{"a":{"b":[1,2,1e309]}}', 'a.b[2]', /beyond the range/],
    ['{"a":[{"__proto__":{}}]}', 'a[0].__proto__', /not an accepted field name/],
    ['{"x":"\\ud800"}', 'x', /lone surrogate/],
    ['{"\\udfff":1}', '\udfff', /field name with invalid text/],
    ['{"a":1,"b":{"c":1,"c":2}}', 'b.c', /twice/],
    ['{"a":[{"k":1},{"k":1,"k":2}]}', 'a[1].k', /twice/],
    [`{"d":${'['.repeat(40)}${']'.repeat(40)}}`, `d${'[0]'.repeat(31)}`, /nested deeper than 32/],
    ['{"a":', '', /not valid JSON/],
    ['{"a":[0,1e-400]}', 'a[1]', /too small/],
    ['{"x":{"y":-2e-324}}', 'x.y', /too small/],
    [`{"z":0.${'0'.repeat(400)}1}`, 'z', /too small/],
  ])('when the text is %s, then the problem is at %s', (text, path, message) => {
    const parsed = parseStrictJson(text);
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) {
      expect(parsed.problem.path).toBe(path);
      expect(parsed.problem.message).toMatch(message);
    }
  });

  it('when a key repeats only in sibling objects, or inside a string, then it is no duplicate', () => {
    expect(duplicateKeyPath('[{"a":1},{"a":2}]')).toBeNull();
    expect(duplicateKeyPath('{"a":"{\\"a\\":1,\\"a\\":2}","b":{"a":1}}')).toBeNull();
    expect(duplicateKeyPath('{"a\\u0062":1,"ab":2}')).toBe('ab');
    expect(parseStrictJson('{"a":0e5,"b":-0.0,"c":5e-324,"d":[0,-0]}').ok).toBe(true);
  });

  it('when a document is 100,000 levels deep, then the check stops at the limit without overflowing the stack', () => {
    let deep: unknown = 1;
    for (let i = 0; i < 100_000; i++) deep = [deep];
    expect(jsonValueProblem(deep)?.message).toMatch(/nested deeper/);
  });
});

describe('storing results', () => {
  it('when a result holds Infinity or NaN, then its path is found and storing it is refused', () => {
    expect(nonFinitePath({ a: [1, { b: Number.NaN }] })).toBe('a[1].b');
    expect(nonFinitePath({ a: [1, null, 'x'] })).toBeNull();
    expect(() => stringifyFinite({ J: Infinity })).toThrow(/J/);
    expect(stringifyFinite({ J: 1 })).toBe('{"J":1}');
  });
});
