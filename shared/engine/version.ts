/** Version of the calculation engine; stored with every result so a record says what produced it. */
// 1.1.0: internal torque sign follows the right-hand rule; US Se′ cap 100 kpsi; plausible input ranges (issue 9).
// 2.0.0: bearings, loads and masses (format v2): reactions, bending in two planes, deflection, slope, bearing
// life, critical speed, and moments at features from the model. New result fields: the stored unit and formula
// metadata is kept per engine version (server/calcs/stored-result.ts), so any change to `fields` needs a new version.
export const ENGINE_VERSION = '2.0.0';

/** The one wording of the safety caution: results, reports, command output, mail and the client's screens. */
export const CAUTION =
  'Results support, never replace, the judgement of a qualified engineer; ' +
  'local codes and licensed practice govern.';
