// Dates and times on every screen, written through Intl in the region's locale (the
// `regionLocale` setting, lib/format.ts): "2 Dec 2026, 06:00" in en-GB, "2. Dez. 2026, 06:00"
// in de-DE. The zone is the viewer's unless a caller names one (the schedule uses the
// region's, published days UTC). Relative times ("in 3 days") stay in English words.
// date-fns one module each: Metro bundles every module the package index re-exports (about
// 160 KB of date-fns in the first route's JavaScript), as it does not drop unused exports.
import { differenceInMinutes } from 'date-fns/differenceInMinutes';
import { formatDistanceStrict } from 'date-fns/formatDistanceStrict';
import { isValid } from 'date-fns/isValid';
import { parseISO } from 'date-fns/parseISO';

import { formatDecimal, regionLocale } from './format';

type Moment = string | number | Date;

function toDate(value: Moment): Date {
  if (value instanceof Date) return value;
  return typeof value === 'number' ? new Date(value) : parseISO(value);
}

const formats = new Map<string, Intl.DateTimeFormat>();
function dtf(options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const locale = regionLocale();
  const key = `${locale} ${JSON.stringify(options)}`;
  let f = formats.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(locale, options);
    formats.set(key, f);
  }
  return f;
}

const DAY: Intl.DateTimeFormatOptions = { day: 'numeric', month: 'short', year: 'numeric' };
const TIME: Intl.DateTimeFormatOptions = { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' };

/** "UTC", "CET", "GMT+2": the zone's short name at that moment, as the platform names it. */
function zoneName(d: Date, timeZone: string): string {
  const part = dtf({ timeZone, timeZoneName: 'short' })
    .formatToParts(d)
    .find((p) => p.type === 'timeZoneName');
  return part?.value ?? timeZone;
}

/** "2 Dec 2026, 06:00" (optionally in a named IANA zone, with its short name). */
export function formatDateTime(iso: string | null | undefined, timeZone?: string): string {
  if (!iso) return '—';
  const d = toDate(iso);
  if (!isValid(d)) return iso;
  const text = dtf({ ...DAY, ...TIME, ...(timeZone ? { timeZone } : {}) }).format(d);
  return timeZone ? `${text} ${zoneName(d, timeZone)}` : text;
}

/** "2 Dec 2026" (optionally in a named zone: published days are read in UTC). */
export function formatDate(iso: string | null | undefined, timeZone?: string): string {
  if (!iso) return '—';
  const d = toDate(iso);
  if (!isValid(d)) return iso;
  return dtf({ ...DAY, ...(timeZone ? { timeZone } : {}) }).format(d);
}

/** "4 December 2026" (en-GB), "4. Dezember 2026" (de-DE): a day written out in full. */
export function formatLongDate(iso: string | null | undefined, timeZone?: string): string {
  if (!iso) return '—';
  const d = toDate(iso);
  if (!isValid(d)) return iso;
  return dtf({ day: 'numeric', month: 'long', year: 'numeric', ...(timeZone ? { timeZone } : {}) }).format(d);
}

/** "2 Dec, 06:00": a moment of today or the last few days, in the viewer's zone. */
export function formatDayTime(moment: Moment): string {
  const d = toDate(moment);
  return isValid(d) ? dtf({ day: 'numeric', month: 'short', ...TIME }).format(d) : '';
}

/** "06:00": the time of a moment of today, in the viewer's zone. */
export function formatClock(moment: Moment): string {
  const d = toDate(moment);
  return isValid(d) ? dtf(TIME).format(d) : '';
}

/**
 * "in 3 days", "in 5 hours", "2 minutes ago": how far a moment is from now, in the largest
 * whole unit up to days (a quarter away reads "in 91 days", which is what a schedule wants).
 */
export function formatRelative(iso: string | null | undefined, now: Date = new Date()): string {
  if (!iso) return '';
  const d = toDate(iso);
  if (!isValid(d)) return '';
  const minutes = Math.abs(differenceInMinutes(d, now));
  if (minutes < 1) return d.getTime() > now.getTime() ? 'in under a minute' : 'just now';
  const unit = minutes >= 24 * 60 ? 'day' : minutes >= 60 ? 'hour' : 'minute';
  return formatDistanceStrict(d, now, { addSuffix: true, unit, roundingMethod: 'round' });
}

/** "1.2 MB", "830 kB", "412 bytes". */
export function formatBytes(n: number | null | undefined): string {
  if (n === null || n === undefined) return '—';
  if (n < 1000) return `${n} bytes`;
  if (n < 1_000_000) return `${formatDecimal(n / 1000, n < 10_000 ? 1 : 0, n < 10_000 ? 1 : 0)} kB`;
  return `${formatDecimal(n / 1_000_000, 1, 1)} MB`;
}
