import { validateCalcInput } from '../../../../../shared/engine';
import { inputToValue } from './form-values';
import { valueToInput } from './form-to-input';
import { switchUnits } from './unit-convert';

// Format v2 parts of an invented calc: every kind of force element, X and Y factors, masses, density, speed.
const V2 = {
  units: 'SI',
  material: { name: 'AISI 4140 QT', kind: 'steel', E: 205, G: 80, Sy: 655, Su: 1020, density: 7850 },
  segments: [{ length: 500, od: 60, id: 0 }],
  torques: [
    { at: 100, T: 800 },
    { at: 400, T: -800 },
  ],
  features: [],
  bending: [],
  supports: [
    { at: 20, kind: 'tapered-roller', C: 80, X: 0.4, Y: 1.6, locating: true, label: 'drive end' },
    { at: 480, kind: 'plain' },
  ],
  loads: [
    {
      at: 100,
      kind: 'gear',
      pitchDiameter: 180,
      pressureAngle: 20,
      helixAngle: 15,
      direction: 30,
      label: 'helical pinion',
    },
    { at: 400, kind: 'sprocket', diameter: 220, pullFactor: 1, direction: 180, T: -800 },
    { at: 250, Fy: -500, Fz: 200, Fx: 50 },
    { at: 480, kind: 'coupling', Fy: 40 },
  ],
  masses: [{ at: 100, mass: 12.5, label: 'pinion' }],
  speed: 1450,
};

describe('whole-shaft form values', () => {
  it('when a v2 input goes into the form and out again, then nothing is lost or changed, and the engine accepts it', () => {
    expect(valueToInput(inputToValue(V2))).toEqual(V2);
    expect(validateCalcInput(valueToInput(inputToValue(V2))).ok).toBe(true);
  });

  it('when a calc has no bearings, then the input gains no empty lists or speed, so a v1 calc stays byte-for-byte the same', () => {
    const v1 = {
      units: 'SI',
      material: { kind: 'steel', E: 207, G: 79.3, Sy: 530, Su: 630 },
      segments: [{ length: 100, od: 40, id: 0 }],
      torques: [],
      features: [],
      bending: [],
    };
    const out = valueToInput(inputToValue(v1));
    expect(out).toEqual(v1);
    expect(Object.keys(out)).not.toEqual(expect.arrayContaining(['supports']));
  });

  it('when a force field holds text, then the text is kept so the engine names that field', () => {
    const v = inputToValue(V2);
    v.loads[0].pitchDiameter = '180 mm';
    const check = validateCalcInput(valueToInput(v));
    expect(check.ok).toBe(false);
    expect(!check.ok && check.issues.map((i) => i.path)).toContain('loads[0].pitchDiameter');
  });

  it('when units go SI → US → SI untouched, then every whole-shaft value comes back exactly as typed', () => {
    const si = inputToValue(V2);
    const us = switchUnits(si, 'US', null);
    expect(Number(us.value.loads[2].Fy)).toBeCloseTo(-112.404, 3);
    expect(us.value.loads[0].pressureAngle).toBe('20');
    expect(us.value.speed).toBe('1450');
    const back = switchUnits(us.value, 'SI', us.conversion);
    expect(valueToInput(back.value)).toEqual(V2);
  });
});
