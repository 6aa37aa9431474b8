/**
 * Boundary uploads: read the GeoJSON (sliced, capped: json-reader.ts) and run the
 * database-free checks (check-features.ts) — both in a compute pool thread when the route
 * passes one (read-file.ts) — then in one transaction on one connection the checks that
 * need the region and PostGIS — codes the region does not know, districts left without a
 * boundary, self-intersections (repaired with ST_MakeValid only when the analyst asks) —
 * and, when the whole file is accepted and a commit was asked for, the write: a change
 * set in `uploads` (kind 'boundaries', the next data version) and a boundary version.
 * Nothing is written otherwise.
 */
import type { Knex } from 'knex';
import { AppError, NotFoundError } from '../http/errors';
import type { ReceivedFile, Who } from '../uploads/service';
import { deriveFromBoundaries, openChangeSet, revertUpload } from '../uploads/change-sets';
import { inTransaction, lockObservations, withConnection } from '../db/connection';
import type { BoundaryProblem } from './check-features';
import { readBoundaryFile, type BoundaryRead } from './read-file';
import * as store from './store';

export interface BoundaryOptions {
  codeProperty: string;
  commit: boolean;
  repair: boolean;
}

export interface BoundaryLimits {
  maxVertices: number;
  /**
   * Reads and checks the file (read-file.ts); the route passes the compute pool's task so
   * parsing never runs on the event loop. Inline when not given (the demo seed).
   */
  read?: (path: string, codeProperty: string, maxVertices: number) => Promise<BoundaryRead>;
}

export interface BoundaryAnswer {
  accepted: boolean;
  committed: boolean;
  /** the boundary version written (commit only) */
  versionId: number | null;
  uploadId: number | null;
  dataVersion: number | null;
  counts: {
    features: number;
    vertices: number;
    matched: number;
    missing: number;
    repaired: number;
    errors: number;
    warnings: number;
  };
  problems: BoundaryProblem[];
  /** the first features as they would be written: code, district name, area */
  preview: { feature: number; code: string; name: string; areaKm2: number }[];
  missingDistricts: string[];
}

/** Problems listed in an answer (the counts always cover them all). */
const LISTED = 200;
const PREVIEW = 50;

export class BoundariesRejected extends AppError {
  constructor(answer: BoundaryAnswer) {
    super(
      422,
      'boundaries_rejected',
      `The boundaries were not loaded: ${answer.counts.errors} problem${answer.counts.errors === 1 ? '' : 's'} to fix. ${answer.problems.find((p) => p.severity === 'error')?.reason ?? ''}`.trim(),
      answer,
    );
  }
}

function counted(problems: BoundaryProblem[]) {
  return {
    errors: problems.filter((p) => p.severity === 'error').length,
    warnings: problems.filter((p) => p.severity === 'warning').length,
  };
}

