/**
 * Invented shafts of the Kestrel Fen Drives demo. Material values: AISI grades' minimum strengths
 * from Shigley Table A-20 and carbon-steel elastic constants from Table A-5; everything else
 * (dimensions, duties, loads, bearing ratings, names) is invented for the demo. Bending moments come
 * from the bearings and loads (beam model), not from hand-entered values.
 */
const STEEL_1045_CD = {
  name: 'AISI 1045 CD',
  kind: 'steel',
  E: 207,
  G: 79.3,
  nu: 0.292,
  Sy: 530,
  Su: 630,
  source: 'Shigley Table A-20 (minimum), Table A-5',
};
const STEEL_1045_HR = {
  name: 'AISI 1045 HR',
  kind: 'steel',
  E: 207,
  G: 79.3,
  nu: 0.292,
  Sy: 310,
  Su: 570,
  source: 'Shigley Table A-20 (minimum), Table A-5',
};
const STEEL_1020_CD = {
  name: 'AISI 1020 CD',
  kind: 'steel',
  E: 207,
  G: 79.3,
  nu: 0.292,
  Sy: 390,
  Su: 470,
  source: 'Shigley Table A-20 (minimum), Table A-5',
};

/** SP-450 slurry pump drive shaft: 75 kW at 1480 rpm from the motor coupling to the overhung impeller. */
export function slurryPumpShaft(impellerSeat = 55): Record<string, unknown> {
  return {
    title: 'SP-450 pump drive shaft',
    units: 'SI',
    material: STEEL_1045_CD,
    segments: [
      { label: 'coupling seat', length: 110, od: 55, id: 0 },
      { label: 'seal sleeve', length: 90, od: 65, id: 0 },
      { label: 'drive-end bearing', length: 45, od: 75, id: 0 },
      { label: 'body', length: 380, od: 85, id: 0 },
      { label: 'wet-end bearing', length: 45, od: 75, id: 0 },
      { label: 'impeller seat', length: 120, od: impellerSeat, id: 0 },
    ],
    torques: [
      { label: 'motor coupling', at: 40, power: 75, speed: 1480 },
      { label: 'impeller', at: 730, power: -75, speed: 1480 },
    ],
    features: [
      { type: 'keyseat', form: 'end-mill', at: 40, width: 16, height: 10, length: 90, Sy: 390, label: 'coupling key' },
      { type: 'shoulder-fillet', at: 110, r: 2.5, label: 'coupling shoulder' },
      { type: 'shoulder-fillet', at: 200, r: 2.5, label: 'sleeve shoulder' },
      {
        type: 'keyseat',
        form: 'end-mill',
        at: 730,
        width: 16,
        height: 10,
        length: 100,
        Sy: 390,
        label: 'impeller key',
      },
    ],
    supports: [
      { label: 'drive-end bearing', at: 222.5, kind: 'deep-groove-ball', C: 119, locating: true, X: 0.56, Y: 1.6 },
      { label: 'wet-end bearing', at: 647.5, kind: 'cylindrical-roller', C: 280 },
    ],
    loads: [
      { label: 'motor coupling', at: 40, kind: 'coupling', Fy: 350 },
      { label: 'impeller radial thrust', at: 730, Fy: -5200, Fz: 1800, Fx: -2500 },
    ],
    masses: [
      { label: 'coupling half', at: 40, mass: 18 },
      { label: 'impeller', at: 730, mass: 95 },
    ],
    fatigue: { surface: 'machined', reliability: 99, alternatingTorqueFraction: 0.15 },
  };
}

/**
 * CV-1200 conveyor head shaft: 30 kW at 45 rpm from an overhung final-drive gear to the two keyed hubs of the belt
 * drum.
 */
