/**
 * The upload rules: read and check a file into staging, preview it (a dry run in a
 * transaction that is rolled back) or commit it (the same checks, then the merge, in one
 * transaction: any error and nothing is written), commit a kept preview later, and a
 * re-upload of a committed file is a no-op.
 */
import fs from 'node:fs';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Knex } from 'knex';
import type { PoolClient } from 'pg';
import { AppError, NotFoundError } from '../http/errors';
import { dropEvaluationViews, evaluateStaged, type Columns, type Evaluation } from './evaluate-store';
import { applyChanges, type ChangeTable } from './merge-store';
import { UploadReader, type CatalogueEntry, type ReadSummary } from './parse/upload-reader';
import { buildPreview, DISTRICT_ORDER, PREVIEW_LIST_CAP, summaryOf, type Preview, type UploadSummary } from './present';
import { ProblemList, summarise, type Problem } from './problems';
import { ProgressTracker } from './progress';
import type { UploadOptions } from './schema';
import { inTransaction, lockObservations, withConnection, type Sql } from '../db/connection';
import * as staging from './staging-store';
import * as store from './store';
import type { UploadStop } from '../../contracts/uploads';

export interface Who {
  id: number | null;
  email: string | null;
}

export interface ReceivedFile {
  path: string;
  originalName: string;
  size: number;
  checksum: string;
}

export type UploadAnswer =
  | {
      noop: false;
      upload: UploadSummary;
      preview: Preview;
      problems: Problem[];
      problemsTruncated: boolean;
      timings: Timings;
    }
  | { noop: true; upload: UploadSummary; message: string };

/** Where the time went (milliseconds), for the analyst's curiosity and the ingest bench. */
export interface Timings {
  /** Receiving the multipart body into the temp file (set by the route). */
  receiveMs?: number;
  /** Reading, checking each row and COPYing the staging rows. */
  readMs?: number;
  /** The set-based checks against the stored data. */
  checkMs?: number;
  /** Writing history and observations. */
  mergeMs?: number;
  /** The merge dropped and re-created observations' keys around a large insert. */
  bulkPath?: boolean;
}

async function timed<T>(timings: Timings, key: 'readMs' | 'checkMs' | 'mergeMs', fn: () => Promise<T>): Promise<T> {
  const t0 = performance.now();
  try {
    return await fn();
  } finally {
    timings[key] = Math.round(performance.now() - t0);
  }
}

export class UploadRejected extends AppError {
  constructor(problems: ProblemList, uploadId: number | null, preview: Preview | null, stoppedAt?: UploadStop) {
    const listed = problems.sorted();
    super(422, 'upload_rejected', `The file was not loaded. ${summarise(listed, problems.errors, problems.warnings)}`, {
      uploadId,
      problems: listed,
      errorCount: problems.errors,
      warningCount: problems.warnings,
      truncated: problems.truncated,
      preview,
      ...(stoppedAt ? { stoppedAt } : {}),
    });
  }
}

/** What an upload writes: changed cells, new cells, derived cells. */
const CHANGE_SETS = {
  changed: { table: 'upload_eval', writer: '$1::int', historyKinds: ['c'] },
  fresh: { table: 'upload_new', writer: '$1::int', historyKinds: [] },
  derived: { table: 'upload_derived', writer: '$1::int', historyKinds: ['c', 'r'] },
} satisfies Record<string, ChangeTable>;