export async function receiveBoundaries(
  db: Knex,
  file: ReceivedFile,
  options: BoundaryOptions,
  who: Who,
  limits: BoundaryLimits,
): Promise<BoundaryAnswer> {
  const read = await (limits.read ?? readBoundaryFile)(file.path, options.codeProperty, limits.maxVertices);
  if (!read.ok) {
    const problems: BoundaryProblem[] = [
      {
        feature: null,
        code: null,
        problem: 'not_feature_collection',
        severity: 'error',
        reason: `the file is not readable JSON: ${read.reason}`,
      },
    ];
    return finish(options, emptyAnswer(problems));
  }
  const check = read.check;
  return withConnection(db, (conn) =>
    inTransaction(conn, async () => {
      const problems = [...check.problems];
      const known = await store.districtCodes(conn);
      const matched = check.features.filter((f) => {
        if (known.has(f.code)) return true;
        problems.push({
          feature: f.index,
          code: f.code,
          problem: 'unknown_code',
          severity: 'error',
          reason: `feature ${f.index} has the code ${f.code}, which is not a district of the region`,
        });
        return false;
      });
      const given = new Set(check.features.map((f) => f.code));
      const missing = [...known.keys()].filter((c) => !given.has(c)).sort();
      for (const code of missing) {
        problems.push({
          feature: null,
          code,
          problem: 'no_boundary',
          severity: 'warning',
          reason: `district ${code} (${known.get(code)!.name}) has no feature in the file: it will be listed under the map without a shape`,
        });
      }
      await store.stageFeatures(conn, matched);
      const invalid = await store.invalidFeatures(conn);
      let repaired = 0;
      if (invalid.length && options.repair) {
        const empty = new Set((await store.repairInvalid(conn)).map((e) => e.index));
        for (const f of invalid) {
          if (empty.has(f.index)) {
            problems.push({
              feature: f.index,
              code: f.code,
              problem: 'self_intersection',
              severity: 'error',
              reason: `feature ${f.index} (${f.code}) is not a valid polygon (${f.reason}) and the repair left no area`,
            });
          } else {
            repaired += 1;
            problems.push({
              feature: f.index,
              code: f.code,
              problem: 'repaired',
              severity: 'warning',
              reason: `feature ${f.index} (${f.code}) was not a valid polygon (${f.reason}); repaired with ST_MakeValid, keeping its polygonal parts`,
            });
          }
        }
      } else {
        for (const f of invalid) {
          problems.push({
            feature: f.index,
            code: f.code,
            problem: 'self_intersection',
            severity: 'error',
            reason: `feature ${f.index} (${f.code}) is not a valid polygon: ${f.reason}; fix it in the file, or ask for the repair with ST_MakeValid (repair=true)`,
          });
        }
      }
      problems.sort(
        (a, b) =>
          (a.severity === b.severity ? 0 : a.severity === 'error' ? -1 : 1) ||
          (a.feature ?? Infinity) - (b.feature ?? Infinity),
      );
      const areas = await store.stagedAreas(conn, PREVIEW);
      const { errors, warnings } = counted(problems);
      const answer: BoundaryAnswer = {
        accepted: errors === 0,
        committed: false,
        versionId: null,
        uploadId: null,
        dataVersion: null,
        counts: {
          features: check.total,
          vertices: check.vertices,
          matched: matched.length,
          missing: missing.length,
          repaired,
          errors,
          warnings,
        },
        problems: problems.slice(0, LISTED),
        preview: areas.map((a) => ({
          feature: a.index,
          code: a.code,
          name: known.get(a.code)!.name,
          areaKm2: a.areaKm2,
        })),
        missingDistricts: missing,
      };
      if (errors > 0 || !options.commit) return { ...finish(options, answer), rollback: true };
      await lockObservations(conn);
      const { upload, version } = await openChangeSet(conn, {
        kind: 'boundaries',
        status: 'committed',
        fileName: file.originalName,
        checksum: file.checksum,
        byteSize: file.size,
        options: { codeProperty: options.codeProperty, repair: options.repair },
        userId: who.id,
        userEmail: who.email,
        note: `district boundaries: ${matched.length} districts${missing.length ? `, ${missing.length} without a boundary` : ''}`,
        counts: { rowsRead: check.total, values: matched.length, insert: matched.length, warnings },
        // In the shape of the upload history's problems (no line or column: each reason names its
        // feature and code). The codes are the boundary checks' own, outside the CSV checks' union.
        problems: answer.problems.map((p) => ({
          line: null,
          column: null,
          field: null,
          code: p.problem,
          severity: p.severity,
          reason: p.reason,
        })) as never,
      });
      const versionId = await store.insertVersion(conn, {
        uploadId: upload.id,
        codeProperty: options.codeProperty,
        features: matched.length,
        vertices: check.vertices,
        repaired,
        missing: missing.length,
      });
      await store.writeBoundaries(conn, versionId);
      const derived = await deriveFromBoundaries(conn, upload.id, version);
      if (derived > 0) await store.addDerivedCount(conn, upload.id, derived);
      return { ...answer, committed: true, versionId, uploadId: upload.id, dataVersion: version, rollback: false };
    }),
  ).then((a) => {
    const { rollback: _r, ...rest } = a as BoundaryAnswer & { rollback?: boolean };
    return rest;
  });
}

function emptyAnswer(problems: BoundaryProblem[]): BoundaryAnswer {
  const { errors, warnings } = counted(problems);
  return {
    accepted: false,
    committed: false,
    versionId: null,
    uploadId: null,
    dataVersion: null,
    counts: { features: 0, vertices: 0, matched: 0, missing: 0, repaired: 0, errors, warnings },
    problems,
    preview: [],
    missingDistricts: [],
  };
}

/** A refused commit is an error answer (422); a dry run answers its findings either way. */
function finish(options: BoundaryOptions, answer: BoundaryAnswer): BoundaryAnswer {
  if (options.commit && !answer.accepted) throw new BoundariesRejected(answer);
  return answer;
}

export const listVersions = async (db: Knex) => ({ versions: await store.listVersions(db) });
export const findVersion = (db: Knex, id: number) => store.findVersion(db, id);
export const currentVersionId = (db: Knex) => store.currentVersionId(db);

/** True when the region has districts and no boundary version yet (the demo loads its boundaries then). */
export async function awaitsFirstBoundaries(db: Knex): Promise<boolean> {
  const { versions, districts } = await store.boundaryCounts(db);
  return versions === 0 && districts > 0;
}

/**
 * Reverts a boundary upload as any change set is reverted (a 'revert' change set, the
 * next data version; the areas and the values derived from them go back to what they
 * were), so the boundary version before it is current again.
 */
export async function revertVersion(db: Knex, id: number, who: Who) {
  const v = await store.findVersion(db, id);
  if (!v) throw new NotFoundError(`No boundary version ${id}.`, { id });
  if (v.status !== 'committed')
    throw new AppError(409, 'already_reverted', `Boundary version ${id} (upload ${v.uploadId}) is already reverted.`, {
      id,
      uploadId: v.uploadId,
    });
  const answer = await revertUpload(db, v.uploadId, who);
  return {
    reverted: await store.findVersion(db, id),
    revertUploadId: answer.revert.id,
    dataVersion: answer.revert.version,
    restored: answer.restored,
    currentVersionId: await store.currentVersionId(db),
  };
}