export function conveyorHeadShaft(hubSeat = 120): Record<string, unknown> {
  return {
    title: 'CV-1200 head pulley shaft',
    units: 'SI',
    material: STEEL_1045_HR,
    segments: [
      { label: 'final-drive gear seat', length: 220, od: 110, id: 0 },
      { label: 'bearing', length: 90, od: 125, id: 0 },
      { label: 'hub seat', length: 180, od: hubSeat, id: 0 },
      { label: 'body', length: 1050, od: 140, id: 0 },
      { label: 'hub seat', length: 180, od: hubSeat, id: 0 },
      { label: 'bearing', length: 90, od: 125, id: 0 },
    ],
    torques: [
      { label: 'final-drive gear', at: 110, power: 30, speed: 45 },
      { label: 'drive-side hub', at: 400, power: -18, speed: 45 },
      { label: 'idle-side hub', at: 1630, power: -12, speed: 45 },
    ],
    features: [
      { type: 'shoulder-fillet', at: 220, r: 4, label: 'gear seat shoulder' },
      {
        type: 'keyseat',
        form: 'sled-runner',
        at: 400,
        width: 32,
        height: 18,
        length: 160,
        Sy: 390,
        Kts: 1.6,
        source: 'Peterson chart value read by the author (demo)',
        label: 'drive hub key',
      },
      {
        type: 'keyseat',
        form: 'sled-runner',
        at: 1630,
        width: 32,
        height: 18,
        length: 160,
        Sy: 390,
        Kts: 1.6,
        source: 'Peterson chart value read by the author (demo)',
        label: 'idle hub key',
      },
    ],
    supports: [
      { label: 'drive-side bearing', at: 265, kind: 'spherical-roller', C: 1020, locating: true },
      { label: 'idle-side bearing', at: 1765, kind: 'spherical-roller', C: 1020 },
    ],
    loads: [
      { label: 'final-drive gear', at: 110, kind: 'gear', pitchDiameter: 720, pressureAngle: 20, direction: 90 },
      { label: 'drum, drive-side hub', at: 400, kind: 'pulley', diameter: 1000, pullFactor: 2.0, direction: 200 },
      { label: 'drum, idle-side hub', at: 1630, kind: 'pulley', diameter: 1000, pullFactor: 2.0, direction: 200 },
    ],
    masses: [
      { label: 'final-drive gear', at: 110, mass: 240 },
      { label: 'drum half', at: 400, mass: 410 },
      { label: 'drum half', at: 1630, mass: 410 },
    ],
    fatigue: { surface: 'machined', reliability: 90 },
  };
}

/** MX-80 hollow agitator shaft: 15 kW at 60 rpm, a long tube from the gearbox flange to the impeller. */
export function mixerShaft(hubSeat = 90, od = 114.3, id = 98): Record<string, unknown> {
  return {
    title: 'MX-80 agitator shaft',
    units: 'SI',
    material: STEEL_1020_CD,
    segments: [
      { label: 'flange spigot', length: 150, od: 90, id: 0 },
      { label: 'tube', length: 4200, od, id },
      { label: 'impeller hub seat', length: 200, od: hubSeat, id: 0 },
    ],
    torques: [
      { label: 'gearbox flange', at: 60, power: 15, speed: 60 },
      { label: 'impeller', at: 4450, power: -15, speed: 60 },
    ],
    features: [
      {
        type: 'keyseat',
        form: 'end-mill',
        at: 4450,
        width: 25,
        height: 14,
        length: 160,
        Sy: 390,
        label: 'impeller key',
      },
    ],
    supports: [
      {
        label: 'gearbox output bearing, lower',
        at: 0,
        kind: 'spherical-roller',
        C: 310,
        locating: true,
        X: 0.67,
        Y: 2.5,
      },
      { label: 'gearbox output bearing, upper', at: 150, kind: 'spherical-roller', C: 310 },
    ],
    loads: [
      { label: 'flange coupling', at: 60, kind: 'coupling' },
      { label: 'impeller side load at design liquid level', at: 4450, Fy: 580, Fx: -1200 },
    ],
    masses: [{ label: 'impeller', at: 4450, mass: 120 }],
    fatigue: { surface: 'machined', reliability: 90 },
  };
}

/** HW-30 hoist winch: drum shaft, 7.5 kW at 24 rpm from the gearbox coupling to the keyed rope drum (lifting duty). */
export function hoistDrumShaft(farBearingC = 300): Record<string, unknown> {
  return {
    title: 'HW-30 winch drum shaft',
    units: 'SI',
    material: STEEL_1045_CD,
    segments: [
      { label: 'coupling seat', length: 130, od: 100, id: 0 },
      { label: 'bearing', length: 60, od: 115, id: 0 },
      { label: 'drum seat', length: 520, od: 130, id: 0 },
      { label: 'bearing', length: 60, od: 115, id: 0 },
    ],
    torques: [
      { label: 'gearbox coupling', at: 65, power: 7.5, speed: 24 },
      { label: 'rope drum', at: 450, power: -7.5, speed: 24 },
    ],
    features: [
      { type: 'keyseat', form: 'end-mill', at: 65, width: 28, height: 16, length: 110, Sy: 390, label: 'coupling key' },
      { type: 'shoulder-fillet', at: 130, r: 5.5, label: 'coupling shoulder' },
      { type: 'shoulder-fillet', at: 190, r: 6, label: 'drum seat shoulder' },
    ],
    supports: [
      { label: 'coupling-side bearing', at: 160, kind: 'spherical-roller', C: 300, locating: true },
      { label: 'far bearing', at: 740, kind: 'spherical-roller', C: farBearingC },
    ],
    loads: [{ label: 'rope pull on the drum', at: 450, Fy: -28000 }],
    masses: [{ label: 'rope drum', at: 450, mass: 160 }],
    fatigue: { surface: 'machined', reliability: 99, alternatingTorqueFraction: 0.2 },
  };
}
