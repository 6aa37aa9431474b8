// Dates and times on the staff screens. One fixed locale (as lib/format.ts) so every screen
// prints them alike; the zone is the viewer's unless a screen names one (the schedule uses
// the region's).

const LOCALE = 'en-GB';

/** "2 Dec 2026, 06:00" (optionally in a named IANA zone, with its abbreviation). */
export function formatDateTime(iso: string | null | undefined, timeZone?: string): string {
  if (!iso) return '—';
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return new Intl.DateTimeFormat(LOCALE, {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    ...(timeZone ? { timeZone, timeZoneName: 'short' } : {}),
  }).format(d);
}

/** "2 Dec 2026". */
export function formatDate(iso: string | null | undefined): string {
  if (!iso) return '—';
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return new Intl.DateTimeFormat(LOCALE, { day: 'numeric', month: 'short', year: 'numeric' }).format(d);
}

/** "in 3 days", "in 5 hours", "2 minutes ago": how far a moment is from now. */
export function formatRelative(iso: string | null | undefined, now: Date = new Date()): string {
  if (!iso) return '';
  const ms = new Date(iso).getTime() - now.getTime();
  if (Number.isNaN(ms)) return '';
  const abs = Math.abs(ms);
  const units: [number, string][] = [
    [86_400_000, 'day'],
    [3_600_000, 'hour'],
    [60_000, 'minute'],
  ];
  for (const [size, name] of units) {
    if (abs >= size) {
      const n = Math.round(abs / size);
      const words = `${n} ${name}${n === 1 ? '' : 's'}`;
      return ms > 0 ? `in ${words}` : `${words} ago`;
    }
  }
  return ms > 0 ? 'in under a minute' : 'just now';
}

/** "1.2 MB", "830 kB", "412 bytes". */
export function formatBytes(n: number | null | undefined): string {
  if (n === null || n === undefined) return '—';
  if (n < 1000) return `${n} bytes`;
  if (n < 1_000_000) return `${(n / 1000).toFixed(n < 10_000 ? 1 : 0)} kB`;
  return `${(n / 1_000_000).toFixed(1)} MB`;
}
