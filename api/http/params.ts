/**
 * Request parameters several features share: a district code, a numeric id, an indicator
 * code. A leaf module: it imports nothing from any feature, so every router may use it.
 */
import { z } from 'zod';
import {
  DISTRICT_CODE,
  DISTRICT_CODE_RULE,
  INDICATOR_CODE,
  INDICATOR_CODE_RULE,
  TRACK_CODE,
  TRACK_CODE_RULE,
} from '../../contracts/patterns';

/** A district's code in a path or query (contracts/patterns.ts: the app checks the same pattern). */
export const districtCode = z.string().regex(DISTRICT_CODE, DISTRICT_CODE_RULE);

/** Path parameters `{ code }` of one district. */
export const districtParams = z.object({ code: districtCode });

/** Path parameters `{ id }` of a numeric resource id, shared by every `/:id` route. */
export const idParams = z.object({ id: z.coerce.number().int().positive() });

/** An indicator's code (contracts/patterns.ts). */
export const indicatorCode = z.string().regex(INDICATOR_CODE, INDICATOR_CODE_RULE);

/** A track's code (contracts/patterns.ts), e.g. `co2`, `pm25`. */
export const trackCode = z.string().regex(TRACK_CODE, TRACK_CODE_RULE);

/** The `?track=` of a published read (absent: the headline track). */
export const trackQuery = z.object({ track: trackCode.optional() });
