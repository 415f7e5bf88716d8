import { z } from 'zod';

/* The building blocks of the calc input schema: unit wording and the fields every kind of entry shares. */
export const LEN = 'mm (SI) or in (US)';
export const TRQ = 'N·m (SI) or lbf·in (US)';
export const STRESS = 'MPa (SI) or ksi (US)';

export const positive = (what: string) =>
  z
    .number()
    .positive()
    .meta({ description: `${what}, ${LEN}` });
export const station = z.number().meta({ description: `Station from the left end of the first segment, ${LEN}` });
export const label = z.string().max(200).optional();
export const source = z
  .string()
  .min(1)
  .max(500)
  .optional()
  .meta({ description: 'Where an author-entered factor comes from (book, edition, chart)' });
