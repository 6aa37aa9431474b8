/**
 * Change sets that do not come from a file: reverting an upload, and recomputing a
 * derived indicator after its definition changed. Both run under the observations lock,
 * get the next data version and write through the same merge as uploads.
 */
import type { Knex } from 'knex';
import { AppError, NotFoundError } from '../http/errors';
import { createDerivedTable, deriveChanges, derivedDefs } from './derived-store';
import { buildRestoreSet, revertConflicts, rowsHash, observationsAsOfSql } from './history-store';
import { applyChanges } from './merge-store';
import { summaryOf, type UploadSummary } from './present';
import { inTransaction, lockObservations, withConnection, type Sql } from '../db/connection';
import * as sets from './change-set-store';
import * as store from './store';
import type { Who } from './service';

export interface RevertAnswer {
  reverted: UploadSummary;
  revert: UploadSummary;
  restored: { changedBack: number; removed: number; reinserted: number; derived: number };
}

export async function revertUpload(db: Knex, id: number, who: Who): Promise<RevertAnswer> {
  return withConnection(db, (conn) =>
    inTransaction(conn, async () => {
      await lockObservations(conn);
      const x = await store.findUpload(conn, id, { forUpdate: true });
      if (!x) throw new NotFoundError(`No upload ${id}`, { id });
      if (x.status === 'reverted') {
        throw new AppError(
          409,
          'already_reverted',
          `Upload ${id} was already reverted (by upload ${x.revertedByUploadId}).`,
          { id, revertedByUploadId: x.revertedByUploadId },
        );
      }
      if (x.status !== 'committed')
        throw new AppError(
          409,
          'not_committed',
          `Upload ${id} is ${x.status}: only a committed upload can be reverted.`,
          { id, status: x.status },
        );
      if (x.kind !== 'file' && x.kind !== 'derivation' && x.kind !== 'boundaries') {
        throw new AppError(409, 'not_revertable', `Upload ${id} is a ${x.kind} change set, which cannot be reverted.`, {
          id,
          kind: x.kind,
        });
      }
      const conflicts = await revertConflicts(conn, x.id, x.version!);
      if (conflicts.total > 0) {
        const later = [...new Set(conflicts.listed.map((c) => c.heldBy).filter((h): h is number => h !== null))].sort(
          (a, b) => b - a,
        );
        const first = conflicts.listed[0];
        throw new AppError(
          409,
          'revert_conflict',
          `Upload ${id} cannot be reverted: ${conflicts.total} of its values were changed later (e.g. ${first.district} ${first.indicator} ${first.year}` +
            `${first.heldBy ? ` by upload ${first.heldBy}` : ''})${later.length ? `; revert upload ${later.join(', ')} first` : ''}.`,
          { id, laterUploads: later, cells: conflicts.listed, total: conflicts.total },
        );
      }
      await buildRestoreSet(conn, x.id, x.version!);
      const version = await store.nextVersion(conn);
      const rev = await store.insertUpload(conn, {
        kind: 'revert',
        status: 'committed',
        version,
        revertsUploadId: x.id,
        fileName: x.fileName,
        note: `revert of upload ${x.id}`,
        userId: who.id,
        userEmail: who.email,
      });
      const n = await sets.stagedCounts(conn, 'upload_restore');
      await applyChanges(conn, rev.id, version, [
        { table: 'upload_restore', writer: 'coalesce(t.value_upload_id, $1::int)', historyKinds: ['i', 'c', 'r'] },
      ]);
      const derived = await recomputeTouched(conn, rev.id, version, 'restored');
      await store.markReverted(conn, x.id, rev.id);
      await sets.writeCounts(conn, rev.id, {
        values: n('i') + n('c') + n('r'),
        inserted: n('i'),
        changed: n('c'),
        removed: n('r'),
        derived,
      });
      return {
        reverted: summaryOf((await store.findUpload(conn, x.id))!),
        revert: summaryOf((await store.findUpload(conn, rev.id))!),
        restored: { changedBack: n('c'), removed: n('r'), reinserted: n('i'), derived },
      };
    }),
  );
}

/** Recomputes derived series for the keys a change touched (or all keys); returns the cells changed. */
async function recomputeTouched(
  conn: Sql,
  uploadId: number,
  version: number,
  keys: 'restored' | 'all',
  only?: number,
): Promise<number> {
  let defs = await derivedDefs(conn);
  if (only !== undefined) defs = defs.filter((d) => d.id === only);
  if (keys === 'restored') {
    const touched = await sets.restoredIndicatorIds(conn);
    defs = defs.filter((d) => touched.has(d.sourceId) || touched.has(d.divisorId));
  }
  if (defs.length === 0) return 0;
  await createDerivedTable(conn);
  await sets.truncateDerived(conn);
  let n = 0;
  for (const def of defs) n += await deriveChanges(conn, def, keys);
  if (n > 0)
    await applyChanges(conn, uploadId, version, [
      { table: 'upload_derived', writer: '$1::int', historyKinds: ['c', 'r'] },
    ]);
  return n;
}

