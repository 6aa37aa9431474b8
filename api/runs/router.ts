import { z } from 'zod';
import { idParams } from '../http/validate';
import type { AppContext } from '../context';
import { districtCode, trackCode } from '../http/params';
import { callerOf, COMPUTE_LIMIT, route, SIGNED_IN, STAFF, type RouteSpec } from '../http/routes';
import * as service from './service';
import { NO_CONTENT } from '../../contracts/common';
import { PublishedResponseSchema } from '../../contracts/districts';
import {
  DistrictReviewSchema,
  PublishAnswerSchema,
  ReviewResponseSchema,
  RunListResponseSchema,
  RunStartedSchema,
  RunViewSchema,
} from '../../contracts/runs';

const byId = idParams;

export function runRoutes(ctx: AppContext): RouteSpec[] {
  const { db } = ctx;
  return [
    route({
      method: 'get',
      path: '/api/published',
      answer: PublishedResponseSchema,
      allow: SIGNED_IN,
      tag: 'runs',
      summary: 'The latest published run id: the cheap question an open app asks to learn of a publish (never cached)',
      handler: async (_input, _req, res) => {
        res.set('Cache-Control', 'no-store');
        return { runId: await service.latestPublishedRunId(db) };
      },
    }),
    route({
      method: 'get',
      path: '/api/runs',
      answer: RunListResponseSchema,
      allow: STAFF,
      tag: 'runs',
      summary: 'Recent runs, newest first (of one track with ?track=)',
      schemas: {
        query: z.object({ limit: z.coerce.number().int().min(1).max(200).default(50), track: trackCode.optional() }),
      },
      handler: async ({ query }) => ({ runs: await service.listRuns(db, query.limit, query.track) }),
    }),
    route({
      method: 'post',
      path: '/api/runs',
      answer: RunStartedSchema,
      statuses: [202],
      allow: STAFF,
      tag: 'runs',
      summary:
        'Re-estimate now: queue a run of one track (its code; the headline track when none is named) or of every active track (`all`)',
      schemas: { body: z.object({ track: z.union([z.literal('all'), trackCode]).optional() }).default({}) },
      handler: async ({ body }, req, res) => {
        const runs = await service.startRuns(ctx, callerOf(req)!, { track: body.track });
        const codes = await service.trackCodesOf(db, runs);
        const started = runs.map((r, i) => ({ id: r.id, state: r.state, track: codes[i] }));
        res.status(202);
        return { ...started[0], runs: started };
      },
    }),
    route({
      method: 'get',
      path: '/api/runs/:id',
      answer: RunViewSchema,
      allow: STAFF,
      tag: 'runs',
      summary: 'A run: state, progress, spec, data version and hash, standing counts once in review',
      schemas: { params: byId },
      handler: ({ params }) => service.runView(db, params.id),
    }),
    route({
      method: 'get',
      path: '/api/runs/:id/review',
      answer: ReviewResponseSchema,
      allow: STAFF,
      tag: 'runs',
      summary: 'Per district: this run against the last published one (threshold move, standing, shape, significance)',
      schemas: { params: byId },
      handler: ({ params }) => service.reviewRows(db, params.id),
    }),
    route({
      method: 'get',
      path: '/api/runs/:id/districts/:code',
      answer: DistrictReviewSchema,
      allow: STAFF,
      tag: 'runs',
      summary: 'One district in a run: every variant, diagnostics, residuals, and why the threshold moved',
      schemas: { params: byId.extend({ code: districtCode }) },
      handler: ({ params }) => service.districtReview(db, params.id, params.code),
    }),
    route({
      method: 'put',
      path: '/api/runs/:id/districts/:code/note',
      answer: NO_CONTENT,
      allow: STAFF,
      tag: 'runs',
      summary: 'Attach a short note to a district for the next brief',
      schemas: {
        params: byId.extend({ code: districtCode }),
        body: z.object({ note: z.string().trim().min(1).max(600) }),
      },
      handler: async ({ params, body }, req, res) => {
        await service.addNote(db, callerOf(req)!, params.id, params.code, body.note);
        res.status(204).end();
      },
    }),
    route({
      method: 'post',
      path: '/api/runs/:id/publish',
      answer: PublishAnswerSchema,
      allow: STAFF,
      tag: 'runs',
      summary: 'Publish a run in review: officials see it, alerts go out',
      schemas: { params: byId },
      handler: ({ params }, req) => service.publishRun(ctx, callerOf(req)!, params.id),
    }),
    route({
      method: 'post',
      path: '/api/runs/:id/discard',
      answer: NO_CONTENT,
      allow: STAFF,
      tag: 'runs',
      summary: 'Discard a run (nothing changes for officials)',
      schemas: { params: byId },
      handler: async ({ params }, req, res) => {
        await service.discardRun(ctx, callerOf(req)!, params.id);
        res.status(204).end();
      },
    }),
    route({
      method: 'post',
      path: '/api/runs/:id/reproduce',
      answer: RunStartedSchema,
      statuses: [202],
      allow: STAFF,
      tag: 'runs',
      summary: 'Re-execute a run from its recorded spec, data version and data hash',
      rateLimit: COMPUTE_LIMIT,
      schemas: { params: byId },
      handler: async ({ params }, req, res) => {
        const run = await service.reproduceRun(ctx, callerOf(req)!, params.id);
        const [track] = await service.trackCodesOf(db, [run]);
        res.status(202);
        const started = { id: run.id, state: run.state, track };
        return { ...started, runs: [started] };
      },
    }),
  ];
}
