import { fixtureInput } from './calc-harness';

/**
 * The five-segment conveyor shaft as a whole-shaft (format v2) calc: bearings at the two seats, the
 * gear and coupling as force elements, the gear's mass, a speed; its moments come from the model.
 */
export function wholeShaftInput(): Record<string, unknown> {
  const { bending: _handTyped, ...input } = fixtureInput();
  return {
    ...input,
    supports: [
      { label: 'drive end', at: 20, kind: 'deep-groove-ball', C: 25.5, locating: true },
      { label: 'free end', at: 300, kind: 'cylindrical-roller', C: 44 },
    ],
    loads: [
      { label: 'spur gear', at: 100, kind: 'gear', pitchDiameter: 180, pressureAngle: 20, direction: 0 },
      { label: 'flexible coupling', at: 390, kind: 'coupling' },
    ],
    masses: [{ label: 'gear', at: 100, mass: 4.2 }],
    speed: 950,
  };
}
