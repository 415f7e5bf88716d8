import { expectClose } from '../check-helpers';
import { EI, solve } from './beam-helpers';

// Beam checks against handbook closed forms (docs/references.md: Shigley 9th Table A-9; Roark 7th
// Table 8.1; AISC Manual Table 3-23). Loads in N, lengths in mm, moments in N·m on output.
describe('simply supported beam with a point load (Shigley 9th Table A-9-6)', () => {
  const [L, a, F] = [1000, 300, -1000];
  const b = L - a;
  const r = solve({ length: L, supports: [0, L], loads: [{ at: a, Fy: F }] });

  it('when solved, then the reactions are F·b/L and F·a/L (upwards for a downward load)', () => {
    expectClose(r.supports[0].Fy, (-F * b) / L);
    expectClose(r.supports[1].Fy, (-F * a) / L);
  });

  it('when solved, then the deflection at the load is F·a²·b²/(3·E·I·L)', () => {
    expectClose(r.loads[0].y, (F * a * a * b * b) / (3 * EI * L), 1e-9);
  });

  it('when solved, then the end slopes are W·b·(b² − L²)/(6·E·I·L) and W·a·(L² − a²)/(6·E·I·L), W = −F downwards', () => {
    const W = -F; // the table's formulas take the load as a downward magnitude
    expectClose(r.supports[0].slopeY, (W * b * (b * b - L * L)) / (6 * EI * L), 1e-9);
    expectClose(r.supports[1].slopeY, (W * a * (L * L - a * a)) / (6 * EI * L), 1e-9);
  });

  it('when solved, then the largest deflection is at x = L − √((L² − a²)/3) with the Table A-9-6 value', () => {
    const x = L - Math.sqrt((L * L - a * a) / 3); // in the longer span, measured from the left end
    const xr = L - x; // the formula for x ≥ a written from the right end, with a and b swapped
    const ymax = (F * a * xr * (xr * xr + a * a - L * L)) / (6 * EI * L);
    expectClose(r.deflection!.at, x, 1e-5);
    expectClose(r.deflection!.max, Math.abs(ymax), 1e-8);
  });

  it('when solved, then the largest moment is F·a·b/L under the load', () => {
    const peak = Math.max(...r.bendingDiagram.map((p) => p.M));
    expectClose(peak, (Math.abs(F) * a * b) / L / 1000);
  });
});

describe('simple supports with an overhanging load (Shigley 9th Table A-9-10)', () => {
  const [l, a, F] = [600, 200, -2000];
  const r = solve({ length: l + a, supports: [0, l], loads: [{ at: l + a, Fy: F }] });

  it('when solved, then R1 = −F·a/l (downwards) and R2 = F·(l + a)/l (upwards)', () => {
    expectClose(r.supports[0].Fy, (F * a) / l);
    expectClose(r.supports[1].Fy, (-F * (l + a)) / l);
  });

  it('when solved, then the tip deflection is F·a²·(l + a)/(3·E·I)', () => {
    expectClose(r.loads[0].y, (F * a * a * (l + a)) / (3 * EI), 1e-9);
  });

  it('when solved, then the moment over the bearing is F·a', () => {
    const over = r.bendingDiagram.filter((p) => p.at === l).map((p) => p.My);
    expectClose(over[0], (F * a) / 1000);
  });
});

describe('two-span continuous beam, equal spans (AISC Steel Construction Manual Table 3-23, from memory)', () => {
  const [L, P] = [500, -1000];

  it('when each span carries P at its middle, then the reactions are 5P/16, 11P/8, 5P/16', () => {
    const r = solve({
      length: 2 * L,
      supports: [0, L, 2 * L],
      loads: [
        { at: L / 2, Fy: P },
        { at: 1.5 * L, Fy: P },
      ],
    });
    expectClose(r.supports[0].Fy, (-5 * P) / 16);
    expectClose(r.supports[1].Fy, (-11 * P) / 8);
    expectClose(r.supports[2].Fy, (-5 * P) / 16);
    expectClose(Math.abs(r.bendingDiagram.find((p) => p.at === L)!.My), (3 * Math.abs(P) * L) / 16 / 1000);
  });

  it('when only one span carries P at its middle, then the reactions are 13P/32, 11P/16, −3P/32', () => {
    const r = solve({ length: 2 * L, supports: [0, L, 2 * L], loads: [{ at: L / 2, Fy: P }] });
    expectClose(r.supports[0].Fy, (-13 * P) / 32);
    expectClose(r.supports[1].Fy, (-11 * P) / 16);
    expectClose(r.supports[2].Fy, (3 * P) / 32);
  });
});

describe('bending in two planes', () => {
  it('when forces act in y and z, then each plane follows its closed form and the resultant combines them', () => {
    const [L, a] = [1000, 400];
    const r = solve({ length: L, supports: [0, L], loads: [{ at: a, Fy: -300, Fz: 400 }] });
    const unit = (a * a * (L - a) ** 2) / (3 * EI * L);
    expectClose(r.loads[0].y, -300 * unit, 1e-9);
    expectClose(r.loads[0].z, 400 * unit, 1e-9);
    expectClose(r.loads[0].deflection, 500 * unit, 1e-9);
    expectClose(r.supports[0].F, (500 * (L - a)) / L);
  });
});
