import {
  evaluateShaft,
  formatResultTable,
  twistBetween,
  type CalcInput,
  type CalcResult,
} from '../../../shared/engine';
import { temperatureFactor } from '../../../shared/engine/marin';
import { checklistSync, rowsOf, V3 } from '../rules/rules-helpers';
import { expectClose } from './check-helpers';

// Issue 9: wrong or silently out-of-range results. Check values C-16 and C-17 are in docs/references.md.
const STEEL = { E: 207, G: 79.3, Sy: 530, Su: 630 };
const paths = (r: CalcResult): string[] => r.warnings.map((w) => w.path);

function fatigueShaft(
  fatigue: Record<string, unknown>,
  units: 'SI' | 'US' = 'SI',
  material: Record<string, number> = STEEL,
): CalcResult {
  return evaluateShaft({
    units,
    material,
    segments: [{ length: 100, od: units === 'SI' ? 40 : 1.5, id: 0 }],
    torques: [
      { at: 0, T: 100 },
      { at: 100, T: -100 },
    ],
    bending: [{ at: 50, Ma: 50 }],
    fatigue: { surface: 'ground', ...fatigue },
  });
}

describe('item 1: the cap of Se′ in each unit system (Shigley 9th Eq. 6-8, sourced; docs/references.md C-16)', () => {
  it('when a US steel has Su = 220 kpsi, then Se′ is 100 kpsi, not 700 MPa converted (101.5 kpsi)', () => {
    expect(fatigueShaft({}, 'US', { E: 30, G: 11.5, Sy: 200, Su: 220 }).segments[0].endurance!.SePrime).toBeCloseTo(
      100,
      12,
    );
  });

  it('when a US steel has Su = 190 kpsi, or an SI steel 1600 MPa, then Se′ is 95 kpsi and 700 MPa', () => {
    expect(fatigueShaft({}, 'US', { E: 30, G: 11.5, Sy: 170, Su: 190 }).segments[0].endurance!.SePrime).toBeCloseTo(
      95,
      12,
    );
    expect(fatigueShaft({}, 'SI', { E: 207, G: 79.3, Sy: 1400, Su: 1600 }).segments[0].endurance!.SePrime).toBe(700);
  });
});

describe('item 2: kc with the von Mises method (Shigley 9th §6-9 and §7-4: kc = 1 for combined loading, from memory)', () => {
  it('when an author enters kc = 0.59, then a warning says torsion would be counted twice', () => {
    const r = fatigueShaft({ kc: 0.59 });
    expect(r.warnings).toContainEqual({ path: 'fatigue.kc', message: expect.stringMatching(/counted twice/) });
  });

  it('when kc is 1 or left out, then there is no such warning', () => {
    expect(paths(fatigueShaft({ kc: 1 }))).not.toContain('fatigue.kc');
    expect(paths(fatigueShaft({}))).not.toContain('fatigue.kc');
  });
});

const stepped = (features: unknown[], od2 = 25) => ({
  units: 'SI',
  material: STEEL,
  segments: [
    { length: 100, od: 50, id: 0 },
    { length: 100, od: od2, id: 0 },
  ],
  torques: [
    { at: 0, T: 100 },
    { at: 200, T: -100 },
  ],
  features,
});

describe('item 3: published fits used outside their range carry a warning', () => {
  it('when a fillet has D/d = 2 and r/d = 0.45 (beyond Norton App. E charts, r/d ≤ 0.3 from memory), then Kt comes with a warning', () => {
    const r = evaluateShaft(stepped([{ type: 'shoulder-fillet', at: 100, r: 11.25 }]));
    expect(r.warnings).toContainEqual({
      path: 'features[0]',
      message: expect.stringMatching(/r\/d = 0.45 is outside 0.01–0.3/),
    });
  });

  it('when a fillet has r/d = 0.2 (inside the charts), then there is no warning', () => {
    expect(evaluateShaft(stepped([{ type: 'shoulder-fillet', at: 100, r: 5 }])).warnings).toEqual([]);
  });

  it('when a keyseat root radius is not 0.02·d (Shigley 9th Table 7-1, sourced), then a warning asks for a chart value', () => {
    const r = evaluateShaft(stepped([{ type: 'keyseat', form: 'end-mill', at: 50, r: 2.5 }]));
    expect(r.warnings).toContainEqual({
      path: 'features[0]',
      message: expect.stringMatching(/r\/d = 0.02; this keyseat has r\/d = 0.05/),
    });
    expect(evaluateShaft(stepped([{ type: 'keyseat', form: 'end-mill', at: 50, r: 1 }])).warnings).toEqual([]);
  });

  it('when a ring groove is deep or round-rooted (Table 7-1 values for standard ring grooves, from memory), then a warning says so', () => {
    const deep = evaluateShaft(stepped([{ type: 'ring-groove', at: 50, depth: 5, r: 0.2 }]));
    expect(deep.warnings).toContainEqual({
      path: 'features[0]',
      message: expect.stringMatching(/standard retaining-ring grooves/),
    });
    const round = evaluateShaft(stepped([{ type: 'ring-groove', at: 50, depth: 1, r: 1 }]));
    expect(paths(round)).toContain('features[0]');
    expect(evaluateShaft(stepped([{ type: 'ring-groove', at: 50, depth: 1, r: 0.2 }])).warnings).toEqual([]);
  });

  it("when a fit is outside its range, then the warning is on the feature's checklist rows and in the printed report", () => {
    const input = stepped([{ type: 'shoulder-fillet', at: 100, r: 11.25 }]);
    const row = rowsOf(checklistSync(input as CalcInput, V3), '5.2')[0];
    expect(row.warnings).toContainEqual(expect.stringMatching(/^Feature SF1: r\/d = 0.45/));
    expect(formatResultTable(evaluateShaft(input))).toMatch(/Warnings\n {2}- features\[0\]: r\/d = 0.45/);
  });
});

