import type { LibraryMaterial, SourcedValue } from './material-types';

// Budynas & Nisbett, Shigley's Mechanical Engineering Design, 9th ed. (the 10th keeps the table numbers).
export const SHIGLEY_A5 = "Shigley's Mechanical Engineering Design, 9th ed., Table A-5";
export const SHIGLEY_A20 = "Shigley's Mechanical Engineering Design, 9th ed., Table A-20 (ASTM minimum)";

// Table A-5 lists one representative set of elastic constants per family: typical, not guaranteed.
const elastic = (E: number, G: number, nu: number): Pick<LibraryMaterial, 'E' | 'G' | 'nu'> => ({
  E: { value: E, source: SHIGLEY_A5, basis: 'typical' },
  G: { value: G, source: SHIGLEY_A5, basis: 'typical' },
  nu: { value: nu, source: SHIGLEY_A5, basis: 'typical' },
});

const minimum = (value: number): SourcedValue => ({ value, source: SHIGLEY_A20, basis: 'specified-minimum' });

function carbonSteel(id: string, name: string, Su: number, Sy: number): LibraryMaterial {
  return {
    id,
    name,
    kind: 'steel',
    ...elastic(207, 79.3, 0.292),
    Su: minimum(Su),
    Sy: minimum(Sy),
    needsAuthorStrengths: false,
    note: 'Strengths are ASTM minimum values for bar stock; larger sections and heat treatment change them.',
  };
}

/**
 * The material library. Every value names its source and whether it is a specified minimum or a
 * typical value. Families without a sourced strength carry no Sy/Su: the author enters them.
 */
export const MATERIAL_LIBRARY: readonly LibraryMaterial[] = Object.freeze([
  carbonSteel('aisi-1018-cd', 'AISI 1018 CD', 440, 370),
  carbonSteel('aisi-1020-cd', 'AISI 1020 CD', 470, 390),
  carbonSteel('aisi-1045-hr', 'AISI 1045 HR', 570, 310),
  carbonSteel('aisi-1045-cd', 'AISI 1045 CD', 630, 530),
  carbonSteel('aisi-1050-cd', 'AISI 1050 CD', 690, 580),
  {
    id: 'stainless-18-8',
    name: 'Stainless steel 18-8',
    kind: 'stainless-steel',
    ...elastic(190, 73.1, 0.305),
    Sy: null,
    Su: null,
    needsAuthorStrengths: true,
    note: 'Elastic constants only: enter Sy and Su for the grade and condition, with their source.',
  },
  {
    id: 'aluminium-alloy',
    name: 'Aluminium alloy',
    kind: 'aluminium',
    ...elastic(71.7, 26.9, 0.333),
    Sy: null,
    Su: null,
    needsAuthorStrengths: true,
    note: 'Elastic constants only: enter Sy and Su for the alloy and temper, with their source.',
  },
]);
