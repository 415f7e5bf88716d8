/*
 * First-iteration stress-concentration estimates for shaft design, Budynas & Nisbett, Shigley's
 * Mechanical Engineering Design, 9th ed., Table 7-1 (the 10th keeps it). Values marked so in
 * docs/references.md: end-mill keyseat and sharp fillet checked against a copy; the sled-runner Kt,
 * the well-rounded fillet and the retaining-ring groove are recalled from memory. The table gives
 * no Kts for a sled-runner keyseat: the author must enter one (see check-features.ts).
 */
export interface TableEntry {
  Kt: number;
  Kts: number | null;
  note: string;
}

export const TABLE_7_1 = {
  sharpFillet: { Kt: 2.7, Kts: 2.2, note: 'shoulder fillet, sharp (r/d = 0.02)' },
  roundedFillet: { Kt: 1.7, Kts: 1.5, note: 'shoulder fillet, well rounded (r/d = 0.1)' },
  endMillKeyseat: { Kt: 2.14, Kts: 3.0, note: 'end-mill keyseat (r/d = 0.02)' },
  sledRunnerKeyseat: { Kt: 1.7, Kts: null, note: 'sled-runner keyseat' },
  ringGroove: { Kt: 5.0, Kts: 3.0, note: 'retaining-ring groove' },
} as const satisfies Record<string, TableEntry>;

/** Shigley Table 7-1's keyseat proportion: root radius r = 0.02·d when the author gives none. */
export const KEYSEAT_R_OVER_D = 0.02;
/** An entered root radius within ±10 % of 0.02·d still counts as the table's (common practice, no source). */
export const KEYSEAT_RD_TOLERANCE = 0.1;

/** Standard retaining-ring groove proportions the ring-groove values stand for (ring makers' tables, from memory). */
export const RING_GROOVE_LIMITS = { depthOverD: 0.05, rOverDepth: 0.5 } as const;

export function tableMethod(entry: TableEntry): string {
  return `Shigley 9th Table 7-1 first-iteration estimate, ${entry.note}`;
}
