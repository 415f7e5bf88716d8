/**
 * Invented material-handling shafts of the Kestrel Fen Drives demo: the conveyor head and the hoist drum.
 * Material values: AISI grades' minimum strengths from Shigley Table A-20 and carbon-steel elastic constants
 * from Table A-5; everything else (dimensions, duties, loads, bearing ratings, names) is invented for the demo.
 * Bending moments come from the bearings and loads (beam model), not from hand-entered values.
 */

import { STEEL_1045_CD, STEEL_1045_HR, solid, atSpeed, keyseat } from './demo-shaft-parts';

const HUB_KEY_CHART = { Kts: 1.6, source: 'Peterson chart value read by the author (demo)' };

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
      solid('final-drive gear seat', 220, 110),
      solid('bearing', 90, 125),
      solid('hub seat', 180, hubSeat),
      solid('body', 1050, 140),
      solid('hub seat', 180, hubSeat),
      solid('bearing', 90, 125),
    ],
    torques: atSpeed(45, [
      ['final-drive gear', 110, 30],
      ['drive-side hub', 400, -18],
      ['idle-side hub', 1630, -12],
    ]),
    features: [
      { type: 'shoulder-fillet', at: 220, r: 4, label: 'gear seat shoulder' },
      keyseat('sled-runner', 400, [32, 18, 160], 'drive hub key', HUB_KEY_CHART),
      keyseat('sled-runner', 1630, [32, 18, 160], 'idle hub key', HUB_KEY_CHART),
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

/** HW-30 hoist winch: drum shaft, 7.5 kW at 24 rpm from the gearbox coupling to the keyed rope drum (lifting duty). */
export function hoistDrumShaft(farBearingC = 300): Record<string, unknown> {
  return {
    title: 'HW-30 winch drum shaft',
    units: 'SI',
    material: STEEL_1045_CD,
    segments: [
      solid('coupling seat', 130, 100),
      solid('bearing', 60, 115),
      solid('drum seat', 520, 130),
      solid('bearing', 60, 115),
    ],
    torques: atSpeed(24, [
      ['gearbox coupling', 65, 7.5],
      ['rope drum', 450, -7.5],
    ]),
    features: [
      keyseat('end-mill', 65, [28, 16, 110], 'coupling key'),
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
