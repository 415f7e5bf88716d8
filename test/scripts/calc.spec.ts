import { runCalcCommand as calc } from '../support/calc-command';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

// The batch command, run as a user would (test/support/calc-command.ts).
const ROOT = join(__dirname, '..', '..');
const FIXTURES = 'test/fixtures/calcs';

describe('calc command', () => {
  it('when given a valid file, then it prints only the result JSON and exits 0', () => {
    const r = calc([`${FIXTURES}/solid-si.json`]);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.segments[0].tauMax).toBeCloseTo(40.74367, 5); // docs/references.md C-4
    expect(out.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
    expect(r.stderr).toBe('');
  });

  it('when run through tsx as `npm run calc` runs it, then it answers exactly as the bundle the other tests run', () => {
    const args = [`${FIXTURES}/five-segment-fatigue.json`, '--format', 'table'];
    const viaTsx = calc(args, undefined, { tsx: true });
    expect(viaTsx.status).toBe(0);
    expect(viaTsx).toEqual(calc(args));
  });

  it('when reading standard input ("-"), then it evaluates it the same way', () => {
    const r = calc(['-'], readFileSync(join(ROOT, FIXTURES, 'hollow-si.json'), 'utf8'));
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).segments[0].tauInner).toBeCloseTo(19.5883, 4); // docs/references.md C-5
  });

  it('when the input is invalid, then it exits 2 with "path: reason" on stderr and nothing on stdout', () => {
    const r = calc([`${FIXTURES}/invalid/id-not-smaller.json`]);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toBe('segments[1].id: inner diameter 52 mm is not smaller than outer diameter 50 mm\n');
  });

  it('when the text is not JSON, then it exits 2 without a stack trace', () => {
    const r = calc(['-'], '{ "units": ');
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^\(input\): not valid JSON/);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });

  it('when asked for a table, then it prints aligned columns and the engineering caution', () => {
    const r = calc([`${FIXTURES}/five-segment-fatigue.json`, '--format', 'table']);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(
      /never replace, the judgement of a qualified engineer; local codes and licensed practice govern/,
    );
    expect(r.stdout).toMatch(/Segments[\s\S]*Features[\s\S]*keyseat[\s\S]*Whole shaft/);
  });

  it('when given a folder, then it evaluates every file and reports each invalid one by name', () => {
    const ok = calc([FIXTURES]);
    expect(ok.status).toBe(0);
    expect(JSON.parse(ok.stdout).map((o: { file: string }) => o.file)).toEqual([
      'five-segment-fatigue.json',
      'hollow-si.json',
      'solid-si.json',
      'stepped-us.json',
      'two-bearing-gear-pulley.json',
    ]);
    const bad = calc([`${FIXTURES}/invalid`]);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/^unbalanced\.json: torques: external torques do not balance/m);
    expect(bad.stderr).toMatch(/^station-off\.json: torques\[1\]\.at: station 600 mm is off the shaft/m);
  });

  it('when the file does not exist or an option is unknown, then it exits 1 with a one-line message', () => {
    expect(calc(['no-such.json'])).toMatchObject({
      status: 1,
      stderr: 'cannot read no-such.json: no such file or folder\n',
    });
    expect(calc([`${FIXTURES}/solid-si.json`, '--format', 'xml']).status).toBe(1);
  });

  // Issue 9, items 7–9 and 11: inputs that cannot give finite numbers, a key given twice, a byte-order mark.
  // Plausible ranges and strict JSON: common practice, no source (docs/references.md).
  it.each([
    ['od-tiny.json', 'segments[0].od', /outer diameter 1e-90 mm is outside .* 0.001 to 100000 mm/],
    ['od-huge.json', 'segments[0].od', /outer diameter 1e80 mm/],
    ['torque-huge.json', 'torques[0].T', /torque 1e300 N·m .* 0 or from 1e-6 to 1e10 N·m/],
    ['endurance-tiny.json', 'fatigue.SePrime', /unmodified endurance limit 1e-300 MPa/],
    ['power-near-zero-speed.json', 'torques[0].speed', /speed 1e-300 rpm is outside .* 0.001 to 1e6 rpm/],
    [
      'duplicate-units.json',
      'units',
      /the key "units" appears twice in one object \(line 2, column 3 and line 4, column 3\)/,
    ],
    ['us-diameter-tiny.json', 'segments[0].od', /outer diameter 1e-90 in/],
  ])('when the input is %s, then it exits 2 naming %s and prints no result', (file, path, message) => {
    const r = calc([`${FIXTURES}/edge-cases/${file}`]);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    const line = r.stderr.split('\n').find((l) => l.startsWith(`${path}: `));
    expect(line).toMatch(message);
    expect(r.stderr).not.toMatch(/NaN|Infinity|null/);
  });

  it('when the file starts with a UTF-8 byte-order mark, then it is read like any other', () => {
    const r = calc(['-'], `\uFEFF${readFileSync(join(ROOT, FIXTURES, 'solid-si.json'), 'utf8')}`);
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).segments[0].tauMax).toBeCloseTo(40.74367, 5); // docs/references.md C-4
  });
});
