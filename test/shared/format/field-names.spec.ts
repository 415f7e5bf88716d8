import { fieldLabel, namePathsIn, placeOf } from '../../../shared/engine/field-places';
import { AppError } from '../../../server/errors/app-error';

describe("internal paths in the screen's words", () => {
  it.each([
    ['segments[2].diameter', [], 'Segment 3, hole ⌀'],
    ['torques[0].speed', [], 'Torque 1, speed'],
    ['torques[1].at', [], 'Torque 2, station'],
    ['features[1].r', ['keyseat', 'shoulder-fillet'], 'Feature SF2, radius'],
    ['features[0]', ['keyseat'], 'Feature KS1'],
    ['segments[0].material.Sy', [], 'Segment 1, material, yield strength'],
    ['material.E', [], "Material, Young's modulus"],
    ['fatigue.kd', [], 'Fatigue, temperature factor kd'],
    ['fatigue.alternatingTorqueFraction', [], 'Fatigue, alternating torque share'],
    ['supports[1].C', [], 'Bearing 2, load rating C'],
  ] as const)('when a message names %s, then the screen reads "%s"', (path, types, words) => {
    expect(placeOf(path, types)).toBe(words);
  });

  it("when an API error names a request field or an input path, then the label is the form's", () => {
    expect(fieldLabel('input.segments[2].od')).toBe('Segment 3, outer ⌀');
    expect(fieldLabel('reasonForChange')).toBe('Reason for the change');
    expect(fieldLabel('params.itemId')).toBe('The address (itemId)');
    expect(fieldLabel('number')).toBe('Calc number');
    expect(fieldLabel('anchorPath')).toBe('Concerns');
    expect(fieldLabel('query.size')).toBe('Items per page');
  });

  it('when a free text carries paths, then each is replaced by its place', () => {
    expect(namePathsIn('value at segments[2].J is not finite; see torques[0]')).toBe(
      'value at Segment 3, polar moment is not finite; see Torque 1',
    );
  });

  it('when the server refuses a body, then its message names the first field as the screen does, not by its path', () => {
    const error = AppError.validation({ 'input.torques[0].speed': ['must be a number'] });
    expect(error.message).toBe('Invalid input — Torque 1, speed: must be a number');
    expect(error.details?.fieldErrors).toEqual({ 'input.torques[0].speed': ['must be a number'] });
  });

  it.each(['__proto__', 'constructor', 'toString', 'params.constructor', 'query.__proto__', 'material.constructor'])(
    'when a refused key is an Object member (%s), then the message names the key, never "[object Object]"',
    (key) => {
      const error = AppError.validation({ [key]: ['is not an accepted field name'] });
      expect(error.message).not.toMatch(/object Object|native code|function/);
      expect(error.message).toContain(key.split('.').pop());
    },
  );
});
