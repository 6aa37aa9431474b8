/**
 * The scheduled-run watch: GET /api/runs/notices (staff) lists what needs a person's eye —
 * a scheduled run that failed, one that did not start within an hour of its scheduled time,
 * and one that has waited in review longer than the `reviewWaitDays` setting. The same
 * notices go to staff by e-mail, once each.
 */
import * as z from './kit';
import { isoTime, nullableNumber } from './common';

export const RUN_NOTICE_KINDS = ['failed', 'not_started', 'review_overdue'] as const;
export const RunNoticeKindSchema = z.enum(RUN_NOTICE_KINDS);
export type RunNoticeKind = z.infer<typeof RunNoticeKindSchema>;

export const RunNoticeSchema = z.object({
  /** stable per notice: the same problem keeps its key between checks (and is mailed once) */
  key: z.string(),
  kind: RunNoticeKindSchema,
  /** the track the run (or the missed start) belongs to */
  track: z.object({ code: z.string(), name: z.string() }),
  /** the run concerned; null when the scheduled run was never created */
  runId: nullableNumber,
  /** when the problem began: the failure, the scheduled time, or the run's arrival in review */
  since: isoTime,
  /** one sentence a person can act on */
  message: z.string(),
  /** the app page to open (a run, or the runs list) */
  href: z.string(),
});
export type RunNotice = z.infer<typeof RunNoticeSchema>;

export const RunNoticesResponseSchema = z.object({
  notices: z.array(RunNoticeSchema),
  /** the setting the review check used */
  reviewWaitDays: z.number(),
  checkedAt: isoTime,
});
export type RunNoticesResponse = z.infer<typeof RunNoticesResponseSchema>;
