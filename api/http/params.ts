/**
 * Request parameters several features share: a district code, a numeric id, an indicator
 * code. A leaf module: it imports nothing from any feature, so every router may use it.
 */
import { z } from 'zod';

/** A district's code in a path or query: 1–32 letters, digits, _ or -. */
export const districtCode = z
  .string()
  .regex(/^[A-Za-z0-9_-]{1,32}$/, 'a district code is 1–32 letters, digits, _ or -');

/** Path parameters `{ code }` of one district. */
export const districtParams = z.object({ code: districtCode });

/** Path parameters `{ id }` of a numeric resource id, shared by every `/:id` route. */
export const idParams = z.object({ id: z.coerce.number().int().positive() });

/** An indicator's code: a lower-case letter, then up to 62 lower-case letters, digits or _. */
export const indicatorCode = z
  .string()
  .regex(/^[a-z][a-z0-9_]{0,62}$/, 'an indicator code is a lower-case letter then up to 62 letters, digits or _');
