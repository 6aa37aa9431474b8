// The card's model line and its figures' words (form, covariance, n, years, run, data).
import type { EstimateRecord, PublishedRunMeta } from '@/contracts/estimates';
import { COVARIANCE_LABEL, levelPercent, METHOD_LABEL } from './estimate-words';
import { formatDate } from './format-time';

const CONTROL_LABEL: Record<string, string> = {
  pop_density: 'population density',
  population: 'population',
  industry_share: 'industry share',
  trade_openness: 'trade openness',
};

export function controlLabel(code: string): string {
  return CONTROL_LABEL[code] ?? code.replace(/_/g, ' ');
}

/** "Quadratic in logs · Newey–West (lag 3) · controls: population density · n = 31, 1995–2025". */
export function modelLine(r: EstimateRecord): string {
  const m = r.model;
  const form = `${m.form === 'cubic' ? 'Cubic' : 'Quadratic'} ${m.transform === 'log' ? 'in logs' : 'in levels'}`;
  const cov = COVARIANCE_LABEL[m.covariance] ?? m.covariance;
  const covText = m.covariance === 'newey_west' && m.lag !== null ? `${cov} errors (lag ${m.lag})` : `${cov} errors`;
  const controls = m.controls.length ? `controls: ${m.controls.map(controlLabel).join(', ')}` : 'no controls';
  const years = r.firstYear !== null && r.lastYear !== null ? `, ${r.firstYear}–${r.lastYear}` : '';
  const intervals = `${levelPercent(m.level)} ${METHOD_LABEL[m.intervalMethod]} intervals`;
  return [form, covText, controls, `n = ${r.n}${years}`, intervals].join(' · ');
}

/** "Run #4, published 2 Oct 2026 · spec “Regional default” · data version 3 · software 0.1.0". */
export function runLine(run: PublishedRunMeta): string {
  const day = formatDate(run.publishedAt, 'UTC');
  return `Run #${run.id}, published ${day} · spec “${run.specName}” · data version ${run.dataVersion} · software ${run.softwareVersion}`;
}

/** The run's model in one line, for the region view: "Quadratic in logs · Newey–West errors · 95% Fieller intervals". */
export function modelLineOfRun(run: PublishedRunMeta): string {
  const m = run.model;
  const form = `${m.form === 'cubic' ? 'Cubic' : 'Quadratic'} ${m.transform === 'log' ? 'in logs' : 'in levels'}`;
  const controls = m.controls.length ? `controls: ${m.controls.map(controlLabel).join(', ')}` : 'no controls';
  return [
    form,
    `${COVARIANCE_LABEL[m.covariance] ?? m.covariance} errors`,
    controls,
    `${levelPercent(m.level)} ${METHOD_LABEL[m.intervalMethod]} intervals`,
  ].join(' · ');
}
