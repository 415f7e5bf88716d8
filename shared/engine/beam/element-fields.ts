import { z } from 'zod';

/* Fields and unit wording shared by every element of the beam model (bearings, loads, masses). */
export const LEN = 'mm (SI) or in (US)';
export const FORCE = 'N (SI) or lbf (US)';
export const TRQ = 'N·m (SI) or lbf·in (US)';
export const label = z.string().max(200).optional();
export const station = z.number().meta({ description: `Station from the left end of the first segment, ${LEN}` });
export const direction = z.number().min(-360).max(360).optional();
