// Dates and times on every screen, computed and written with date-fns (zones through
// @date-fns/tz). One fixed pattern set so every screen prints them alike; the zone is the
// viewer's unless a caller names one (the schedule uses the region's, published days UTC).
import { TZDate } from '@date-fns/tz';
import { differenceInMinutes, format, formatDistanceStrict, isValid, parseISO } from 'date-fns';

type Moment = string | number | Date;

function toDate(value: Moment): Date {
  if (value instanceof Date) return value;
  return typeof value === 'number' ? new Date(value) : parseISO(value);
}

/** The moment seen in a named IANA zone (or as it is, in the viewer's zone). */
function inZone(d: Date, timeZone?: string): Date {
  return timeZone ? new TZDate(d, timeZone) : d;
}

/** "UTC", "CET", "GMT+2": the zone's short name at that moment, as the platform names it. */
function zoneName(d: Date, timeZone: string): string {
  const part = new Intl.DateTimeFormat('en-GB', { timeZone, timeZoneName: 'short' })
    .formatToParts(d)
    .find((p) => p.type === 'timeZoneName');
  return part?.value ?? timeZone;
}

/** "2 Dec 2026, 06:00" (optionally in a named IANA zone, with its short name). */
export function formatDateTime(iso: string | null | undefined, timeZone?: string): string {
  if (!iso) return '—';
  const d = toDate(iso);
  if (!isValid(d)) return iso;
  const text = format(inZone(d, timeZone), 'd MMM yyyy, HH:mm');
  return timeZone ? `${text} ${zoneName(d, timeZone)}` : text;
}

/** "2 Dec 2026" (optionally in a named zone: published days are read in UTC). */
export function formatDate(iso: string | null | undefined, timeZone?: string): string {
  if (!iso) return '—';
  const d = toDate(iso);
  if (!isValid(d)) return iso;
  return format(inZone(d, timeZone), 'd MMM yyyy');
}

/** "2 Dec, 06:00": a moment of today or the last few days, in the viewer's zone. */
export function formatDayTime(moment: Moment): string {
  const d = toDate(moment);
  return isValid(d) ? format(d, 'd MMM, HH:mm') : '';
}

/** "06:00": the time of a moment of today, in the viewer's zone. */
export function formatClock(moment: Moment): string {
  const d = toDate(moment);
  return isValid(d) ? format(d, 'HH:mm') : '';
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
  if (n < 1_000_000) return `${(n / 1000).toFixed(n < 10_000 ? 1 : 0)} kB`;
  return `${(n / 1_000_000).toFixed(1)} MB`;
}
