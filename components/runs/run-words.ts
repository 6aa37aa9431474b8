// Words for runs and their review: states, triggers, changes between published runs.
import type { Tone } from '@/components/theme';
import type { Shape, Standing } from '@/contracts/estimates';
import { formatLevel, SHAPE_LABEL, STANDING_LABEL } from '@/lib/estimate-words';
import type { ReviewRow, RunState } from '@/contracts/runs';

export const RUN_STATE: Record<RunState, { label: string; tone: Tone; meaning: string }> = {
  queued: { label: 'Queued', tone: 'neutral', meaning: 'Waiting for a worker to pick it up.' },
  running: {
    label: 'Running',
    tone: 'info',
    meaning: 'Fitting every district; estimates appear when it reaches review.',
  },
  in_review: {
    label: 'In review',
    tone: 'warning',
    meaning: 'Fitted. Nothing changes for officials until it is published.',
  },
  published: {
    label: 'Published',
    tone: 'success',
    meaning: 'What officials see; alerts went out when it was published.',
  },
  discarded: { label: 'Discarded', tone: 'neutral', meaning: 'Set aside: it changed nothing for officials.' },
  failed: { label: 'Failed', tone: 'danger', meaning: 'The run stopped; none of its estimates are shown.' },
};

export const TRIGGER_LABEL: Record<string, string> = {
  manual: 'Started by hand',
  schedule: 'Scheduled',
  reproduce: 'Reproduction',
};

export function standingWord(s: string | null | undefined): string {
  if (!s) return '—';
  return STANDING_LABEL[s as Standing] ?? s;
}

export function shapeWord(s: string | null | undefined): string {
  if (!s) return '—';
  return SHAPE_LABEL[s as Shape] ?? s;
}

/** "+12.4%", "−3.0%", "—". */
export function percentShort(p: number | null | undefined): string {
  if (p === null || p === undefined || !Number.isFinite(p)) return '—';
  const r = Math.round(p * 10) / 10;
  if (r === 0) return '0%';
  return `${r > 0 ? '+' : '−'}${Math.abs(r).toFixed(1)}%`;
}

/** A signed difference of income levels: "+1,204", "−860". */
export function levelDelta(d: number | null | undefined): string {
  if (d === null || d === undefined || !Number.isFinite(d)) return '—';
  const r = Math.round(d);
  if (r === 0) return '0';
  return `${r > 0 ? '+' : '−'}${formatLevel(Math.abs(r))}`;
}

export type ReviewFilter = 'all' | 'changed' | 'standing' | 'threshold' | 'shape' | 'significance';

export const REVIEW_FILTERS: { value: ReviewFilter; label: string }[] = [
  { value: 'all', label: 'All districts' },
  { value: 'changed', label: 'Any change' },
  { value: 'standing', label: 'Standing moved' },
  { value: 'threshold', label: 'Threshold moved' },
  { value: 'shape', label: 'Shape changed' },
  { value: 'significance', label: 'Turn test flipped' },
];

/** Whether a review row passes a filter; "threshold moved" means more than `shiftPercent` either way. */
export function matchesReviewFilter(row: ReviewRow, filter: ReviewFilter, shiftPercent: number): boolean {
  const c = row.change;
  const moved = c.thresholdPercent !== null && Math.abs(c.thresholdPercent) > shiftPercent;
  switch (filter) {
    case 'all':
      return true;
    case 'changed':
      return c.standingChanged || moved || c.shapeChanged || c.significanceChanged;
    case 'standing':
      return c.standingChanged;
    case 'threshold':
      return moved;
    case 'shape':
      return c.shapeChanged;
    case 'significance':
      return c.significanceChanged;
  }
}

/** Districts whose name or code contains every word of the query (case-insensitive). */
export function matchesReviewSearch(row: ReviewRow, query: string): boolean {
  const words = query.toLocaleLowerCase('en').split(/\s+/).filter(Boolean);
  const hay = `${row.name} ${row.code}`.toLocaleLowerCase('en');
  return words.every((w) => hay.includes(w));
}
