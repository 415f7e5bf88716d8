/** Version of the calculation engine; stored with every result so a record says what produced it. */
export const ENGINE_VERSION = '1.0.0';

export const CAUTION = 'Results support, never replace, the judgement of a qualified engineer; '
  + 'local codes and licensed practice govern.';
