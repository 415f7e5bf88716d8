export { formatEng, formatWithUnit, formatBeside, formatUtilisation, unitText } from './engineering';
export { headlineMark, type HeadlineMark, type HeadlineOutcome } from './headline';
export { formatBytes } from './bytes';
