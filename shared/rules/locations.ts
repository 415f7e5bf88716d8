import { UNIT_LABELS, type CalcInput, type CalcResult } from '../engine';
import type { RowLocation } from './checklist-types';
import type { Facts, LocationFacts } from './facts';
import type { Scope } from './rule-set-schema';
import { shortNumber } from './short-number';

export interface Target {
  location: RowLocation;
  facts: Facts;
}

const quoted = (label: string | undefined): string => (label ? ` "${label}"` : '');

/** Every location a clause of the scope is evaluated at, with its facts. */
export function targetsOf(scope: Scope, input: CalcInput, result: CalcResult, facts: LocationFacts): Target[] {
  const len = UNIT_LABELS[input.units].length;
  const f = (v: number): string => shortNumber(v, 6);
  if (scope === 'shaft')
    return [{ location: { scope, index: null, at: null, label: 'whole shaft' }, facts: facts.shaft }];
  if (scope === 'segment') {
    return result.segments.map((s, i) => ({
      location: {
        scope,
        index: i,
        at: s.start,
        label: `segment ${i + 1}${quoted(s.label)} (${f(s.start)}–${f(s.end)} ${len})`,
      },
      facts: facts.segments[i],
    }));
  }
  if (scope === 'support') {
    return result.supports.map((s, i) => ({
      location: {
        scope,
        index: i,
        at: s.at,
        label: `bearing ${i + 1}${quoted(s.label)} (${s.kind}) at ${f(s.at)} ${len}`,
      },
      facts: facts.supports[i],
    }));
  }
  if (scope === 'load') {
    return result.loads.map((l, i) => ({
      location: { scope, index: i, at: l.at, label: `${l.kind} at ${f(l.at)} ${len}${quoted(l.label)}` },
      facts: facts.loads[i],
    }));
  }
  return result.features.map((ft, i) => ({
    location: { scope, index: i, at: ft.at, label: `${ft.type} at ${f(ft.at)} ${len}${quoted(ft.label)}` },
    facts: facts.features[i],
  }));
}
