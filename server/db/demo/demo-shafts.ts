/**
 * Invented shafts of the Kestrel Fen Drives demo. Material values: AISI grades' minimum strengths
 * from Shigley Table A-20 and carbon-steel elastic constants from Table A-5; everything else
 * (dimensions, duties, names) is invented for the demo.
 */
const STEEL_1045_CD = { name: 'AISI 1045 CD', kind: 'steel', E: 207, G: 79.3, nu: 0.292, Sy: 530, Su: 630, source: 'Shigley Table A-20 (minimum), Table A-5' };
const STEEL_1045_HR = { name: 'AISI 1045 HR', kind: 'steel', E: 207, G: 79.3, nu: 0.292, Sy: 310, Su: 570, source: 'Shigley Table A-20 (minimum), Table A-5' };
const STEEL_1020_CD = { name: 'AISI 1020 CD', kind: 'steel', E: 207, G: 79.3, nu: 0.292, Sy: 390, Su: 470, source: 'Shigley Table A-20 (minimum), Table A-5' };

/** SP-450 slurry pump drive shaft: 75 kW at 1480 rpm from the motor coupling to the impeller. */
export function slurryPumpShaft(impellerSeat = 55): Record<string, unknown> {
  return {
    title: 'SP-450 pump drive shaft', units: 'SI', material: STEEL_1045_CD,
    segments: [
      { label: 'coupling seat', length: 110, od: 55, id: 0 },
      { label: 'seal sleeve', length: 90, od: 65, id: 0 },
      { label: 'drive-end bearing', length: 45, od: 75, id: 0 },
      { label: 'body', length: 380, od: 85, id: 0 },
      { label: 'wet-end bearing', length: 45, od: 75, id: 0 },
      { label: 'impeller seat', length: 120, od: impellerSeat, id: 0 },
    ],
    torques: [{ label: 'motor coupling', at: 40, power: 75, speed: 1480 }, { label: 'impeller', at: 730, power: -75, speed: 1480 }],
    features: [
      { type: 'keyseat', form: 'end-mill', at: 40, width: 16, height: 10, length: 90, Sy: 390, label: 'coupling key' },
      { type: 'shoulder-fillet', at: 110, r: 2.5, label: 'coupling shoulder' },
      { type: 'shoulder-fillet', at: 200, r: 2.5, label: 'sleeve shoulder' },
      { type: 'keyseat', form: 'end-mill', at: 730, width: 16, height: 10, length: 100, Sy: 390, label: 'impeller key' },
    ],
    bending: [{ at: 222, Ma: 0 }, { at: 430, Ma: 650 }, { at: 647, Ma: 0 }, { at: 730, Ma: 380 }],
    fatigue: { surface: 'machined', reliability: 99, alternatingTorqueFraction: 0.15 },
  };
}

/** CV-1200 conveyor head shaft: 30 kW at 45 rpm through a shrink disc to a keyed pulley hub. */
export function conveyorHeadShaft(hubSeat = 120): Record<string, unknown> {
  return {
    title: 'CV-1200 head pulley shaft', units: 'SI', material: STEEL_1045_HR,
    segments: [
      { label: 'gearbox hollow-shaft seat', length: 220, od: 110, id: 0 },
      { label: 'bearing', length: 90, od: 125, id: 0 },
      { label: 'hub seat', length: 180, od: hubSeat, id: 0 },
      { label: 'body', length: 1050, od: 140, id: 0 },
      { label: 'hub seat', length: 180, od: hubSeat, id: 0 },
      { label: 'bearing', length: 90, od: 125, id: 0 },
    ],
    torques: [{ label: 'gearbox', at: 110, power: 30, speed: 45 }, { label: 'drive-side hub', at: 400, power: -18, speed: 45 }, { label: 'idle-side hub', at: 1630, power: -12, speed: 45 }],
    features: [
      { type: 'shoulder-fillet', at: 220, r: 4, label: 'gearbox shoulder' },
      { type: 'keyseat', form: 'sled-runner', at: 400, width: 32, height: 18, length: 160, Sy: 390, Kts: 1.6, source: 'Peterson chart value read by the author (demo)', label: 'drive hub key' },
      { type: 'keyseat', form: 'sled-runner', at: 1630, width: 32, height: 18, length: 160, Sy: 390, Kts: 1.6, source: 'Peterson chart value read by the author (demo)', label: 'idle hub key' },
    ],
    bending: [{ at: 265, Ma: 0 }, { at: 400, Ma: 9000 }, { at: 1630, Ma: 9000 }, { at: 1765, Ma: 0 }],
    fatigue: { surface: 'machined', reliability: 90 },
  };
}

/** MX-80 hollow agitator shaft: 15 kW at 60 rpm, a long tube from the gearbox flange to the impeller. */
export function mixerShaft(hubSeat = 90, od = 114.3, id = 98): Record<string, unknown> {
  return {
    title: 'MX-80 agitator shaft', units: 'SI', material: STEEL_1020_CD,
    segments: [
      { label: 'flange spigot', length: 150, od: 90, id: 0 },
      { label: 'tube', length: 4200, od, id },
      { label: 'impeller hub seat', length: 200, od: hubSeat, id: 0 },
    ],
    torques: [{ label: 'gearbox flange', at: 60, power: 15, speed: 60 }, { label: 'impeller', at: 4450, power: -15, speed: 60 }],
    features: [{ type: 'keyseat', form: 'end-mill', at: 4450, width: 25, height: 14, length: 160, Sy: 390, label: 'impeller key' }],
    bending: [{ at: 150, Ma: 2500 }, { at: 4450, Ma: 0 }],
    fatigue: { surface: 'machined', reliability: 90 },
  };
}
