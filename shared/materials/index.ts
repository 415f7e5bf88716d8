/*
 * Torquetrail material library: plain TypeScript, no framework, so the editor, the server and the
 * PDF report read the same sourced values.
 */
export { MATERIAL_LIBRARY, SHIGLEY_A5, SHIGLEY_A20 } from './library';
export {
  BASIS_LABELS,
  type LibraryMaterial,
  type MaterialKind,
  type MaterialProperty,
  type SourcedValue,
  type ValueBasis,
} from './material-types';
export { findMaterial, matchMaterial, sourceText, toMaterialInput, valueIn } from './material-values';
