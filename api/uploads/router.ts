/** Upload routes: CSV in (dry run or commit), the upload history, commit of a preview, revert, data version. */
import { z } from 'zod';
import * as audit from '../audit/service';
import type { AppContext } from '../context';
import { AppError, NotFoundError } from '../http/errors';
import { callerOf, route, SIGNED_IN, STAFF, type RouteSpec } from '../http/routes';
import { getSettings } from '../settings/service';
import { dataVersion, revertUpload } from './change-sets';
import { receivedFile, receiveFile } from './multipart';
import { ProgressTracker, readProgress } from './progress';
import { progressParams, uploadCommitQuery, uploadIdParams, uploadListQuery, uploadQuery } from './schema';
import * as service from './service';
import { DataVersionSchema } from '../../contracts/districts';
import {
  RevertAnswerSchema,
  UploadAnswerSchema,
  UploadDetailResponseSchema,
  UploadListResponseSchema,
  UploadProgressSchema,
  UploadRejectionDetailsSchema,
} from '../../contracts/uploads';
import { safeParse } from '../../contracts/kit';

function who(req: Parameters<typeof callerOf>[0]): service.Who {
  const c = callerOf(req);
  return { id: c?.id ?? null, email: c?.email ?? null };
}

/** Runs an upload step with its tracker: done when it answers, failed (and where) when it throws. */
async function tracked<T>(progress: ProgressTracker, work: () => Promise<T>): Promise<T> {
  try {
    const answer = await work();
    progress.done();
    return answer;
  } catch (err) {
    const details = err instanceof AppError ? safeParse(UploadRejectionDetailsSchema, err.details) : null;
    progress.failed(details?.success ? details.data.stoppedAt : null);
    throw err;
  }
}

export function uploadRoutes({ db, config }: AppContext): RouteSpec[] {
  const record = (w: service.Who, action: string, targetId: number, after: unknown) =>
    audit.record(db, { actorId: w.id, actorEmail: w.email, action, targetType: 'upload', targetId, after });
  return [
    route({
      method: 'post',
      path: '/api/uploads',
      answer: UploadAnswerSchema,
      statuses: [200, 201],
      allow: STAFF,
      tag: 'uploads',
      summary:
        'Upload a CSV (multipart field "file", long or wide format): a dry run with the preview by default; ?commit=true checks and commits in one transaction',
      before: [receiveFile(config.uploadMaxBytes)],
      schemas: { query: uploadQuery },
      handler: async ({ query }, req, res) => {
        const w = who(req);
        const file = receivedFile(req);
        const progress = new ProgressTracker(query.progress ?? null, w.id, {
          bytesTotal: file.size,
          commit: query.commit,
        });
        const answer = await tracked(progress, async () => {
          const changeFactor = query.changeFactor ?? (await getSettings(db)).uploadChangeFactor;
          return service.receiveUpload(
            db,
            file,
            { ...query, changeFactor, maxNewDistricts: config.uploadMaxNewDistricts },
            w,
            new Date(),
            progress,
          );
        });
        if (!answer.noop) answer.timings.receiveMs = res.locals.receiveMs;
        if (!answer.noop && answer.upload.status === 'committed') {
          await record(w, 'upload.commit', answer.upload.id, {
            fileName: answer.upload.fileName,
            version: answer.upload.version,
            counts: answer.upload.counts,
          });
          res.status(201);
        }
        return answer;
      },
    }),
    route({
      method: 'get',
      path: '/api/uploads',
      answer: UploadListResponseSchema,
      // Staff only: failed previews quote old and new values and the uploader's address.
      allow: STAFF,
      tag: 'uploads',
      summary: 'Upload history, newest first (files, the demo seed, reverts, derived recomputations)',
      schemas: { query: uploadListQuery },
      handler: ({ query }) => service.listUploads(db, query),
    }),
    route({
      method: 'get',
      path: '/api/uploads/progress/:key',
      answer: UploadProgressSchema,
      allow: STAFF,
      tag: 'uploads',
      summary:
        "An upload's progress under the key its client chose (POST /api/uploads?progress=<key>): phase, counts, and where a refused upload stopped; only for the person who sent it, kept 10 minutes after the answer",
      schemas: { params: progressParams },
      handler: ({ params }, req) => {
        const found = readProgress(params.key, who(req).id);
        if (!found) throw new NotFoundError(`No upload in progress under the key ${params.key}.`, { key: params.key });
        return found;
      },
    }),
    route({
      method: 'get',
      path: '/api/uploads/:id',
      answer: UploadDetailResponseSchema,
      allow: STAFF,
      tag: 'uploads',
      summary: 'One upload with its preview and problems',
      schemas: { params: uploadIdParams },
      handler: ({ params }) => service.getUpload(db, params.id),
    }),
    route({
      method: 'post',
      path: '/api/uploads/:id/commit',
      answer: UploadAnswerSchema,
      statuses: [200, 201],
      allow: STAFF,
      tag: 'uploads',
      summary:
        'Commit a previewed upload from its kept staged rows (checked again against the data as it is now); ?progress=<key> reports its phases',
      schemas: { params: uploadIdParams, query: uploadCommitQuery },
      handler: async ({ params, query }, req, res) => {
        const w = who(req);
        const progress = new ProgressTracker(query.progress ?? null, w.id, {
          bytesTotal: 0,
          commit: true,
          phase: 'checking',
        });
        const answer = await tracked(progress, () => service.commitPreviewed(db, params.id, w, progress));
        if (!answer.noop) {
          await record(w, 'upload.commit', answer.upload.id, {
            fileName: answer.upload.fileName,
            version: answer.upload.version,
            counts: answer.upload.counts,
          });
          res.status(201);
        }
        return answer;
      },
    }),
    route({
      method: 'post',
      path: '/api/uploads/:id/revert',
      answer: RevertAnswerSchema,
      allow: STAFF,
      tag: 'uploads',
      summary:
        'Revert a committed upload: every value it wrote goes back to what it was before (refused when later uploads changed them)',
      schemas: { params: uploadIdParams },
      handler: async ({ params }, req) => {
        const w = who(req);
        const answer = await revertUpload(db, params.id, w);
        await record(w, 'upload.revert', params.id, {
          revertUploadId: answer.revert.id,
          version: answer.revert.version,
          restored: answer.restored,
        });
        return answer;
      },
    }),
    route({
      method: 'get',
      path: '/api/data-version',
      answer: DataVersionSchema,
      allow: SIGNED_IN,
      tag: 'uploads',
      summary:
        'The current data version (last change applied and a hash of the rows), or an earlier one rebuilt from history',
      schemas: { query: z.object({ version: z.coerce.number().int().min(0).optional() }) },
      handler: ({ query }) => dataVersion(db, query.version),
    }),
  ];
}
