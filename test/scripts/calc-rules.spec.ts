import { runCalcCommand as calc } from '../support/calc-command';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

// The calc command with --rules, run as a user would (test/support/calc-command.ts).

describe('calc command with a design standard', () => {
  it('when given --rules FILE, then the output gains the checklist and the verdict', () => {
    const r = calc(['test/fixtures/calcs/five-segment-fatigue.json', '--rules', 'rules/kfd-eng-014-v3.json']);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.verdict).toBe('compliant');
    expect(out.checklist.ruleSet).toEqual(expect.objectContaining({ code: 'KFD-ENG-014', version: 3 }));
    expect(out.checklist.rows.length).toBeGreaterThan(10);
  });

  it('when the shaft twists more than 1° in 20 diameters, then the verdict says so (common practice, no source)', () => {
    // solid-si: 50 mm, 1.2 m, 1000 N·m → 1.1775 °/m = 0.0589° per diameter, over the 0.05° limit.
    const r = calc(['test/fixtures/calcs/solid-si.json', '--rules', 'rules/kfd-eng-014-v3.json']);
    const out = JSON.parse(r.stdout);
    expect(out.verdict).toBe('not-compliant');
    const twist = out.checklist.rows.find((row: { clauseId: string }) => row.clauseId === '4.2');
    expect(twist.status).toBe('fail');
    expect(twist.actual).toBeCloseTo(1.177523 * 0.05, 5); // docs/references.md C-6, times d = 0.05 m
  });

  it('when the rules file is not a valid standard, then it exits 2 naming the place', () => {
    const dir = mkdtempSync(join(tmpdir(), 'tt-rules-'));
    writeFileSync(join(dir, 'bad.json'), JSON.stringify({ code: 'X-1', clauses: [] }));
    const r = calc(['test/fixtures/calcs/solid-si.json', '--rules', join(dir, 'bad.json')]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/--rules .*bad\.json: \w+/);
    expect(r.stdout).toBe('');
  });

  it('when --format table is asked, then the checklist follows the results with the caution', () => {
    const r = calc(['test/fixtures/calcs/solid-si.json', '--rules', 'rules/kfd-eng-014-v3.json', '--format', 'table']);
    expect(r.stdout).toContain('Checklist against KFD-ENG-014 v3: NOT-COMPLIANT');
    expect(r.stdout.trim().split('\n').pop()).toMatch(/never replace, the judgement of a qualified engineer/);
  });
});
