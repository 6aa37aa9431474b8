/**
 * Code patterns shared by the server (request validation, upload parsing) and the app
 * (route matching, form checks). One definition each, so the two cannot disagree.
 */

/** A district code's characters as a fragment, for building other patterns (a route path, a script). */
export const DISTRICT_CODE_PART = '[A-Za-z0-9_-]{1,32}';
/** A district code: 1–32 letters, digits, `_` or `-` (e.g. `D07`, `north-3`). */
export const DISTRICT_CODE = new RegExp(`^${DISTRICT_CODE_PART}$`);
export const DISTRICT_CODE_RULE = 'a district code is 1–32 letters, digits, _ or -';

/** An indicator code: a lower-case letter, then up to 62 lower-case letters, digits or `_`. */
export const INDICATOR_CODE = /^[a-z][a-z0-9_]{0,62}$/;
export const INDICATOR_CODE_RULE = 'an indicator code is a lower-case letter then up to 62 letters, digits or _';

export function isDistrictCode(value: string): boolean {
  return DISTRICT_CODE.test(value);
}

export function isIndicatorCode(value: string): boolean {
  return INDICATOR_CODE.test(value);
}

/** A track code: a lower-case letter, then up to 31 lower-case letters, digits or `-` (e.g. `co2`, `pm25`). */
export const TRACK_CODE = /^[a-z][a-z0-9-]{0,31}$/;
export const TRACK_CODE_RULE = 'a track code is a lower-case letter then up to 31 letters, digits or -';

export function isTrackCode(value: string): boolean {
  return TRACK_CODE.test(value);
}