/**
 * Recomputes every value of one derived indicator from its sources, as a change set of
 * kind 'derivation' (so it is in history and can be reverted). Call inside a transaction
 * on conn, after the definition was saved. Returns null when nothing changed.
 */
export async function recomputeDerivedIndicator(
  conn: Sql,
  indicatorId: number,
  code: string,
  who: Who,
): Promise<UploadSummary | null> {
  await lockObservations(conn);
  const version = await store.nextVersion(conn);
  const cs = await store.insertUpload(conn, {
    kind: 'derivation',
    status: 'committed',
    version,
    note: `recomputed ${code} from its sources`,
    userId: who.id,
    userEmail: who.email,
  });
  const n = await recomputeTouched(conn, cs.id, version, 'all', indicatorId);
  if (n === 0) {
    await sets.deleteUpload(conn, cs.id);
    return null;
  }
  const k = await sets.stagedCounts(conn, 'upload_derived');
  await sets.writeCounts(conn, cs.id, { values: n, inserted: k('i'), changed: k('c'), removed: k('r'), derived: n });
  return summaryOf((await store.findUpload(conn, cs.id))!);
}

export interface DataVersion {
  /** The data version number: changes applied so far, in order (0 = no data yet). */
  version: number;
  /** The upload (change set) applied last, which produced this version. */
  uploadId: number | null;
  appliedAt: string | null;
  /** md5 over every observation as "district|indicator|year|value" in code order. */
  rowsHash: string;
  rows: number;
  /** The boundary version in force at this data version (null: none), which land areas come from. */
  boundaryVersion: number | null;
}

/**
 * The current data version, or a past one rebuilt from history. Read in one REPEATABLE
 * READ snapshot so the version number and the hash describe the same rows.
 */
export async function dataVersion(db: Knex, at?: number): Promise<DataVersion> {
  return withConnection(db, (conn) =>
    inTransaction(conn, async () => {
      await sets.readOnlySnapshot(conn);
      const latest = await store.latestVersion(conn);
      const current = latest?.version ?? 0;
      if (at !== undefined && at > current)
        throw new NotFoundError(`No data version ${at}: the latest is ${current}.`, { version: at, latest: current });
      const v = at ?? current;
      const applied = await sets.uploadAtVersion(conn, v);
      const hash = await rowsHash(conn, v === current ? 'observations' : observationsAsOfSql(v));
      const boundaryVersion = await sets.boundaryVersionAt(conn, v);
      return {
        version: v,
        uploadId: applied?.id ?? null,
        appliedAt: applied?.committedAt ?? null,
        rowsHash: hash.hash,
        rows: hash.rows,
        boundaryVersion,
        rollback: true,
      };
    }),
  ).then(({ rollback: _r, ...v }) => v);
}

/**
 * Opens a change set that is not a file upload (boundaries, say): takes the next data
 * version and writes its committed upload row. Call under the observations lock.
 */
export async function openChangeSet(
  conn: Sql,
  u: Omit<store.NewUpload, 'version'>,
): Promise<{ upload: Awaited<ReturnType<typeof store.insertUpload>>; version: number }> {
  const version = await store.nextVersion(conn);
  return { upload: await store.insertUpload(conn, { ...u, version }), version };
}

/**
 * Values derived from the boundaries, written by the boundary change set: first every
 * `from_boundaries` indicator (land area), then the derived indicators that read one of
 * them (e.g. density = population ÷ land area), so the second pass sees the new areas.
 * Returns the cells changed.
 */
export async function deriveFromBoundaries(conn: Sql, uploadId: number, version: number): Promise<number> {
  const defs = await derivedDefs(conn);
  const areas = defs.filter((d) => d.derivation === 'from_boundaries');
  if (!areas.length) return 0;
  const ids = new Set(areas.map((a) => a.id));
  const readers = defs.filter(
    (d) => d.derivation !== 'from_boundaries' && (ids.has(d.sourceId) || ids.has(d.divisorId)),
  );
  let n = 0;
  for (const pass of [areas, readers]) {
    if (!pass.length) continue;
    await createDerivedTable(conn);
    await sets.truncateDerived(conn);
    let m = 0;
    for (const def of pass) m += await deriveChanges(conn, def, 'all');
    if (m > 0)
      await applyChanges(conn, uploadId, version, [
        { table: 'upload_derived', writer: '$1::int', historyKinds: ['c', 'r'] },
      ]);
    n += m;
  }
  return n;
}