/** `maxNewDistricts`: more new district codes in one file stop the read (UPLOAD_MAX_NEW_DISTRICTS). */
export async function receiveUpload(
  db: Knex,
  file: ReceivedFile,
  options: UploadOptions & { commit: boolean; maxNewDistricts?: number },
  who: Who,
  now = new Date(),
  progress = new ProgressTracker(null, who.id, { bytesTotal: file.size, commit: options.commit }),
): Promise<UploadAnswer> {
  return withConnection(db, async (conn) => {
    await staging.pruneStaging(conn, now);
    const done = await store.findCommittedByChecksum(conn, file.checksum);
    if (done) return noop(done);

    const name = staging.newStagingName(now);
    const t = await staging.createStaging(conn, name);
    let keep = false;
    const timings: Timings = {};
    try {
      const problems = new ProblemList();
      const read = await timed(timings, 'readMs', () =>
        readIntoStaging(conn, t, file, options, problems, now, progress),
      );
      const base: store.NewUpload = {
        kind: 'file',
        status: 'failed',
        fileName: file.originalName,
        checksum: file.checksum,
        byteSize: file.size,
        format: read.format,
        options: {
          allowNewDistricts: options.allowNewDistricts,
          decimalComma: options.decimalComma,
          changeFactor: options.changeFactor,
        },
        userId: who.id,
        userEmail: who.email,
        counts: { rowsRead: read.rowsRead, values: read.values },
      };
      if (read.fatal || !read.columns) {
        const failed = await store.insertUpload(conn, {
          ...base,
          counts: { ...base.counts, errors: problems.errors, warnings: problems.warnings },
          problems: problems.sorted(),
        });
        throw new UploadRejected(problems, failed.id, null, progress.stopPoint(problems.sorted()));
      }
      const columns = read.columns;
      const outcome = options.commit
        ? await commitStaged(conn, t, read, columns, options, problems, base, null, timings, progress)
        : await previewStaged(conn, t, read, columns, options, problems, timings, progress);
      if (outcome.kind === 'noop') return noop(outcome.upload);
      if (problems.errors > 0) {
        const failed = await store.insertUpload(conn, {
          ...base,
          counts: { ...base.counts, ...outcome.counts, errors: problems.errors, warnings: problems.warnings },
          preview: outcome.preview,
          problems: problems.sorted(),
        });
        throw new UploadRejected(problems, failed.id, outcome.preview, progress.stopPoint(problems.sorted()));
      }
      if (outcome.kind === 'committed') {
        return {
          noop: false,
          upload: summaryOf(outcome.upload),
          preview: outcome.preview,
          problems: problems.sorted(),
          problemsTruncated: problems.truncated,
          timings,
        };
      }
      const preview = {
        ...outcome.preview,
        expiresAt: new Date(now.getTime() + staging.STAGING_TTL_HOURS * 3600_000).toISOString(),
      };
      const saved = await store.insertUpload(conn, {
        ...base,
        status: 'previewed',
        counts: { ...base.counts, ...outcome.counts, errors: 0, warnings: problems.warnings },
        // The header's columns are kept with a preview so it can be committed later.
        preview: { ...preview, columns },
        problems: problems.sorted(),
        stagingTable: name,
      });
      keep = true;
      return {
        noop: false,
        upload: summaryOf(saved),
        preview,
        problems: problems.sorted(),
        problemsTruncated: problems.truncated,
        timings,
      };
    } finally {
      if (!keep) await staging.dropStaging(conn, name);
    }
  });
}

/** Commits a kept preview: the checks run again against the data as it is now. */
export async function commitPreviewed(
  db: Knex,
  id: number,
  who: Who,
  progress = new ProgressTracker(null, who.id, { bytesTotal: 0, commit: true, phase: 'checking' }),
): Promise<UploadAnswer> {
  return withConnection(db, async (conn) => {
    const u = await store.findUpload(conn, id);
    if (!u || u.kind !== 'file') throw new NotFoundError(`No upload ${id}`, { id });
    if (u.status === 'committed')
      throw new AppError(409, 'already_committed', `Upload ${id} is already committed.`, { id });
    if (u.status !== 'previewed')
      throw new AppError(409, 'not_previewed', `Upload ${id} is ${u.status}; only a preview can be committed.`, {
        id,
        status: u.status,
      });
    if (!u.stagingTable) {
      throw new AppError(
        410,
        'preview_expired',
        `The staged rows of upload ${id} were dropped after ${staging.STAGING_TTL_HOURS} hours: upload the file again.`,
        { id },
      );
    }
    const t = staging.stagingTables(u.stagingTable);
    const prior = u.preview as (Preview & { columns?: Columns }) | null;
    const read = readSummaryOf(u, prior);
    const problems = new ProblemList();
    const options = u.options as unknown as UploadOptions;
    const base: store.NewUpload = { kind: 'file', status: 'failed', userId: who.id, userEmail: who.email };
    const timings: Timings = {};
    progress.count({ rowsRead: read.rowsRead, values: read.values });
    const outcome = await commitStaged(
      conn,
      t,
      read,
      prior!.columns!,
      options,
      problems,
      base,
      u.id,
      timings,
      progress,
    );
    if (outcome.kind === 'noop') {
      await store.markFailed(conn, u.id, 0, 0, []);
      await staging.dropStaging(conn, u.stagingTable);
      return noop(outcome.upload);
    }
    if (outcome.kind !== 'committed') {
      await store.markFailed(conn, u.id, problems.errors, problems.warnings, problems.sorted());
      await staging.dropStaging(conn, u.stagingTable);
      throw new UploadRejected(problems, u.id, outcome.preview, progress.stopPoint(problems.sorted()));
    }
    await staging.dropStaging(conn, u.stagingTable);
    return {
      noop: false,
      upload: summaryOf(outcome.upload),
      preview: outcome.preview,
      problems: problems.sorted(),
      problemsTruncated: problems.truncated,
      timings,
    };
  });
}

