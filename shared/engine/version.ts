/** Version of the calculation engine; stored with every result so a record says what produced it. */
// 1.1.0: internal torque sign follows the right-hand rule; US Se′ cap 100 kpsi; plausible input ranges (issue 9).
export const ENGINE_VERSION = '1.1.0';

export const CAUTION = 'Results support, never replace, the judgement of a qualified engineer; '
  + 'local codes and licensed practice govern.';
