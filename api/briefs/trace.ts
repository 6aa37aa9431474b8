/**
 * What every brief page says about where its numbers came from (run, publish date, data
 * version and hash, software version, generated on), and the model line.
 */
import type { BriefPaperSize, BriefSourceLine, BriefTrace, BriefTrack } from '../../contracts/briefs';
import type { PublishedRun } from '../estimates/service';
import { formatDateTime, formatLevelPercent, shortHash } from './format';
import { COVARIANCE_LABEL, inSentence, intervalMethodLabel } from './words';

export interface Indicator {
  name: string;
  unit: string;
  source?: string | null;
  licence?: string | null;
}

/** What a brief is built from besides the estimates: the run, the settings, the words for indicators. */
export interface BriefSource {
  run: PublishedRun;
  timeZone: string;
  paperSize: BriefPaperSize;
  /** the region's locale (BCP 47), default en-GB */
  locale?: string;
  generatedAt: Date;
  indicators: Map<string, Indicator>;
  /** the track the run belongs to */
  track?: BriefTrack;
}

export function traceOf(src: BriefSource): BriefTrace {
  const { run, timeZone } = src;
  const publishedAt = run.publishedAt ? formatDateTime(run.publishedAt, timeZone) : 'not published';
  const dataVersion = run.dataVersion === null ? 'unknown' : String(run.dataVersion);
  const dataHash = shortHash(run.dataHash);
  return {
    runId: run.id,
    publishedAt,
    publishedAtIso: run.publishedAt,
    dataVersion,
    dataHash,
    softwareVersion: run.softwareVersion,
    generatedAt: formatDateTime(src.generatedAt, timeZone),
    timeZone,
    locale: src.locale ?? 'en-GB',
    line: `Run #${run.id} · published ${publishedAt} · data version ${dataVersion} (hash ${dataHash}) · Crestwatch ${run.softwareVersion}`,
  };
}

export function indicatorOf(src: BriefSource, code: string): Indicator {
  return src.indicators.get(code) ?? { name: code, unit: '' };
}

/** The indicators the run's model reads (watched indicator, driver, controls), each with its source and licence. */
export function sourcesOf(src: BriefSource): BriefSourceLine[] {
  const { selection } = src.run.spec;
  const codes = [...new Set([selection.emissions, selection.driver, ...selection.controls])];
  return codes.map((code) => {
    const i = indicatorOf(src, code);
    const source = i.source ?? null;
    const licence = i.licence ?? null;
    const line = `${i.name}${i.unit ? ` (${i.unit})` : ''}: ${source ?? 'source not recorded'}; licence: ${licence ?? 'not recorded'}`;
    return { code, name: i.name, unit: i.unit, source, licence, line };
  });
}

/**
 * The sources as one sentence for print: indicators that share a source and licence are
 * named together, e.g. "PM2.5 … (µg/m³), real income per person (…): Demo region statistics
 * office (invented); licence: …".
 */
export function sourcesSentence(lines: BriefSourceLine[]): string {
  const groups = new Map<string, { source: string | null; licence: string | null; names: string[] }>();
  for (const l of lines) {
    const key = JSON.stringify([l.source, l.licence]);
    const g = groups.get(key) ?? { source: l.source, licence: l.licence, names: [] };
    g.names.push(
      `${groups.size === 0 && !g.names.length ? l.name : inSentence(l.name)}${l.unit ? ` (${l.unit})` : ''}`,
    );
    groups.set(key, g);
  }
  return [...groups.values()]
    .map((g) => `${g.names.join(', ')}: ${g.source ?? 'source not recorded'}; licence: ${g.licence ?? 'not recorded'}`)
    .join(' · ');
}

function list(words: string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

/** "Log–quadratic of CO2 emissions per person on real income per person, …" */
export function modelLine(src: BriefSource, opts: { pooled: boolean; lag?: number | null }): string {
  const { model, selection } = src.run.spec;
  const emissions = indicatorOf(src, selection.emissions);
  const driver = indicatorOf(src, selection.driver);
  const form = `${model.transform === 'log' ? 'Log–' : 'Level '}${model.form}`;
  const controls = selection.controls.length
    ? `, controlling for ${list(selection.controls.map((c) => inSentence(indicatorOf(src, c).name)))}`
    : '';
  const covariance = opts.pooled
    ? `district and year fixed effects, ${COVARIANCE_LABEL.cluster}`
    : `${COVARIANCE_LABEL[model.covariance] ?? model.covariance}${opts.lag ? ` (lag ${opts.lag})` : ''}`;
  const critical = model.criticalValue === 'normal' ? 'normal' : 't';
  const units = [
    driver.unit && `${inSentence(driver.name)} in ${driver.unit}`,
    emissions.unit && `${inSentence(emissions.name)} in ${emissions.unit}`,
  ]
    .filter(Boolean)
    .join(', ');
  return `${form} of ${inSentence(emissions.name)} on ${inSentence(driver.name)}${controls}; ${covariance}; ${formatLevelPercent(model.level)} ${intervalMethodLabel(model.intervalMethod)} intervals, ${critical} critical values, tests at α = ${model.alpha}; spec “${src.run.spec.name}”${units ? `; ${units}` : ''}.`;
}
