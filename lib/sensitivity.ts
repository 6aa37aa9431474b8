// The sensitivity strip's rows: the threshold under the spec and its published variants,
// each with its interval, on one shared log scale so fragility shows at a glance.
import type { EstimateRecord, FiellerKind, VariantName, VariantSummary } from '@/contracts/estimates';
import { formatLevel, intervalText, notBoundedText, VARIANT_LABEL, VARIANT_ORDER } from './estimate-words';

export type SensitivityRow = {
  key: 'main' | VariantName;
  label: string;
  threshold: number | null;
  /** Bounded interval ends; null when the interval is not bounded (or there is none). */
  lo: number | null;
  hi: number | null;
  kind: FiellerKind | null;
  bounded: boolean;
  /** What to print beside the row. */
  text: string;
};

function textOf(
  threshold: number | null,
  bounded: boolean,
  kind: FiellerKind | null,
  lo: number | null,
  hi: number | null,
  level: number,
  reason: string | null,
): string {
  if (threshold === null || !(threshold > 0))
    return reason ? `no threshold (${reason.replace(/\.$/, '')})` : 'no positive threshold';
  const point = formatLevel(threshold);
  if (bounded && lo !== null && hi !== null) return `${point} (${formatLevel(lo)}–${formatLevel(hi)})`;
  return `${point}; ${notBoundedText(level)}${kind ? ` (${intervalText(kind, lo, hi)})` : ''}`;
}

export function sensitivityRows(main: EstimateRecord, variants: VariantSummary[]): SensitivityRow[] {
  const level = main.model.level;
  const mainThreshold = main.threshold?.level ?? null;
  const mainBounded = main.standing.intervalBounded === true;
  const rows: SensitivityRow[] = [
    {
      key: 'main',
      label: main.status === 'substitute' ? 'Published (regional substitute)' : 'Published spec',
      threshold: mainThreshold,
      lo: main.standing.levelLo,
      hi: main.standing.levelHi,
      kind: main.threshold?.fieller.kind ?? null,
      bounded: mainBounded,
      text: textOf(
        mainThreshold,
        mainBounded,
        main.threshold?.fieller.kind ?? null,
        main.standing.levelLo,
        main.standing.levelHi,
        level,
        main.reason?.message ?? null,
      ),
    },
  ];
  for (const name of VARIANT_ORDER) {
    const v = variants.find((x) => x.variant === name);
    if (!v) continue;
    const bounded = v.intervalBounded === true;
    rows.push({
      key: name,
      label: VARIANT_LABEL[name],
      threshold: v.threshold,
      lo: v.thresholdLo,
      hi: v.thresholdHi,
      kind: v.fiellerKind,
      bounded,
      text:
        v.status === 'not_estimable'
          ? `not estimable${v.reason ? ` (${v.reason.message.replace(/\.$/, '')})` : ''}`
          : textOf(v.threshold, bounded, v.fiellerKind, v.thresholdLo, v.thresholdHi, level, null),
    });
  }
  return rows;
}

/** One log scale for every row: all positive points and bounded ends, within ×4 of the spec's. */
export function stripDomain(rows: SensitivityRow[], now: number | null): [number, number] | null {
  const values: number[] = [];
  for (const r of rows) {
    if (r.threshold !== null && r.threshold > 0) values.push(r.threshold);
    if (r.bounded && r.lo !== null && r.lo > 0) values.push(r.lo);
    if (r.bounded && r.hi !== null && r.hi > 0) values.push(r.hi);
  }
  if (now !== null && now > 0) values.push(now);
  if (values.length === 0) return null;
  const anchor = rows[0].threshold && rows[0].threshold > 0 ? rows[0].threshold : (now ?? values[0]);
  const lo = Math.max(Math.min(...values), anchor / 4);
  const hi = Math.min(Math.max(...values), anchor * 4);
  return hi > lo ? [lo / 1.1, hi * 1.1] : [lo / 2, hi * 2];
}

/** Position (0–1) of v on the strip's log scale, clamped. */
export function stripPosition(v: number, [a, b]: [number, number]): number {
  const t = (Math.log(v) - Math.log(a)) / (Math.log(b) - Math.log(a));
  return Math.min(1, Math.max(0, t));
}
