/*
 * Plot geometry for Torquetrail: the shaft outline to scale and the diagrams along it, as plain
 * shapes and series in the calc's units. No framework and no DOM, so the PDF report can reuse it.
 */
export type { Axis, Chart, LimitLine, PlacedLimit, Point, Series } from './plot-types';
export { niceAxis, niceStep, valueRange } from './ticks';
export { torquePlot, shearPlot, twistPlot, twistRatePlot } from './diagrams';
export {
  shaftOutline,
  featureTag,
  type ShaftOutline,
  type OutlineSegment,
  type OutlineFeature,
  type OutlineRect,
  type MarkShape,
  type OutlineInput,
} from './outline';
export {
  shaftLoads,
  hasBeamModel,
  loadTag,
  loadName,
  bearingTag,
  type ShaftLoads,
  type ForceArrow,
  type BearingMark,
} from './shaft-loads';
export { bendingPlot, deflectionPlot, slopePlot, type StationLimit } from './shaft-diagrams';
export { shaftLimits } from './shaft-limits';
export { beamUnit, forceCleaner } from './beam-units';
