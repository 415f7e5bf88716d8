/**
 * Invented process-equipment shafts of the Kestrel Fen Drives demo: the slurry pump and the agitator.
 * Material values: AISI grades' minimum strengths from Shigley Table A-20 and carbon-steel elastic constants
 * from Table A-5; everything else (dimensions, duties, loads, bearing ratings, names) is invented for the demo.
 * Bending moments come from the bearings and loads (beam model), not from hand-entered values.
 */

import { STEEL_1045_CD, STEEL_1020_CD, solid, atSpeed, keyseat } from './demo-shaft-parts';

/** SP-450 slurry pump drive shaft: 75 kW at 1480 rpm from the motor coupling to the overhung impeller. */
export function slurryPumpShaft(impellerSeat = 55): Record<string, unknown> {
  return {
    title: 'SP-450 pump drive shaft',
    units: 'SI',
    material: STEEL_1045_CD,
    segments: [
      solid('coupling seat', 110, 55),
      solid('seal sleeve', 90, 65),
      solid('drive-end bearing', 45, 75),
      solid('body', 380, 85),
      solid('wet-end bearing', 45, 75),
      solid('impeller seat', 120, impellerSeat),
    ],
    torques: atSpeed(1480, [
      ['motor coupling', 40, 75],
      ['impeller', 730, -75],
    ]),
    features: [
      keyseat('end-mill', 40, [16, 10, 90], 'coupling key'),
      { type: 'shoulder-fillet', at: 110, r: 2.5, label: 'coupling shoulder' },
      { type: 'shoulder-fillet', at: 200, r: 2.5, label: 'sleeve shoulder' },
      keyseat('end-mill', 730, [16, 10, 100], 'impeller key'),
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

/** MX-80 hollow agitator shaft: 15 kW at 60 rpm, a long tube from the gearbox flange to the impeller. */
export function mixerShaft(hubSeat = 90, od = 114.3, id = 98): Record<string, unknown> {
  return {
    title: 'MX-80 agitator shaft',
    units: 'SI',
    material: STEEL_1020_CD,
    segments: [
      solid('flange spigot', 150, 90),
      { label: 'tube', length: 4200, od, id },
      solid('impeller hub seat', 200, hubSeat),
    ],
    torques: atSpeed(60, [
      ['gearbox flange', 60, 15],
      ['impeller', 4450, -15],
    ]),
    features: [keyseat('end-mill', 4450, [25, 14, 160], 'impeller key')],
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
