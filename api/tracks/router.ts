import { z } from 'zod';
import type { AppContext } from '../context';
import { trackCode } from '../http/params';
import { ADMIN, callerOf, route, SIGNED_IN, STAFF, type RouteSpec } from '../http/routes';
import * as service from './service';
import { TRACK_STATES, TrackAnswerSchema, TracksResponseSchema } from '../../contracts/tracks';

const byCode = z.object({ code: trackCode });
const name = z.string().trim().min(1).max(80);

export function trackRoutes({ db }: AppContext): RouteSpec[] {
  return [
    route({
      method: 'get',
      path: '/api/tracks',
      answer: TracksResponseSchema,
      allow: SIGNED_IN,
      tag: 'tracks',
      summary: 'Every track (what the agency watches): indicator, headline, state, latest published run',
      handler: async () => ({ tracks: await service.listTracks(db) }),
    }),
    route({
      method: 'post',
      path: '/api/tracks',
      answer: TrackAnswerSchema,
      statuses: [201],
      allow: ADMIN,
      tag: 'tracks',
      summary: 'Create a track from a saved spec (the track watches the spec’s emissions indicator)',
      schemas: { body: z.object({ code: trackCode, name, specId: z.number().int().positive() }) },
      handler: async ({ body }, req, res) => {
        res.status(201);
        return { track: await service.createTrack(db, callerOf(req)!, body) };
      },
    }),
    route({
      method: 'patch',
      path: '/api/tracks/:code',
      answer: TrackAnswerSchema,
      allow: ADMIN,
      tag: 'tracks',
      summary: 'Rename, pause, resume or archive a track, or make it the headline track',
      schemas: {
        params: byCode,
        body: z
          .object({
            name: name.optional(),
            state: z.enum(TRACK_STATES).optional(),
            headline: z.literal(true).optional(),
          })
          .strict(),
      },
      handler: async ({ params, body }, req) => ({
        track: await service.patchTrack(db, callerOf(req)!, params.code, body),
      }),
    }),
    route({
      method: 'put',
      path: '/api/tracks/:code/spec',
      answer: TrackAnswerSchema,
      allow: STAFF,
      tag: 'tracks',
      summary: 'Change a track’s spec (same emissions indicator); it takes effect at the track’s next run',
      schemas: { params: byCode, body: z.object({ specId: z.number().int().positive() }) },
      handler: async ({ params, body }, req) => ({
        track: await service.setTrackSpec(db, callerOf(req)!, params.code, body.specId),
      }),
    }),
  ];
}
