import { bearingTag, forceCleaner, loadName, loadTag } from '../../../../../shared/plots';
import type { CalcResult } from '../../../../../shared/engine';
import { fmt } from '../editor/result-format';

/*
 * Rows of the whole-shaft tables as display text, so the tables and their spec agree on what an
 * engineer reads: four significant digits, a dash where the engine gives no value (no C, no speed).
 */
const KIND_NAMES: Record<string, string> = {
  'deep-groove-ball': 'deep-groove ball',
  'cylindrical-roller': 'cylindrical roller',
  'tapered-roller': 'tapered roller',
  'spherical-roller': 'spherical roller',
  'self-aligning-ball': 'self-aligning ball',
  plain: 'plain',
};

export interface ReactionRow {
  tag: string;
  name: string;
  at: string;
  Fy: string;
  Fz: string;
  F: string;
  Fa: string;
  slope: string;
  L10: string;
  L10h: string;
}
export interface LoadRow {
  tag: string;
  name: string;
  at: string;
  Fy: string;
  Fz: string;
  deflection: string;
  slope: string;
}

export function reactionRows(r: CalcResult): ReactionRow[] {
  const c = forceCleaner(r);
  return r.supports.map((s) => ({
    tag: bearingTag(s.index),
    name: [KIND_NAMES[s.kind] ?? s.kind, s.label ?? ''].filter(Boolean).join(', '),
    at: fmt(s.at),
    Fy: fmt(c(s.Fy)),
    Fz: fmt(c(s.Fz)),
    F: fmt(s.F),
    Fa: fmt(s.Fa),
    slope: fmt(s.slope, 3),
    L10: fmt(s.L10, 3),
    L10h: fmt(s.L10h, 3),
  }));
}

export function loadRows(r: CalcResult): LoadRow[] {
  const c = forceCleaner(r);
  return r.loads.map((l) => ({
    tag: loadTag(l.kind, l.index),
    name: [loadName(l.kind), l.label ?? ''].filter(Boolean).join(', '),
    at: fmt(l.at),
    Fy: fmt(c(l.Fy)),
    Fz: fmt(c(l.Fz)),
    deflection: fmt(l.deflection, 3),
    slope: fmt(l.slope, 3),
  }));
}
