// A five-field cron in words, for the common shapes the schedule uses; anything else is
// shown as it is (the next start, computed by the server, is always shown beside it).

const MONTHS = [
  'January',
  'February',
  'March',
  'April',
  'May',
  'June',
  'July',
  'August',
  'September',
  'October',
  'November',
  'December',
];

function listWords(items: string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

function ordinal(n: number): string {
  const s =
    n % 100 >= 11 && n % 100 <= 13 ? 'th' : (({ 1: 'st', 2: 'nd', 3: 'rd' } as Record<number, string>)[n % 10] ?? 'th');
  return `${n}${s}`;
}

/** "06:00 on the 1st of January, April, July and October", or null when the shape is unusual. */
export function cronWords(cron: string): string | null {
  const f = cron.trim().split(/\s+/);
  if (f.length !== 5) return null;
  const [min, hour, dom, mon, dow] = f;
  if (!/^\d+$/.test(min) || !/^\d+$/.test(hour) || dow !== '*') return null;
  const time = `${hour.padStart(2, '0')}:${min.padStart(2, '0')}`;
  let day: string;
  if (dom === '*') day = 'every day';
  else if (/^\d+$/.test(dom)) day = `the ${ordinal(Number(dom))}`;
  else return null;
  let months: string;
  if (mon === '*') months = dom === '*' ? '' : ' of every month';
  else if (/^\d+(,\d+)*$/.test(mon)) {
    const ms = mon.split(',').map(Number);
    if (ms.some((m) => m < 1 || m > 12)) return null;
    months = ` of ${listWords(ms.map((m) => MONTHS[m - 1]))}`;
  } else return null;
  return dom === '*' ? `${time} ${day}${months}` : `${time} on ${day}${months}`;
}