describe('item 5: room temperature (Shigley 9th Table 6-4 starts at 20 °C with kd = 1, from memory)', () => {
  it.each([
    ['SI', 20],
    ['US', 68],
    ['SI', 25],
    ['US', 500],
  ] as const)('when a %s calc is at %s degrees, then no temperature warning', (units, t) => {
    expect(
      paths(fatigueShaft({ temperature: t }, units, units === 'SI' ? STEEL : { E: 30, G: 11.5, Sy: 77, Su: 91 })),
    ).not.toContain('fatigue.temperature');
  });

  it('when the shaft is at 0 °C or 600 °C, then the warning stays; at 20 °C kd is 1 within 0.1 % (Eq. 6-27)', () => {
    expect(paths(fatigueShaft({ temperature: 0 }))).toContain('fatigue.temperature');
    expect(paths(fatigueShaft({ temperature: 600 }))).toContain('fatigue.temperature');
    expectClose(temperatureFactor(20), 1, 1e-3);
  });
});

describe('item 6: torque and twist follow the right-hand rule (docs/references.md C-17; convention common practice, no source)', () => {
  // Three stations on a solid 40 mm shaft: −300 N·m at 0, +500 N·m at 200 mm, −200 N·m at 600 mm.
  const r = evaluateShaft({
    units: 'SI',
    material: STEEL,
    segments: [{ length: 600, od: 40, id: 0 }],
    torques: [
      { at: 0, T: -300 },
      { at: 200, T: 500 },
      { at: 600, T: -200 },
    ],
  });
  const GJ = (79300 * (Math.PI * 40 ** 4)) / 32; // N·mm²
  const DEG = 180 / Math.PI;

  it("when cut between the first two stations, then T = +300 N·m: the right part pushes the left part's face along +x", () => {
    expect(r.torqueDiagram.map((p) => p.T)).toEqual([300, -200]);
  });

  it('when the twist of b relative to a is asked, then its sign is the right-hand rotation of b about +x', () => {
    // Free body 0–200 mm: −300 N·m at its left end, +300 N·m on its right face: the right face turns
    // anticlockwise seen from +x, so station 200 turns positively relative to station 0.
    expectClose(twistBetween(r, 0, 200), ((300e3 * 200) / GJ) * DEG, 1e-12);
    expectClose(twistBetween(r, 200, 600), ((-200e3 * 400) / GJ) * DEG, 1e-12);
    expectClose(twistBetween(r, 600, 0), -r.twistTotal, 1e-12);
    expect(twistBetween(r, 0, 200)).toBeGreaterThan(0);
  });

  it('when the result states the convention, then it names the right-hand rule for T and twist', () => {
    expect(r.fields.T.formula).toMatch(/right-hand rule\) = −Σ external torques left of the section/);
    expect(r.methods.torqueDiagram).toMatch(/right-hand rotation about \+x/);
  });
});

describe('item 10: material constants far outside any engineering material (common practice, no source)', () => {
  it('when a US calc holds SI-sized numbers (E = 207 "Mpsi"), then E, G and Su are flagged', () => {
    const r = fatigueShaft({}, 'US', { E: 207, G: 79.3, Sy: 500, Su: 630 });
    expect(paths(r)).toEqual(expect.arrayContaining(['material.E', 'material.G', 'material.Su']));
    expect(r.warnings.find((w) => w.path === 'material.E')!.message).toMatch(
      /E = 207 Mpsi is far outside any engineering material \(0.145–174 Mpsi\)/,
    );
  });

  it('when steel, aluminium or a polymer are entered in their units, then nothing is flagged', () => {
    expect(fatigueShaft({}).warnings).toEqual([]);
    expect(paths(fatigueShaft({}, 'US', { E: 10.4, G: 3.9, Sy: 40, Su: 45 }))).not.toContain('material.E');
    expect(paths(fatigueShaft({}, 'SI', { E: 3, G: 1.1, Sy: 60, Su: 80 }))).not.toContain('material.E');
  });
});
