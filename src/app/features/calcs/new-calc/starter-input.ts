/**
 * The input a new calc starts from: one plain steel segment with a balanced torque pair and a
 * machined-surface fatigue block, so the editor opens on something that evaluates. Values: AISI
 * 1045 CD minimum strengths (Shigley Table A-20) and carbon-steel elastic constants (Table A-5).
 * The author replaces all of it.
 */
export function starterInput(units: 'SI' | 'US'): Record<string, unknown> {
  if (units === 'US') {
    return {
      units,
      material: {
        name: 'AISI 1045 CD',
        kind: 'steel',
        E: 30.0,
        G: 11.5,
        Sy: 77,
        Su: 91,
        nu: 0.292,
        source: 'Shigley Table A-20 (minimum), Table A-5',
      },
      segments: [{ length: 20, od: 2.5, id: 0 }],
      torques: [
        { at: 0, T: 5000 },
        { at: 20, T: -5000 },
      ],
      features: [],
      bending: [],
      fatigue: { surface: 'machined', reliability: 90 },
    };
  }
  return {
    units,
    material: {
      name: 'AISI 1045 CD',
      kind: 'steel',
      E: 207,
      G: 79.3,
      Sy: 530,
      Su: 630,
      nu: 0.292,
      source: 'Shigley Table A-20 (minimum), Table A-5',
    },
    segments: [{ length: 500, od: 60, id: 0 }],
    torques: [
      { at: 0, T: 1000 },
      { at: 500, T: -1000 },
    ],
    features: [],
    bending: [],
    fatigue: { surface: 'machined', reliability: 90 },
  };
}
