/**
 * The content of the region brief, from a published run: counts per standing, the
 * districts that crossed since the previous published run and the largest threshold
 * shifts (the same comparison the alerts use, api/alerts/compare.ts), the regional pooled
 * curve, and one table row per district. Pure.
 */
import type { BriefFigure, RegionBriefContent, RegionBriefRow } from '../../contracts/briefs';
import { alertsFor, districtChange } from '../alerts/compare';
import type { EstimateListRow } from '../estimates/service';
import { pooledChart, type ThresholdMark } from './chart-scene';
import { gapText, projectionTexts, thresholdTexts, thresholdTextsOf } from './figures';
import {
  formatCount,
  formatDate,
  formatLevel,
  formatLevelPercent,
  formatShiftLimit,
  formatSignedPercent,
  turnTestWords,
} from './format';
import type { SummaryRecord } from './store';
import { indicatorOf, modelLine, sourcesOf, traceOf, type BriefSource } from './trace';
import { CAUTIONS, inSentence, shapeLabel, STANDING_LABEL, STANDING_ORDER, STANDING_SHORT } from './words';

export const REGION_PDF_PATH = '/api/briefs/region.pdf';
/** At most this many threshold shifts are listed (the largest first; the rest are in the table). */
export const SHIFTS_LISTED = 8;
export const POOLED_CHART = { width: 515, height: 190 };

/** The pooled fit as the run stores it (the parts a brief reads). */
export interface PooledFit {
  status: string;
  n?: number;
  districts?: number;
  terms?: string[];
  coefficients?: number[];
  range?: { levelMin: number; levelMax: number };
  shape?: { shape: string; notes?: string[] };
  uTest?: { pValue: number | null; rejects: boolean };
  model?: { form: string; transform: string; level: number; alpha: number; intervalMethod: string };
  turningPoints?: {
    level: number | null;
    kind: string;
    delta: { levelLo: number | null; levelHi: number | null };
    fieller: { kind: string; levelLo: number | null; levelHi: number | null };
  }[];
  message?: string;
}

export interface RegionInput {
  records: SummaryRecord[];
  /** every district of the region, for those the run has no estimate of */
  districts: { code: string; name: string }[];
  /** this run's and the previous published run's summary rows (null: no previous run) */
  current: EstimateListRow[];
  previous: { runId: number; rows: EstimateListRow[] } | null;
  shiftPercent: number;
}

function pooledPart(src: BriefSource, pooled: PooledFit | null): RegionBriefContent['pooled'] {
  if (!pooled || pooled.status !== 'ok' || !pooled.coefficients || !pooled.terms || !pooled.range || !pooled.model) {
    return {
      figures: [],
      chart: null,
      note: `No regional pooled curve in this run${pooled?.message ? `: ${pooled.message}` : ''}.`,
    };
  }
  const m = pooled.model.form === 'cubic' ? 3 : 2;
  const tp = pooled.turningPoints?.[0] ?? null;
  const th = thresholdTextsOf(tp, pooled.model.intervalMethod, pooled.model.level);
  const level = formatLevelPercent(pooled.model.level);
  const driver = indicatorOf(src, src.run.spec.selection.driver);
  const mark: ThresholdMark | null =
    tp && tp.level !== null && Number.isFinite(tp.level) ? { level: tp.level, band: th.band } : null;
  const figures: BriefFigure[] = [
    { key: 'threshold', label: 'Regional threshold', value: th.value, detail: th.detail },
    {
      key: 'shape',
      label: 'Shape over the observed range',
      value: shapeLabel(pooled.shape?.shape ?? null, formatLevelPercent(pooled.model.alpha)),
      detail:
        pooled.uTest?.pValue !== null && pooled.uTest?.pValue !== undefined
          ? turnTestWords(pooled.uTest.pValue, pooled.uTest.rejects, pooled.model.alpha)
          : null,
    },
    {
      key: 'sample',
      label: 'Pooled sample',
      value: `${formatCount(pooled.n ?? 0)} district-years`,
      detail: `${formatCount(pooled.districts ?? 0)} districts; ${inSentence(driver.name)} ${formatLevel(pooled.range.levelMin)} to ${formatLevel(pooled.range.levelMax)}`,
    },
  ];
  const chart = pooledChart({
    ...POOLED_CHART,
    transform: pooled.model.transform,
    slopes: pooled.coefficients.slice(0, m),
    levelMin: pooled.range.levelMin,
    levelMax: pooled.range.levelMax,
    threshold: mark,
    levelText: level,
    xLabel:
      driver.unit && driver.name.length + driver.unit.length <= 42 ? `${driver.name} (${driver.unit})` : driver.name,
    pressure: inSentence(indicatorOf(src, src.run.spec.selection.emissions).name),
  });
  return {
    figures,
    chart,
    note: 'The pooled curve stands in for districts whose own series is too short; fixed effects absorb each district’s level, so it is drawn as an index.',
  };
}

function tableRow(r: SummaryRecord): RegionBriefRow {
  const th = thresholdTexts(r);
  return {
    code: r.code,
    name: r.status === 'substitute' ? `${r.name} (regional curve)` : r.name,
    standing: STANDING_SHORT[r.standing.standing] ?? r.standing.standing,
    gap: th.value === 'none' ? '—' : gapText(r),
    threshold: th.value,
    interval: th.interval,
    crossing: projectionTexts(r).short,
  };
}

