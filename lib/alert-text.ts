// One alert in words (the district's alerts section and the caller's feed).
import type { AlertKind } from '@/contracts/alerts';
import type { Shape, Standing } from '@/contracts/estimates';
import { ALERT_KIND_LABEL, formatLevel, SHAPE_LABEL, STANDING_LABEL } from './estimate-words';
import { formatDate } from './format-time';

const standingWord = (v: unknown) =>
  typeof v === 'string' && v in STANDING_LABEL ? STANDING_LABEL[v as Standing] : String(v);
const shapeWord = (v: unknown) => (typeof v === 'string' && v in SHAPE_LABEL ? SHAPE_LABEL[v as Shape] : String(v));
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
      return `Shape changed from ${shapeWord(details.from)} to ${shapeWord(details.to)}.`;
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
