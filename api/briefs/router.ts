import { z } from 'zod';
import { idParams } from '../http/validate';
import type { AppContext } from '../context';
import { districtCode, trackCode } from '../http/params';
import { callerOf, COMPUTE_LIMIT, route, SIGNED_IN, type RouteSpec } from '../http/routes';
import './attachment';
import { exportRun } from './export-csv';
import * as service from './service';
import { DistrictBriefContentSchema, RegionBriefContentSchema } from '../../contracts/briefs';

/** `?run=<id>`: a published run other than the latest; `?track=<code>`: the track (default: the headline). */
const runQuery = z.object({
  run: z.coerce.number().int().positive().optional(),
  track: trackCode.optional(),
});
const byCode = { params: z.object({ code: districtCode }), query: runQuery };

function sendPdf(res: import('express').Response, pdf: { filename: string; content: Buffer }): void {
  // inline: a browser tab shows it; "download" in the viewer keeps the file name.
  res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="${pdf.filename}"`);
  res.setHeader('Cache-Control', 'private, no-store');
  res.send(pdf.content);
}

export function briefRoutes({ db, compute }: AppContext): RouteSpec[] {
  return [
    // The .pdf route comes first: path-to-regexp 8 reads `:code.pdf` as the parameter
    // `code` followed by the literal ".pdf", and /:code alone would not match a dot anyway
    // (district codes are letters, digits, _ and -).
    route({
      method: 'get',
      path: '/api/briefs/district/:code.pdf',
      allow: SIGNED_IN,
      tag: 'briefs',
      rateLimit: COMPUTE_LIMIT,
      summary:
        'A district brief for one track (?track=, default the headline) as a one-page PDF (A4 or Letter per the settings), from its latest published run or ?run=<id>',
      produces: 'application/pdf',
      schemas: byCode,
      handler: async ({ params, query }, _req, res) =>
        sendPdf(res, await service.districtBriefPdf({ db, compute }, params.code, query.run, query.track)),
    }),
    route({
      method: 'get',
      path: '/api/briefs/district/:code/summary.pdf',
      allow: SIGNED_IN,
      tag: 'briefs',
      rateLimit: COMPUTE_LIMIT,
      summary:
        'A district summary brief as PDF: the first page shows every track’s standing side by side, then one page per track',
      produces: 'application/pdf',
      schemas: { params: z.object({ code: districtCode }) },
      handler: async ({ params }, _req, res) =>
        sendPdf(res, await service.districtSummaryPdf({ db, compute }, params.code)),
    }),
    route({
      method: 'get',
      path: '/api/briefs/district/:code',
      answer: DistrictBriefContentSchema,
      allow: SIGNED_IN,
      tag: 'briefs',
      rateLimit: COMPUTE_LIMIT,
      summary:
        'The content of a district brief (figures rounded for reading, charts as vector scenes) for the print-friendly view',
      schemas: byCode,
      handler: ({ params, query }) => service.districtBrief(db, params.code, query.run, query.track),
    }),
    route({
      method: 'get',
      path: '/api/briefs/region.pdf',
      allow: SIGNED_IN,
      tag: 'briefs',
      rateLimit: COMPUTE_LIMIT,
      summary:
        'The region brief of one track (?track=, default the headline) as PDF: summary, every district in a table with repeated headers, the pooled curve',
      produces: 'application/pdf',
      schemas: { query: runQuery },
      handler: async ({ query }, _req, res) =>
        sendPdf(res, await service.regionBriefPdf({ db, compute }, query.run, query.track)),
    }),
    route({
      method: 'get',
      path: '/api/briefs/region',
      answer: RegionBriefContentSchema,
      allow: SIGNED_IN,
      tag: 'briefs',
      rateLimit: COMPUTE_LIMIT,
      summary: 'The content of the region brief for the print-friendly view',
      schemas: { query: runQuery },
      handler: ({ query }) => service.regionBrief(db, query.run, query.track),
    }),
    route({
      method: 'get',
      path: '/api/runs/:id/export.csv',
      allow: SIGNED_IN,
      tag: 'briefs',
      rateLimit: COMPUTE_LIMIT,
      summary:
        'A run’s estimates as CSV, one row per district, full precision, text cells escaped against formula injection (published runs; runs in review for analysts and admins)',
      produces: 'text/csv',
      schemas: { params: idParams },
      handler: async ({ params }, req, res) => {
        const out = await exportRun(db, callerOf(req)!, params.id);
        res.type('text/csv; charset=utf-8').attachment(out.filename).send(out.csv);
      },
    }),
  ];
}
