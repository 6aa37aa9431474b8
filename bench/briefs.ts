/**
 * npm run bench:briefs — how long a district brief and the region brief for 3,000
 * districts take to build and render, and the peak memory.
 *
 * No database: the renderer is fed EstimateRecords made by the engine itself (fitDistrict,
 * as a run chunk does) from 3,000 invented districts — the demo region's 24 series with
 * their income and emissions rescaled at random, each under a name of its own (some long,
 * some in Greek or Cyrillic) — and a previous run's summary rows with thresholds moved a
 * little, so the summary's "crossed" and "largest shifts" lists are filled. What is timed
 * is the brief content (api/briefs/*-content.ts) plus the PDF (api/briefs/pdf/*), i.e.
 * everything of a brief request but its SQL. The records are made in this process and
 * written to a temporary JSON file; a fresh child process reads them back (as a brief
 * request reads them from run_estimates) and does the timing, so its peak RSS is the
 * briefs' and not the fitting's.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import path from 'node:path';
import { generateDemoRegion } from '../api/demo/generate';
import { ModelSpec, type FitPanelResult } from '../api/estimation';
import { districtBriefContent } from '../api/briefs/district-content';
import { renderDistrictPdf } from '../api/briefs/pdf/district-pdf';
import { renderRegionPdf } from '../api/briefs/pdf/region-pdf';
import { regionBriefContent, type PooledFit } from '../api/briefs/region-content';
import { CHART_ONLY_FIELDS, type SummaryRecord } from '../api/briefs/store';
import type { BriefSource } from '../api/briefs/trace';
import type { DistrictSeries } from '../api/runs/data-store';
import { fitDistrict } from '../api/runs/district-fit';
import type { DistrictData, EstimateRecord } from '../api/runs/estimate-record';
import { fitPooled } from '../api/runs/jobs';
import type { EstimateListRow, RunRow, RunSpec } from '../api/runs/store';
import { DEFAULT_SPEC } from '../api/specs/schema';

const DISTRICTS = Number(process.env.BENCH_DISTRICTS ?? 3000);
const DISTRICT_REPEATS = 30;
const GOAL = { districtMs: 150, regionMs: 10_000, rssMb: 300 };

/** A small deterministic generator, so every run of the bench draws the same region. */
function random(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (s * 1664525 + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

const SYLLABLES = [
  'am',
  'ber',
  'lyn',
  'brack',
  'en',
  'moor',
  'cin',
  'der',
  'vale',
  'dun',
  'mar',
  'row',
  'fal',
  'low',
  'mere',
  'glen',
  'har',
  'hol',
  'lin',
  'iron',
  'beck',
  'kes',
  'trel',
  'holm',
  'larch',
  'moss',
  'nettle',
  'by',
  'ox',
  'marsh',
  'pel',
  'quar',
  'ren',
  'don',
  'rush',
  'lake',
  'salt',
  'grave',
  'thorn',
  'wood',
  'um',
  'vesper',
  'ton',
  'wynd',
  'combe',
];
const OTHER_SCRIPTS = [
  'Θεσσαλονίκη',
  'Όρμος',
  'Новгородская',
  'Слобода',
  'Łęczyca',
  'Şelé-Çamlık',
  'Ørsted',
  'Žďár',
  'Ηράκλειο',
  'Жарово',
];

function name(rnd: () => number, i: number): string {
  const word = () => {
    const n = 2 + Math.floor(rnd() * 2);
    const w = Array.from({ length: n }, () => SYLLABLES[Math.floor(rnd() * SYLLABLES.length)]).join('');
    return w.charAt(0).toUpperCase() + w.slice(1);
  };
  const parts = [word(), rnd() < 0.5 ? word() : ''];
  if (rnd() < 0.1) parts.push(`(${OTHER_SCRIPTS[Math.floor(rnd() * OTHER_SCRIPTS.length)]})`);
  if (rnd() < 0.03) parts.push('and the Outer Parishes of the Southern Estuary Joint District');
  return `${parts.filter(Boolean).join(' ')} ${i}`;
}

function inventRegion(): { series: DistrictSeries[] } {
  const demo = generateDemoRegion();
  const rnd = random(20261205);
  const base = demo.districts.map((d) => {
    const obs = demo.observations.filter((o) => o.districtCode === d.code);
    const years = [...new Set(obs.map((o) => o.year))].sort((a, b) => a - b);
    const get = (ind: string, y: number) => obs.find((o) => o.indicator === ind && o.year === y)!.value;
    return {
      years,
      x: years.map((y) => get('income_pc', y)),
      y: years.map((y) => get('emissions_pc', y)),
      density: years.map((y) => get('pop_density', y)),
    };
  });
  const series: DistrictSeries[] = [];
  for (let i = 0; i < DISTRICTS; i++) {
    const b = base[i % base.length];
    const fx = Math.exp((rnd() - 0.5) * 0.6);
    const fy = Math.exp((rnd() - 0.5) * 0.4);
    const data: DistrictData = {
      years: b.years,
      x: b.x.map((v) => Math.round(v * fx)),
      y: b.y.map((v) => Number((v * fy * Math.exp((rnd() - 0.5) * 0.04)).toFixed(4))),
      controls: { pop_density: b.density },
      droppedYears: [],
    };
    series.push({ districtId: i + 1, code: `B${String(i + 1).padStart(4, '0')}`, name: name(rnd, i + 1), data });
  }
  return { series };
}

function listRow(districtId: number, r: SummaryRecord, thresholdFactor = 1): EstimateListRow {
  return {
    districtId,
    code: r.code,
    name: r.name,
    status: r.status,
    standing: r.standing.standing,
    shape: r.shape?.shape ?? null,
    threshold: r.threshold?.level == null ? null : r.threshold.level * thresholdFactor,
    gapPercent: r.gapPercent,
    crossingYear: r.projection?.crossingYear ?? null,
    uTestRejects: r.uTest?.rejects ?? null,
    intervalBounded: r.standing.intervalBounded,
    lastYear: r.lastYear,
  };
}

const ms = (v: number) => `${v.toFixed(0)} ms`;
const mb = (kb: number) => `${(kb / 1024).toFixed(0)} MB`;

interface Prepared {
  spec: RunSpec;
  pooled: unknown;
  full: EstimateRecord & { code: string; name: string };
  records: SummaryRecord[];
  preparedMs: number;
}

function prepare(): Prepared {
  const t0 = performance.now();
  const { series } = inventRegion();
  const model = ModelSpec.parse({
    form: DEFAULT_SPEC.form,
    transform: DEFAULT_SPEC.transform,
    covariance: DEFAULT_SPEC.covariance,
    intervalMethod: DEFAULT_SPEC.intervalMethod,
    controls: DEFAULT_SPEC.controls,
    level: 0.95,
    alpha: 0.05,
  });
  const spec: RunSpec = {
    savedSpecId: 1,
    name: DEFAULT_SPEC.name,
    selection: {
      emissions: 'emissions_pc',
      driver: 'income_pc',
      controls: DEFAULT_SPEC.controls,
      firstYear: null,
      lastYear: null,
    },
    model,
  };
  const pooled = fitPooled(series.slice(0, 24), spec);
  const okPooled = pooled.status === 'ok' ? (pooled as FitPanelResult) : null;
  const records = series.map((s) => ({
    ...fitDistrict({ spec: model, controls: spec.selection.controls }, s.data, okPooled)[0],
    code: s.code,
    name: s.name,
  }));
  // The region brief reads its rows without the chart-only fields (api/briefs/store.ts);
  // the district brief reads one full record.
  const summaries = records.map(
    (r) =>
      Object.fromEntries(
        Object.entries(r).filter(([k]) => !(CHART_ONLY_FIELDS as readonly string[]).includes(k)),
      ) as SummaryRecord,
  );
  return { spec, pooled, full: records[0], records: summaries, preparedMs: performance.now() - t0 };
}

async function measure(file: string) {
  const { spec, pooled, full, records, preparedMs: prepared } = JSON.parse(readFileSync(file, 'utf8')) as Prepared;
  const cpu0 = process.cpuUsage();
  const now = new Date().toISOString();
  const run = {
    id: 2,
    specId: 1,
    spec,
    state: 'published',
    trigger: 'manual',
    reproducesRunId: null,
    dataVersion: 7,
    dataHash: 'b3c1e0f5a2d4'.padEnd(64, '0'),
    dataRows: 0,
    softwareVersion: 'bench',
    requestedBy: null,
    reviewedBy: null,
    chunksTotal: null,
    districtsTotal: records.length,
    pooled,
    timings: null,
    error: null,
    attempts: 1,
    createdAt: now,
    startedAt: now,
    finishedAt: now,
    publishedAt: now,
    discardedAt: null,
  } as RunRow;
  const src: BriefSource = {
    run,
    timeZone: 'Europe/Lisbon',
    paperSize: 'A4',
    generatedAt: new Date(),
    indicators: new Map([
      ['emissions_pc', { name: 'CO2 emissions per person', unit: 't CO2 per person' }],
      ['income_pc', { name: 'Real income per person', unit: 'constant 2020 currency units per person' }],
      ['pop_density', { name: 'Population density', unit: 'persons per km²' }],
    ]),
  };

  // One district brief: the first in the process (fonts parsed, code compiled), then warm.
  const one = full;
  const district = async () => {
    const s = performance.now();
    const c = process.cpuUsage();
    const pdf = await renderDistrictPdf(districtBriefContent(src, { code: one.code, name: one.name }, one, null));
    const used = process.cpuUsage(c);
    return { ms: performance.now() - s, cpuMs: (used.user + used.system) / 1000, bytes: pdf.length };
  };
  const first = await district();
  const runs: { ms: number; cpuMs: number }[] = [];
  for (let i = 0; i < DISTRICT_REPEATS; i++) runs.push(await district());
  const times = runs.map((r) => r.ms).sort((a, b) => a - b);
  const cpu = runs.map((r) => r.cpuMs).sort((a, b) => a - b);
  const median = times[Math.floor(times.length / 2)];
  const p95 = times[Math.floor(times.length * 0.95)];

  // The region brief for every district, against a previous run whose thresholds differ.
  const rnd = random(7);
  const previousRows = records.map((r, i) => listRow(i + 1, r, Math.exp((rnd() - 0.5) * 0.3)));
  for (let i = 0; i < previousRows.length; i += 37)
    previousRows[i].standing =
      previousRows[i].standing === 'past_turn'
        ? 'at_turn'
        : previousRows[i].standing === 'at_turn'
          ? 'approaching'
          : previousRows[i].standing;
  const r0 = performance.now();
  const c0 = process.cpuUsage();
  const content = regionBriefContent(
    src,
    {
      records,
      districts: records.map((r) => ({ code: r.code, name: r.name })),
      current: records.map((r, i) => listRow(i + 1, r)),
      previous: { runId: 1, rows: previousRows },
      shiftPercent: 10,
    },
    pooled as PooledFit,
  );
  const r1 = performance.now();
  const regionPdf = await renderRegionPdf(content);
  const r2 = performance.now();
  const regionCpu = process.cpuUsage(c0);
  const pages = (regionPdf.toString('latin1').match(/\/Type \/Page\b/g) ?? []).length;
  const rss = process.resourceUsage().maxRSS;

  const lines = [
    `bench:briefs — renderer fed engine-made records of ${records.length.toLocaleString('en-GB')} invented districts (no database; records made in ${ms(prepared)} in a parent process)`,
    `district brief: ${ms(median)} median (CPU ${ms(cpu[Math.floor(cpu.length / 2)])}), ${ms(p95)} p95 over ${DISTRICT_REPEATS} warm renders (${(first.bytes / 1024).toFixed(0)} KB); first in the process ${ms(first.ms)}, fonts parsed and code compiled (goal ≤ ${GOAL.districtMs} ms)`,
    `region brief: ${ms(r2 - r0)} for ${records.length.toLocaleString('en-GB')} districts (CPU ${ms((regionCpu.user + regionCpu.system) / 1000)}) — content ${ms(r1 - r0)}, PDF ${ms(r2 - r1)}; ${pages} pages, ${(regionPdf.length / 1024 / 1024).toFixed(2)} MB (goal ≤ ${GOAL.regionMs / 1000} s)`,
    `peak RSS of the process that read the records and made the briefs: ${mb(rss)} (goal < ${GOAL.rssMb} MB); CPU ${ms((process.cpuUsage(cpu0).user + process.cpuUsage(cpu0).system) / 1000)} in all`,
  ];
  lines.push(
    `load average while measuring: ${loadavg()
      .map((l) => l.toFixed(1))
      .join(', ')} on ${cpus().length} cores (wall times stretch when others run; CPU times do not)`,
  );
  process.stdout.write(`${lines.join('\n')}\n`);
}

async function main() {
  const file = process.env.BENCH_BRIEFS_RECORDS;
  if (file) return measure(file);
  const dir = mkdtempSync(path.join(tmpdir(), 'cw-bench-briefs-'));
  try {
    const records = path.join(dir, 'records.json');
    writeFileSync(records, JSON.stringify(prepare()));
    const child = spawnSync(process.execPath, [...process.execArgv, __filename], {
      stdio: 'inherit',
      env: { ...process.env, BENCH_BRIEFS_RECORDS: records },
    });
    if (child.status !== 0) throw new Error(`the measuring process exited with ${child.status}`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

main().catch((err) => {
  process.stderr.write(`${err.stack ?? err}\n`);
  process.exit(1);
});