type Outcome =
  | { kind: 'noop'; upload: store.UploadRecord }
  | { kind: 'previewed' | 'failed'; preview: Preview; counts: Partial<store.UploadCounts> }
  | { kind: 'committed'; upload: store.UploadRecord; preview: Preview; counts: Partial<store.UploadCounts> };

async function readIntoStaging(
  conn: PoolClient,
  t: staging.StagingNames,
  file: ReceivedFile,
  options: UploadOptions & { maxNewDistricts?: number },
  problems: ProblemList,
  now: Date,
  progress: ProgressTracker,
): Promise<ReadSummary> {
  const catalogue = await loadCatalogue(conn);
  const knownDistricts = options.maxNewDistricts === undefined ? undefined : await store.districtCodes(conn);
  const reader = new UploadReader({
    catalogue,
    options,
    currentYear: now.getUTCFullYear(),
    problems,
    knownDistricts,
    maxNewDistricts: options.maxNewDistricts,
  });
  let bytesRead = 0;
  const parse = new Transform({
    transform(chunk: Buffer, _enc, cb) {
      try {
        const out = reader.push(chunk);
        bytesRead += chunk.length;
        progress.count({ bytesRead, rowsRead: reader.rowsSoFar, values: reader.valuesSoFar });
        cb(null, out ?? undefined);
      } catch (err) {
        cb(err as Error);
      }
    },
    flush(cb) {
      try {
        cb(null, reader.end() ?? undefined);
      } catch (err) {
        cb(err as Error);
      }
    },
  });
  await pipeline(fs.createReadStream(file.path, { highWaterMark: 256 * 1024 }), parse, staging.copyRowsStream(conn, t));
  const read = reader.result();
  progress.count({ bytesRead, rowsRead: read.rowsRead, values: read.values });
  if (read.fatal) return read;
  await staging.saveDistrictsSeen(conn, t, read.districts);
  // They are in the staging table now; up to 50,000 of them need not stay in memory through the checks.
  read.districts = [];
  const lines = await staging.firstLines(conn, t, reader.duplicates);
  for (const d of reader.duplicates) {
    const line = lines.get(`${d.district}|${d.indicatorId}|${d.year}`);
    const p = problems.items[d.problemIndex];
    if (line !== undefined) p.reason = p.reason.replace(/ is given twice$/, ` is already given on line ${line}`);
  }
  return read;
}

async function loadCatalogue(conn: Sql): Promise<Map<string, CatalogueEntry>> {
  const rows = await store.readerCatalogue(conn);
  return new Map(rows.map((r) => [r.code, r as CatalogueEntry]));
}

async function previewStaged(
  conn: Sql,
  t: staging.StagingNames,
  read: ReadSummary,
  columns: Columns,
  options: UploadOptions,
  problems: ProblemList,
  timings: Timings,
  progress: ProgressTracker,
): Promise<Outcome> {
  return inTransaction(conn, async () => {
    await lockObservations(conn);
    progress.enter('checking');
    const ev = await timed(timings, 'checkMs', () => evaluateStaged(conn, t, columns, options, problems));
    progress.count(checkedCounts(ev));
    const preview = await previewOf(conn, read, ev, options);
    return {
      kind: problems.errors ? 'failed' : 'previewed',
      preview,
      counts: countsOf(ev),
      rollback: true,
    } as Outcome & { rollback: boolean };
  });
}

