/**
 * What changed for one district between two published runs, and the alerts that follow
 * (docs/method.md): `crossing` when the standing moved between approaching, at_turn and
 * past_turn (either way); `threshold_shift` when X* in real units moved more than the set
 * percent; `shape_change`; `significance_change` when the U-test's verdict at α flipped.
 */
import { ALERT_KINDS, type AlertKind } from '../common/alert-kinds';

export { ALERT_KINDS, type AlertKind };

const TURN_STANDINGS = new Set(['approaching', 'at_turn', 'past_turn']);

export interface DistrictChange {
  thresholdPercent: number | null;
  standingChanged: boolean;
  shapeChanged: boolean;
  significanceChanged: boolean;
}

/** The columns of a district's main estimate that two runs are compared on. */
export interface Summary {
  standing: string;
  shape: string | null;
  threshold: number | null;
  uTestRejects: boolean | null;
}

export function districtChange(prev: Summary | null, next: Summary): DistrictChange {
  if (!prev) return { thresholdPercent: null, standingChanged: false, shapeChanged: false, significanceChanged: false };
  const thresholdPercent =
    prev.threshold !== null && next.threshold !== null && prev.threshold > 0
      ? 100 * (next.threshold / prev.threshold - 1)
      : null;
  return {
    thresholdPercent,
    standingChanged: prev.standing !== next.standing,
    shapeChanged: prev.shape !== null && next.shape !== null && prev.shape !== next.shape,
    significanceChanged:
      prev.uTestRejects !== null && next.uTestRejects !== null && prev.uTestRejects !== next.uTestRejects,
  };
}

export interface AlertDraft {
  kind: AlertKind;
  details: Record<string, unknown>;
}

export function alertsFor(prev: Summary | null, next: Summary, shiftPercent: number): AlertDraft[] {
  if (!prev) return [];
  const c = districtChange(prev, next);
  const out: AlertDraft[] = [];
  if (c.standingChanged && TURN_STANDINGS.has(prev.standing) && TURN_STANDINGS.has(next.standing)) {
    out.push({ kind: 'crossing', details: { from: prev.standing, to: next.standing } });
  }
  if (c.thresholdPercent !== null && Math.abs(c.thresholdPercent) > shiftPercent) {
    out.push({
      kind: 'threshold_shift',
      details: { from: prev.threshold, to: next.threshold, percent: c.thresholdPercent, limitPercent: shiftPercent },
    });
  }
  if (c.shapeChanged) out.push({ kind: 'shape_change', details: { from: prev.shape, to: next.shape } });
  if (c.significanceChanged)
    out.push({ kind: 'significance_change', details: { from: prev.uTestRejects, to: next.uTestRejects } });
  return out;
}