export function regionBriefContent(src: BriefSource, input: RegionInput, pooled: PooledFit | null): RegionBriefContent {
  const counts = new Map<string, number>();
  for (const r of input.records) counts.set(r.standing.standing, (counts.get(r.standing.standing) ?? 0) + 1);
  const estimated = new Set(input.records.map((r) => r.code));
  const missing = input.districts.filter((d) => !estimated.has(d.code));
  const countList: RegionBriefContent['counts'] = STANDING_ORDER.map((key) => ({
    key,
    label: STANDING_LABEL[key],
    count: counts.get(key) ?? 0,
  }));
  if (missing.length) countList.push({ key: 'not_in_run', label: 'Not in this run (no data)', count: missing.length });

  let crossed: RegionBriefContent['crossed'] = [];
  let shifts: RegionBriefContent['shifts'] = [];
  let crossedNote: string | null = null;
  let shiftsNote: string | null = null;
  if (!input.previous) {
    crossedNote = 'This is the first published run: there is nothing to compare with.';
    shiftsNote = crossedNote;
  } else {
    const prevById = new Map(input.previous.rows.map((p) => [p.districtId, p]));
    const moves: { row: EstimateListRow; percent: number; from: number; to: number }[] = [];
    for (const row of input.current) {
      const prev = prevById.get(row.districtId) ?? null;
      if (!prev) continue;
      for (const a of alertsFor(prev, row, input.shiftPercent)) {
        if (a.kind === 'crossing') {
          crossed.push({
            code: row.code,
            name: row.name,
            text: `${STANDING_LABEL[String(a.details.from)] ?? a.details.from} → ${STANDING_LABEL[String(a.details.to)] ?? a.details.to}`,
          });
        }
      }
      const c = districtChange(prev, row);
      if (c.thresholdPercent !== null && Number.isFinite(c.thresholdPercent))
        moves.push({ row, percent: c.thresholdPercent, from: prev.threshold!, to: row.threshold! });
    }
    // A list of changes shows only changes: the thresholds that moved more than the alert
    // setting (the same rule as the threshold_shift alert, api/alerts/compare.ts).
    moves.sort((a, b) => Math.abs(b.percent) - Math.abs(a.percent) || a.row.code.localeCompare(b.row.code));
    const movedEnough = moves.filter((m) => Math.abs(m.percent) > input.shiftPercent);
    shifts = movedEnough.slice(0, SHIFTS_LISTED).map((m) => ({
      code: m.row.code,
      name: m.row.name,
      text: `${formatLevel(m.from)} → ${formatLevel(m.to)} (${formatSignedPercent(m.percent)})`,
      overLimit: Math.abs(m.percent) > input.shiftPercent,
    }));
    if (!crossed.length)
      crossedNote = `No district crossed into or out of its threshold band since run #${input.previous.runId}.`;
    if (!moves.length) shiftsNote = `No threshold to compare with run #${input.previous.runId}.`;
    else if (!shifts.length)
      shiftsNote = `No district’s threshold moved more than ${formatShiftLimit(input.shiftPercent)} since run #${input.previous.runId}.`;
    else
      shiftsNote = `Thresholds that moved more than ${formatShiftLimit(input.shiftPercent)} (the alert setting) since run #${input.previous.runId}.`;
    crossed = crossed.sort((a, b) => a.code.localeCompare(b.code));
  }

  const rows = [
    ...input.records.map(tableRow),
    ...missing.map((d) => ({
      code: d.code,
      name: d.name,
      standing: 'Not in run',
      gap: '—',
      threshold: '—',
      interval: '—',
      crossing: '—',
    })),
  ].sort((a, b) => a.code.localeCompare(b.code));
  const total = input.records.length + missing.length;
  const parts = countList.filter((c) => c.count > 0).map((c) => `${formatCount(c.count)} ${c.label.toLowerCase()}`);
  return {
    kind: 'region',
    ...(src.track ? { track: src.track } : {}),
    sources: sourcesOf(src),
    subtitle: `Region brief${src.track ? ` · ${src.track.name}` : ''} · published run #${src.run.id}${src.run.publishedAt ? ` of ${formatDate(src.run.publishedAt, src.timeZone)}` : ''}`,
    headline: `${formatCount(total)} districts in this run: ${parts.join(', ')}.`,
    counts: countList,
    crossed,
    crossedNote,
    shifts,
    shiftsNote,
    pooled: pooledPart(src, pooled),
    table: {
      columns: [
        { key: 'code', label: 'Code' },
        { key: 'name', label: 'District' },
        { key: 'standing', label: 'Standing' },
        { key: 'gap', label: 'Gap' },
        { key: 'threshold', label: 'Threshold' },
        { key: 'interval', label: `${formatLevelPercent(src.run.spec.model.level)} interval` },
        { key: 'crossing', label: 'Crossing year' },
      ],
      rows,
    },
    modelLine: modelLine(src, { pooled: false }),
    cautions: [...CAUTIONS],
    trace: traceOf(src),
    paperSize: src.paperSize,
    pdfPath: src.track ? `${REGION_PDF_PATH}?track=${encodeURIComponent(src.track.code)}` : REGION_PDF_PATH,
  };
}
