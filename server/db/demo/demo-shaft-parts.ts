/*
 * Building blocks of the Kestrel Fen Drives demo shafts (demo-process-shafts.ts, demo-handling-shafts.ts).
 * Material values: AISI grades' minimum strengths from Shigley Table A-20 and carbon-steel elastic constants
 * from Table A-5; key sizes and the key steel are invented for the demo.
 */

/** A carbon steel by its minimum strengths [MPa]; the elastic constants are the same for every grade here. */
function carbonSteel(name: string, Sy: number, Su: number) {
  return { name, kind: 'steel', E: 207, G: 79.3, nu: 0.292, Sy, Su, source: 'Shigley Table A-20 (minimum), Table A-5' };
}
export const STEEL_1045_CD = carbonSteel('AISI 1045 CD', 530, 630);
export const STEEL_1045_HR = carbonSteel('AISI 1045 HR', 310, 570);
export const STEEL_1020_CD = carbonSteel('AISI 1020 CD', 390, 470);

/** A solid segment (no bore). */
export function solid(label: string, length: number, od: number) {
  return { label, length, od, id: 0 };
}

/** Torques given as power at the one speed the whole shaft turns at: positive drives, negative is taken off. */
export function atSpeed(speed: number, entries: [label: string, at: number, power: number][]) {
  return entries.map(([label, at, power]) => ({ label, at, power, speed }));
}

/** A keyseat for a key of the demo's key steel (Sy 390 MPa); a chart factor, when given, comes with its source. */
export function keyseat(
  form: 'end-mill' | 'sled-runner',
  at: number,
  [width, height, length]: [number, number, number],
  label: string,
  chart?: { Kts: number; source: string },
) {
  return { type: 'keyseat', form, at, width, height, length, Sy: 390, ...chart, label };
}
