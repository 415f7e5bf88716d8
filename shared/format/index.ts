export { formatEng, formatWithUnit, formatBeside, formatUtilisation, unitText } from './engineering';
export { headlineMark, type HeadlineMark, type HeadlineOutcome } from './headline';
export { formatBytes } from './bytes';
export { placeOf, fieldLabel, namePathsIn } from '../engine/field-places';
export { featureTypesOf, findingPlace, rowPath, type FindingAnchor } from './finding-place';
