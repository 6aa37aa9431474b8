// Words for one district's coverage and latest values, shared by the list row (visible and
// screen-reader text) and the region overview.
import type { DistrictSummary } from '@/contracts/districts';
import type { RegionEstimate } from '@/contracts/estimates';
import { STANDING_LABEL, gapShort, gapWords } from '@/lib/estimate-words';
import { countGapYears, formatYearCount, formatYearSpan } from '@/lib/format';
import { indicatorColumn } from '@/lib/indicators';

const emissions = indicatorColumn('emissions_pc');
const income = indicatorColumn('income_pc');

/**
 * Years covered. 'full': "1995–2025 · 30 years of data · 1 gap year". 'compact' (list rows,
 * where the span already implies the count): "1995–2025 · 1 gap year". "No data yet" when
 * the district has no observation.
 */
export function coverageText(
  d: Pick<DistrictSummary, 'firstYear' | 'lastYear' | 'nYears'>,
  form: 'full' | 'compact' = 'full',
): string {
  const span = formatYearSpan(d.firstYear, d.lastYear);
  if (span === null) return 'No data yet';
  const gaps = countGapYears(d.firstYear, d.lastYear, d.nYears);
  const parts = form === 'full' ? [span, formatYearCount(d.nYears)] : [span];
  if (gaps > 0) parts.push(`${gaps} ${gaps === 1 ? 'gap year' : 'gap years'}`);
  return parts.join(' · ');
}

export type LatestValue = { label: string; value: string | null; unit: string };

/** The latest emissions and income values, formatted, null where the year has none. */
export function latestValues(d: DistrictSummary): LatestValue[] {
  const latest = d.latest;
  return [emissions, income].map((column) => {
    const raw = latest ? latest[column.field] : null;
    return { label: column.short, value: raw === null ? null : column.format(raw), unit: column.shortUnit ?? '' };
  });
}

/** One sentence for screen readers: name, code, coverage and the latest values. */
export function districtRowLabel(d: DistrictSummary): string {
  const values = latestValues(d)
    .map((v) => `${v.label.toLowerCase()} ${v.value === null ? 'no data' : `${v.value}${v.unit ? ` ${v.unit}` : ''}`}`)
    .join(', ');
  const latest = d.latest ? ` Latest year ${d.latest.year}: ${values}.` : '';
  return `${d.name}, code ${d.code}. ${coverageText(d)}.${latest}`;
}

// ---- Published standing in the list row ---------------------------------------------------

/** The crossing column: "by 2031", "passed 2013", "off trend", or null. */
export function crossingShort(e: RegionEstimate | null | undefined): string | null {
  if (!e || e.projectionStatus === null || e.projectionStatus === 'no_threshold') return null;
  if (e.projectionStatus === 'not_on_current_trend') return 'off trend';
  if (e.crossingYear === null) return null;
  return e.projectionStatus === 'already_past' ? `passed ${e.crossingYear}` : `by ${e.crossingYear}`;
}

/** The gap column: "−18%", "+72%", "×4.0", or null without a threshold. */
export function gapColumn(e: RegionEstimate | null | undefined): string | null {
  if (!e || e.gapPercent === null || e.threshold === null || e.threshold <= 0) return null;
  return gapShort(e.gapPercent);
}

/** One sentence for screen readers: the row's standing, gap and crossing in words. */
export function standingSentence(e: RegionEstimate | null | undefined, level: number | null): string {
  if (!e) return 'No published estimate.';
  const parts = [STANDING_LABEL[e.standing]];
  if (e.status === 'substitute') parts.push('regional substitute');
  if (e.gapPercent !== null && e.threshold !== null && e.threshold > 0)
    parts.push(`income ${gapWords(e.gapPercent)} the threshold`);
  if (e.intervalBounded === false)
    parts.push(`interval not bounded${level ? ` at ${Math.round(level * 1000) / 10}%` : ''}`);
  const crossing = crossingShort(e);
  if (crossing === 'off trend') parts.push('not on current trend');
  else if (crossing?.startsWith('passed')) parts.push(`passed it around ${e.crossingYear}`);
  else if (crossing) parts.push(`projected to reach it around ${e.crossingYear}`);
  return `${parts.join(', ')}.`;
}
