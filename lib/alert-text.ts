// One alert in words (the district's alerts section and the caller's feed).
import type { AlertKind } from '@/contracts/alerts';
import type { Shape, Standing } from '@/contracts/estimates';
import { ALERT_KIND_LABEL, formatLevel, SHAPE_PLAIN_SHORT, shapeWords, STANDING_LABEL } from './estimate-words';
import { formatDate } from './format-time';

const standingWord = (v: unknown) =>
  typeof v === 'string' && v in STANDING_LABEL ? STANDING_LABEL[v as Standing] : String(v);
/** Officials read alerts: `flat` in plain words, at the test level when the alert carries it. */
const shapeWord = (v: unknown, alpha: number | null) => {
  if (typeof v !== 'string' || !(v in SHAPE_PLAIN_SHORT)) return String(v);
  return alpha === null ? SHAPE_PLAIN_SHORT[v as Shape] : shapeWords(v as Shape, alpha);
};
const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null);

export function alertTitle(kind: AlertKind): string {
  return ALERT_KIND_LABEL[kind] ?? kind;
}

/** "From Approaching to At the turn", "Threshold 21,965 → 24,600 (+12%)", … */
export function alertDetail(kind: AlertKind, details: Record<string, unknown>): string {
  switch (kind) {
    case 'crossing':
      return `Standing moved from ${standingWord(details.from)} to ${standingWord(details.to)}.`;
    case 'threshold_shift': {
      const from = num(details.from);
      const to = num(details.to);
      const pct = num(details.percent);
      const move = pct === null ? '' : ` (${pct >= 0 ? '+' : '−'}${Math.abs(Math.round(pct))}%)`;
      return from !== null && to !== null
        ? `Threshold moved from ${formatLevel(from)} to ${formatLevel(to)}${move}.`
        : `Threshold moved${move}.`;
    }
    case 'shape_change':
      return `Shape changed from ${shapeWord(details.from, num(details.alpha))} to ${shapeWord(details.to, num(details.alpha))}.`;
    case 'significance_change':
      return details.to === true
        ? 'The U-test now confirms a turn at the test level.'
        : 'The U-test no longer confirms a turn at the test level.';
    default:
      return '';
  }
}

/** "2 Dec 2026", the day in UTC (alerts are dated by their run's publish). */
export function formatDay(iso: string): string {
  return formatDate(iso, 'UTC');
}
