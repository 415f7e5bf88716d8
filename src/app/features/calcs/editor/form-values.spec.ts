import { validateCalcInput } from '../../../../../shared/engine';
import { inputToValue } from './form-values';
import { valueToInput } from './form-to-input';
import { fromText } from './number-text';
import { convertValue } from './shaft-conversion';
import { switchUnits } from './unit-convert';
import { compareInputs } from './json-compare';
import { controlAt, placeOf, toIssueMap } from './issue-map';
import { editorForm } from './editor-form';

const HEAD = {
  units: 'SI',
  title: 'head shaft',
  notes: 'belt pull from the tension calc',
  material: {
    name: 'AISI 1045 CD',
    kind: 'steel',
    E: 207,
    G: 79.3,
    Sy: 530,
    Su: 630,
    nu: 0.292,
    source: 'Shigley Table A-20',
  },
  segments: [
    { label: 'coupling', length: 105, od: 100, id: 0 },
    { length: 900, od: 125, id: 40 },
  ],
  torques: [
    { label: 'gearbox', at: 52.5, power: 37, speed: 55 },
    { at: 595, T: -6424.0, Ta: -640 },
  ],
  features: [
    { type: 'keyseat', form: 'end-mill', at: 52.5, width: 28, height: 16, length: 100, Sy: 390 },
    { type: 'shoulder-fillet', at: 105, r: 5, Kt: 1.9, Kts: 1.5, source: 'Peterson chart 3.1' },
  ],
  bending: [
    { at: 145, Ma: 0 },
    { at: 260, Ma: 4500, Mm: 100 },
  ],
  fatigue: {
    surface: 'machined',
    reliability: 90,
    temperature: 40,
    SePrime: 300,
    SePrimeSource: 'test data',
    kfOnMidrange: false,
  },
};

describe('form values and calc input', () => {
  it('when a complete input goes into the form and out again, then nothing is lost or changed', () => {
    expect(valueToInput(inputToValue(HEAD))).toEqual(HEAD);
  });

  it('when the stored input is empty (a new calc), then the form starts with one solid segment and defaults', () => {
    const v = inputToValue({});
    expect(v.units).toBe('SI');
    expect(v.segments).toEqual([{ label: '', length: '', od: '', id: '0', material: '' }]);
    expect(v.fatigue.enabled).toBe(false);
  });

  it('when a field holds text that is not a number, then the input keeps the text so the engine names the field', () => {
    const v = inputToValue(HEAD);
    v.segments[0].od = '1,5';
    v.segments[1].length = '';
    const input = valueToInput(v);
    const check = validateCalcInput(input);
    expect(check.ok).toBe(false);
    const paths = check.ok ? [] : check.issues.map((i) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['segments[0].od', 'segments[1].length']));
    expect((input['segments'] as object[])[1]).not.toHaveProperty('length');
  });

  it.each([
    ['12', 12],
    [' -3.5e2 ', -350],
    ['.5', 0.5],
    ['', undefined],
    ['0x10', '0x10'],
    ['Infinity', 'Infinity'],
    ['1,5', '1,5'],
  ])('when %p is typed, then the calc value is %p', (text, value) => {
    expect(fromText(text)).toEqual(value);
  });
});

describe('switching units converts the values', () => {
  it('when SI goes to US, then values are converted by the engine unit factors to six significant figures, not ten', () => {
    const us = convertValue(inputToValue(HEAD), 'US');
    expect(us.segments[0].od).toBe('3.93701'); // 100 mm / 25.4
    expect(us.material.Su).toBe('91.3738'); // 630 MPa / 6.894757 MPa per ksi
    expect(us.torques[0].power).toBe('49.6178'); // 37 kW / 0.7456999 kW per hp
    expect(us.torques[0].speed).toBe('55'); // rpm is rpm
    expect(us.fatigue.temperature).toBe('104'); // 40 °C = 104 °F
    expect(us.features[1].Kt).toBe('1.9'); // factors have no unit
    const back = valueToInput(convertValue(us, 'SI'));
    expect(Number(back['material'] && (back['material'] as { G: number }).G)).toBeCloseTo(79.3, 3);
  });

  it('when the author switches back without editing, then every value is exactly what was typed', () => {
    const first = switchUnits(inputToValue(HEAD), 'US', null);
    const edited = { ...first.value, segments: first.value.segments.map((s, i) => (i === 0 ? { ...s, od: '4' } : s)) };
    const back = switchUnits(edited, 'SI', first.conversion);
    const input = valueToInput(back.value);
    expect(input).toEqual({ ...HEAD, segments: [{ ...HEAD.segments[0], od: 101.6 }, HEAD.segments[1]] });
  });
});

describe('engine issues and the form', () => {
  it('when an engine message names a path, then the screen names it as the form does, counted from 1, features by their tag', () => {
    expect(placeOf('torques[1].at')).toBe('Torque 2, station');
    expect(placeOf('features[1].r', ['keyseat', 'shoulder-fillet'])).toBe('Feature SF2, radius');
    expect(placeOf('features[0]', ['keyseat'])).toBe('Feature KS1');
    expect(placeOf('segments[0].od')).toBe('Segment 1, outer ⌀');
  });

  it('when an issue names a field, then its control is found; a list-level issue has none', () => {
    const form = editorForm(inputToValue(HEAD));
    expect(controlAt(form, 'segments[1].id')).toBe(form.controls.segments.at(1).controls.id);
    expect(controlAt(form, 'features[0].Sy')).toBe(form.controls.features.at(0).controls.keySy);
    expect(controlAt(form, 'torques')).toBeNull();
    expect(controlAt(form, 'segments[9].od')).toBeNull();
    expect(placeOf('bending[1].Ma')).toBe('Bending moment 2, alternating moment');
    expect(placeOf('bending[1]')).toBe('Bending moment 2');
    expect(
      toIssueMap([
        { path: 'a', message: 'x' },
        { path: 'a', message: 'y' },
      ]),
    ).toEqual({ a: 'x; y' });
  });

  it('when two inputs differ, then the comparison lists each differing field with both values', () => {
    const theirs = { ...HEAD, notes: 'other', segments: [HEAD.segments[0]] };
    expect(compareInputs(HEAD, theirs)).toEqual([
      { path: 'notes', mine: 'belt pull from the tension calc', theirs: 'other' },
      { path: 'segments[1].length', mine: '900', theirs: '—' },
      { path: 'segments[1].od', mine: '125', theirs: '—' },
      { path: 'segments[1].id', mine: '40', theirs: '—' },
    ]);
  });
});
