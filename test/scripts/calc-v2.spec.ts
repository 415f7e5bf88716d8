import { runCalcCommand as calc } from '../support/calc-command';

// The batch command on interchange format v2 (bearings, loads, masses), run as a user would.
const SHAFT = 'test/fixtures/calcs/two-bearing-gear-pulley.json';

describe('calc command with format v2', () => {
  it('when given a v2 file, then the JSON carries reactions, lives, deflection, critical speed and the moment diagram', () => {
    const r = calc([SHAFT]);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out.supports[0])).toEqual(
      expect.arrayContaining(['at', 'Fy', 'Fz', 'F', 'Fa', 'slope', 'L10', 'L10h']),
    );
    expect(Object.keys(out.loads[0])).toEqual(expect.arrayContaining(['at', 'Fy', 'Fz', 'deflection', 'slope']));
    expect(Object.keys(out.deflection)).toEqual(['max', 'at']);
    expect(Object.keys(out.criticalSpeed)).toEqual(expect.arrayContaining(['rpm', 'method', 'ratio']));
    expect(Object.keys(out.bendingDiagram[0])).toEqual(expect.arrayContaining(['at', 'My', 'Mz', 'M']));
    expect(typeof out.features[0].M).toBe('number');
    expect(out.assumptions.join(' ')).toMatch(/rigid simple supports at the bearing centres/);
  });

  it('when --format table is asked, then bearings, loads, moments, critical speed and assumptions are printed with the caution', () => {
    const r = calc([SHAFT, '--format', 'table']);
    expect(r.status).toBe(0);
    for (const heading of [
      'Bearings (reactions on the shaft, rating life ISO 281)',
      'Loads',
      'Bending moments (beam model)',
      'first critical speed',
      'Assumptions:',
    ]) {
      expect(r.stdout).toContain(heading);
    }
    expect(r.stdout.trim().split('\n').pop()).toMatch(/never replace, the judgement of a qualified engineer/);
  });

  it('when a bearing is off the shaft, then it exits 2 naming the field', () => {
    const r = calc(['test/fixtures/calcs/invalid/support-off-shaft.json']);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^supports\[1\]\.at: station 520 mm is off the shaft/m);
    expect(r.stdout).toBe('');
  });

  it('when checked against KFD-ENG-014 v4, then the bearing, gear and critical-speed rows appear', () => {
    const r = calc([SHAFT, '--rules', 'rules/kfd-eng-014-v4.json', '--format', 'table']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('Checklist against KFD-ENG-014 v4: COMPLIANT');
    expect(r.stdout).toMatch(/9\.1.*bearing 1/);
  });
});
