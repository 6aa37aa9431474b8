/** Boundary routes: GeoJSON in (dry run or commit), the geometry for screens, versions and revert. */
import type { Request, Response } from 'express';
import { z } from 'zod';
import * as audit from '../audit/service';
import type { AppContext } from '../context';
import { NotFoundError } from '../http/errors';
import { callerOf, route, SIGNED_IN, STAFF, type RouteSpec } from '../http/routes';
import { idParams } from '../http/validate';
import { receivedFile, receiveFile } from '../uploads/multipart';
import { queryBool } from '../uploads/schema';
import type { Who } from '../uploads/service';
import { encodedAnswer } from './answer';
import * as service from './service';
import {
  BoundaryRevertAnswerSchema,
  BoundaryUploadAnswerSchema,
  BoundaryVersionsSchema,
} from '../../contracts/boundaries';

export const boundaryUploadQuery = z.object({
  codeProperty: z.string().min(1).max(100).default('code'),
  commit: queryBool.default(false),
  /** repair features PostGIS finds invalid with ST_MakeValid (the analyst's say-so) */
  repair: queryBool.default(false),
});

export const boundaryQuery = z.object({
  version: z.coerce.number().int().positive().optional(),
  detail: z.enum(['phone', 'print']).default('phone'),
});

function who(req: Request): Who {
  const c = callerOf(req);
  return { id: c?.id ?? null, email: c?.email ?? null };
}

/** Immutable for a versioned URL; revalidated (ETag) for the current one; gzip when accepted. */
function send(req: Request, res: Response, a: { json: Buffer; gzip: Buffer; etag: string }, versioned: boolean): void {
  res.setHeader('Cache-Control', versioned ? 'private, max-age=31536000, immutable' : 'private, no-cache');
  res.setHeader('ETag', a.etag);
  res.setHeader('Vary', 'Accept-Encoding');
  if (req.get('if-none-match') === a.etag) {
    res.status(304).end();
    return;
  }
  res.type('application/geo+json');
  const gz = /\bgzip\b/.test(req.get('accept-encoding') ?? '');
  if (gz) res.setHeader('Content-Encoding', 'gzip');
  res.send(gz ? a.gzip : a.json);
}

export function boundaryRoutes({ db, config, compute }: AppContext): RouteSpec[] {
  return [
    route({
      method: 'post',
      path: '/api/boundaries',
      allow: STAFF,
      tag: 'boundaries',
      answer: BoundaryUploadAnswerSchema,
      statuses: [200, 201],
      summary:
        'Upload district boundaries (GeoJSON FeatureCollection of polygons, multipart field "file"; ?codeProperty names the code property): a dry run with the preview by default; ?commit=true writes a new boundary version when the whole file is accepted; ?repair=true repairs invalid polygons with ST_MakeValid',
      before: [
        receiveFile(config.boundaryMaxBytes, undefined, { kind: 'the GeoJSON file', setting: 'BOUNDARY_MAX_BYTES' }),
      ],
      schemas: { query: boundaryUploadQuery },
      handler: async ({ query }, req, res) => {
        const w = who(req);
        const answer = await service.receiveBoundaries(db, receivedFile(req), query, w, {
          maxVertices: config.boundaryMaxVertices,
          // Parsing and the GeoJSON checks run in a pool thread: a hostile file never stalls other requests.
          read: (path, codeProperty, maxVertices) =>
            compute.run({ kind: 'boundary-read', path, codeProperty, maxVertices }),
        });
        if (answer.committed) {
          await audit.record(db, {
            actorId: w.id,
            actorEmail: w.email,
            action: 'boundaries.commit',
            targetType: 'upload',
            targetId: answer.uploadId!,
            after: { versionId: answer.versionId, counts: answer.counts },
          });
          res.status(201);
        }
        return answer;
      },
    }),
    route({
      method: 'get',
      path: '/api/boundaries',
      allow: SIGNED_IN,
      tag: 'boundaries',
      summary:
        'The current district boundaries (or ?version=N, immutable) as a GeoJSON FeatureCollection, simplified with shared edges kept; ?detail=phone|print',
      schemas: { query: boundaryQuery },
      produces: 'application/geo+json',
      handler: async ({ query }, req, res) => {
        let version: number | null;
        if (query.version !== undefined) {
          if (!(await service.findVersion(db, query.version)))
            throw new NotFoundError(`No boundary version ${query.version}.`, { version: query.version });
          version = query.version;
        } else {
          version = await service.currentVersionId(db);
        }
        send(req, res, await encodedAnswer(db, version, query.detail), query.version !== undefined);
        return undefined;
      },
    }),
    route({
      method: 'get',
      path: '/api/boundaries/versions',
      allow: SIGNED_IN,
      tag: 'boundaries',
      summary: 'Boundary versions, newest first: who loaded them, when, the counts, and which is current',
      answer: BoundaryVersionsSchema,
      handler: () => service.listVersions(db),
    }),
    route({
      method: 'post',
      path: '/api/boundaries/versions/:id/revert',
      allow: STAFF,
      tag: 'boundaries',
      summary:
        'Revert a boundary version: the version before it becomes current again (a change set in the upload history)',
      answer: BoundaryRevertAnswerSchema,
      schemas: { params: idParams },
      handler: async ({ params }, req) => {
        const w = who(req);
        const answer = await service.revertVersion(db, params.id, w);
        await audit.record(db, {
          actorId: w.id,
          actorEmail: w.email,
          action: 'boundaries.revert',
          targetType: 'upload',
          targetId: answer.reverted!.uploadId,
          after: { versionId: params.id, revertUploadId: answer.revertUploadId },
        });
        return answer;
      },
    }),
  ];
}