/** Checks and, when there are no errors, merges, in one transaction. */
async function commitStaged(
  conn: Sql,
  t: staging.StagingNames,
  read: ReadSummary,
  columns: Columns,
  options: UploadOptions,
  problems: ProblemList,
  base: store.NewUpload,
  previewedId: number | null,
  timings: Timings,
  progress: ProgressTracker,
): Promise<Outcome> {
  return inTransaction(conn, async (): Promise<Outcome & { rollback?: boolean }> => {
    await lockObservations(conn);
    const checksum = base.checksum ?? (previewedId ? (await store.findUpload(conn, previewedId))?.checksum : null);
    const done = checksum ? await store.findCommittedByChecksum(conn, checksum) : null;
    if (done) return { kind: 'noop', upload: done, rollback: true };
    const version = await store.nextVersion(conn);
    const upload = previewedId ?? (await store.insertUpload(conn, { ...base, status: 'committed', version })).id;
    progress.enter('checking');
    const ev = await timed(timings, 'checkMs', () => evaluateStaged(conn, t, columns, options, problems));
    progress.count(checkedCounts(ev));
    const preview = await previewOf(conn, read, ev, options);
    const counts = countsOf(ev);
    if (problems.errors > 0) return { kind: 'failed', preview, counts, rollback: true };
    const kinds = (list: { kind: string; n: number }[]) => {
      const k = { i: 0, c: 0, r: 0 };
      for (const x of list) if (x.kind in k) k[x.kind as 'i' | 'c' | 'r'] += x.n;
      return k;
    };
    const cells = kinds(ev.cells);
    const sets: ChangeTable[] = [
      { ...CHANGE_SETS.changed, known: { i: 0, c: cells.c, r: 0 } },
      { ...CHANGE_SETS.fresh, known: { i: cells.i, c: 0, r: 0 } },
      ...(ev.derived.length ? [{ ...CHANGE_SETS.derived, known: kinds(ev.derived) }] : []),
    ];
    progress.enter('merging');
    const merged = await timed(timings, 'mergeMs', () => applyChanges(conn, upload, version, sets));
    await dropEvaluationViews(conn);
    timings.bulkPath = merged.bulk;
    const record = await store.markCommitted(
      conn,
      upload,
      version,
      { ...counts, remove: merged.removed, errors: 0, warnings: problems.warnings },
      { ...preview, expiresAt: null },
      problems.sorted(),
    );
    return { kind: 'committed', upload: record, preview: { ...preview, expiresAt: null }, counts };
  });
}

/** The checked counts as progress reports them. */
function checkedCounts(ev: Evaluation) {
  const c = countsOf(ev);
  return { insert: c.insert ?? 0, change: c.change ?? 0, unchanged: c.unchanged ?? 0, derived: c.derived ?? 0 };
}

function countsOf(ev: Evaluation): Partial<store.UploadCounts> {
  const sum = (k: string) => ev.cells.filter((c) => c.kind === k).reduce((a, c) => a + c.n, 0);
  return {
    insert: sum('i'),
    change: sum('c'),
    unchanged: sum('u'),
    derived: ev.derived.reduce((a, d) => a + d.n, 0),
    remove: ev.derived.filter((d) => d.kind === 'r').reduce((a, d) => a + d.n, 0),
  };
}

async function previewOf(conn: Sql, read: ReadSummary, ev: Evaluation, options: UploadOptions): Promise<Preview> {
  // Names only for the districts the preview lists (the first PREVIEW_LIST_CAP by code).
  const districtIds = [...new Set(ev.cells.map((c) => c.districtId))];
  let listed = districtIds;
  if (districtIds.length > PREVIEW_LIST_CAP) {
    const codes = await store.districtsById(conn, districtIds);
    listed = codes
      .sort((a, b) => DISTRICT_ORDER.compare(a.code, b.code))
      .slice(0, PREVIEW_LIST_CAP)
      .map((d) => d.id);
  }
  const ds = await store.districtsById(conn, listed);
  const is = await store.indicatorNames(conn);
  return buildPreview(
    read,
    ev,
    { districts: new Map(ds.map((d) => [d.id, d])), indicators: new Map(is.map((i) => [i.id, i])) },
    options.decimalComma,
    null,
  );
}

function readSummaryOf(u: store.UploadRecord, p: (Preview & { columns?: Columns }) | null): ReadSummary {
  if (!p?.columns) throw new AppError(409, 'not_previewed', `Upload ${u.id} has no kept preview.`, { id: u.id });
  return {
    format: p.format,
    delimiter: p.delimiter,
    rowsRead: p.rowsRead,
    blankLines: p.blankLines,
    values: p.values,
    staged: 0,
    districts: [],
    firstYear: p.years.first,
    lastYear: p.years.last,
    fatal: false,
    columns: p.columns,
  };
}

function noop(u: store.UploadRecord): UploadAnswer {
  const when = u.committedAt ? new Date(u.committedAt).toISOString().slice(0, 16).replace('T', ' ') : 'earlier';
  return {
    noop: true,
    upload: summaryOf(u),
    message: `This file was already committed as upload ${u.id} (${when} UTC, data version ${u.version}): nothing was changed.`,
  };
}

export async function listUploads(db: Knex, q: { limit: number; before?: number; status?: store.UploadStatus }) {
  const rows = await store.listUploads(db, q);
  return { uploads: rows.map(summaryOf), nextBefore: rows.length === q.limit ? rows[rows.length - 1].id : null };
}

export async function getUpload(db: Knex, id: number) {
  const u = await store.findUpload(db, id);
  if (!u) throw new NotFoundError(`No upload ${id}`, { id });
  const preview = u.preview as (Preview & { columns?: Columns }) | null;
  if (preview) delete preview.columns;
  return { upload: summaryOf(u), preview, problems: u.problems ?? [] };
}
