import { bendingStations } from './beam/bending-at';
import { evaluateBeam } from './beam/beam-eval';
import { enduranceLimit } from './endurance';
import { evaluateFeature } from './feature-eval';
import { FIELDS } from './fields';
import { assertFiniteResult, guarded } from './finite';
import { buildModel, type Model } from './model';
import { modelWarnings } from './model-warnings';
import { METHODS } from './methods';
import type { CalcResult, Endurance, ResolvedTorque, TorquePiece } from './result';
import type { CalcInput } from './schema';
import { locate } from './shaft-geometry';
import { evaluateSegment } from './segment-eval';
import { summarize } from './summary';
import { buildTorqueDiagram, type Piece } from './torque-diagram';
import { CalcInputError, validateCalcInput } from './validate';
import { CAUTION, ENGINE_VERSION } from './version';

const DEG = 180 / Math.PI;

function diagramOut(model: Model, pieces: Piece[]): TorquePiece[] {
  const k = model.k;
  let twist = 0;
  return pieces.map((p) => {
    const out = {
      start: p.start / k.length,
      end: p.end / k.length,
      segment: p.segment,
      T: p.T / k.torque,
      Ta: p.Ta / k.torque,
      twistStart: twist * DEG,
      twistPerLength: p.rate / k.twistPerLength,
    };
    twist += p.rate * (p.end - p.start);
    return out;
  });
}

function torquesOut(model: Model): ResolvedTorque[] {
  const k = model.k;
  return model.torques.map((t) => ({
    index: t.index,
    at: t.at / k.length,
    T: t.T / k.torque,
    Ta: t.Ta / k.torque,
    isFromPower: t.isFromPower,
  }));
}

function keyseatSegments(model: Model): boolean[] {
  const flags = model.segs.map(() => false);
  for (const ft of model.input.features ?? []) {
    if (ft.type !== 'keyseat') continue;
    const loc = locate(ft.at * model.k.length, model.bounds);
    flags[loc.left] = flags[loc.right] = true;
  }
  return flags;
}

/**
 * Evaluates input that has already passed validateCalcInput, skipping the schema check (the live
 * editor and the benchmark call this after validating once). Anything else must use evaluateShaft.
 * Throws CalcInputError if a number would come out NaN or infinite (finite.ts): never a null for it.
 */
export function evaluateValidInput(input: CalcInput): CalcResult {
  const model = buildModel(input);
  modelWarnings(model);
  const beam = evaluateBeam(model);
  model.beam = beam.solution;
  model.bendingStations = bendingStations(model);
  const pieces = buildTorqueDiagram(model);
  const fat = model.fatigue;
  const endurance: (Endurance | null)[] = model.segs.map((s) => (fat ? enduranceLimit(s.mat, s.od, fat) : null));
  const features = (input.features ?? []).map((_, i) =>
    guarded(`features[${i}]`, () => evaluateFeature(model, i, pieces, endurance)),
  );
  const hasKeyseat = keyseatSegments(model);
  const segments = model.segs.map((s) =>
    guarded(`segments[${s.index}]`, () => evaluateSegment(model, s, pieces, endurance[s.index], hasKeyseat[s.index])),
  );
  const result: CalcResult = {
    engineVersion: ENGINE_VERSION,
    units: input.units,
    caution: CAUTION,
    fields: FIELDS[input.units],
    methods: METHODS,
    length: model.total / model.k.length,
    segments,
    features,
    torques: torquesOut(model),
    torqueDiagram: diagramOut(model, pieces),
    ...summarize(segments, features),
    ...beam.results,
    warnings: model.warnings,
  };
  assertFiniteResult(result);
  return result;
}

/**
 * Validates and evaluates a calc input (any unknown value, e.g. parsed JSON). Throws
 * CalcInputError, whose `issues` name each field path and reason, when the input is invalid.
 */
export function evaluateShaft(input: CalcInput | unknown): CalcResult {
  const checked = validateCalcInput(input);
  if (!checked.ok) throw new CalcInputError(checked.issues);
  return evaluateValidInput(checked.value);
}
