/**
 * What officials already saw, against a reproduction of the same run: the districts whose
 * published answer (threshold, its interval, standing) differs when the run is redone with
 * the current software on the same data version. The review screen lists them, naming the
 * software change, so a correction in the engine is never silent.
 */
import type { Knex } from 'knex';
import type { EstimateRecord } from './estimate-record';
import { estimateRecords, findRun } from './store';

export type AnswerField = 'status' | 'threshold' | 'interval' | 'standing';

export interface AnswerSnapshot {
  status: string;
  standing: string;
  threshold: number | null;
  intervalLo: number | null;
  intervalHi: number | null;
}

export interface AnswerChange {
  code: string;
  name: string;
  fields: AnswerField[];
  before: AnswerSnapshot | null;
  after: AnswerSnapshot | null;
}

/** Relative difference below which two published figures are the same answer (printed figures carry 3–4 digits). */
export const SAME_FIGURE = 1e-9;

function snapshot(r: EstimateRecord): AnswerSnapshot {
  return {
    status: r.status,
    standing: r.standing.standing,
    threshold: r.threshold?.level ?? null,
    intervalLo: r.standing.levelLo,
    intervalHi: r.standing.levelHi,
  };
}

function sameFigure(a: number | null, b: number | null): boolean {
  if (a === null || b === null) return a === b;
  return Math.abs(a - b) <= SAME_FIGURE * Math.max(Math.abs(a), Math.abs(b));
}

/**
 * Districts whose main answer differs between a published run and its reproduction,
 * in code order. A district present in only one of them is listed with the other side null.
 *
 * Example: answerChanges([{ code: 'D01', … threshold 22058 }], [{ code: 'D01', … threshold 24952 }])
 *   // → [{ code: 'D01', fields: ['threshold'], before: { threshold: 22058, … }, after: { threshold: 24952, … } }]
 */
export function answerChanges(
  published: ReadonlyArray<EstimateRecord & { code: string; name: string }>,
  reproduced: ReadonlyArray<EstimateRecord & { code: string; name: string }>,
): AnswerChange[] {
  const after = new Map(reproduced.map((r) => [r.code, r]));
  const out: AnswerChange[] = [];
  const seen = new Set<string>();
  for (const p of published) {
    seen.add(p.code);
    const r = after.get(p.code);
    const before = snapshot(p);
    if (!r) {
      out.push({ code: p.code, name: p.name, fields: ['status'], before, after: null });
      continue;
    }
    const now = snapshot(r);
    const fields: AnswerField[] = [];
    if (before.status !== now.status) fields.push('status');
    if (!sameFigure(before.threshold, now.threshold)) fields.push('threshold');
    if (!sameFigure(before.intervalLo, now.intervalLo) || !sameFigure(before.intervalHi, now.intervalHi))
      fields.push('interval');
    if (before.standing !== now.standing) fields.push('standing');
    if (fields.length > 0) out.push({ code: p.code, name: p.name, fields, before, after: now });
  }
  for (const r of reproduced)
    if (!seen.has(r.code))
      out.push({ code: r.code, name: r.name, fields: ['status'], before: null, after: snapshot(r) });
  return out.sort((a, b) => (a.code < b.code ? -1 : a.code > b.code ? 1 : 0));
}

/**
 * The dated notice a district's card and brief carry while the latest published run is a
 * reproduction, on newer software, of an earlier run and this district's answer changed
 * ("threshold corrected in software version …"). It lasts until the next publish, because
 * only the latest published run is ever read.
 *
 * Example: → { softwareVersion: '0.2.0', previousSoftware: '0.1.0', date: '2026-12-04', fields: ['threshold'],
 *   text: 'Threshold corrected in software version 0.2.0 on 2026-12-04 (first published with version 0.1.0).' }
 */
export async function correctionNotice(db: Knex, runId: number, districtId: number): Promise<CorrectionNotice | null> {
  const run = await findRun(db, runId);
  if (!run?.reproducesRunId || !run.publishedAt) return null;
  const original = await findRun(db, run.reproducesRunId);
  if (!original || original.softwareVersion === run.softwareVersion) return null;
  const [before, after] = await Promise.all([
    estimateRecords(db, original.id, districtId),
    estimateRecords(db, run.id, districtId),
  ]);
  const b = before.find((r) => r.variant === 'main');
  const a = after.find((r) => r.variant === 'main');
  if (!b || !a) return null;
  const [change] = answerChanges([{ ...b, code: '', name: '' }], [{ ...a, code: '', name: '' }]);
  if (!change) return null;
  const date = run.publishedAt.slice(0, 10);
  const what = change.fields.includes('threshold')
    ? 'Threshold'
    : change.fields.includes('interval')
      ? 'Threshold interval'
      : 'Standing';
  return {
    softwareVersion: run.softwareVersion,
    previousSoftware: original.softwareVersion,
    date,
    fields: change.fields,
    text: `${what} corrected in software version ${run.softwareVersion} on ${date} (first published with version ${original.softwareVersion}).`,
  };
}

export interface CorrectionNotice {
  softwareVersion: string;
  previousSoftware: string;
  /** the day the corrected run was published (YYYY-MM-DD) */
  date: string;
  fields: AnswerField[];
  text: string;
}
