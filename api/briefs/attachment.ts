/**
 * The region brief as an e-mail attachment: the digest of a publish names
 * `{ kind: 'region_brief', runId }` and the outbox renders it when the mail is sent.
 * Imported for its effect wherever the outbox is delivered (api/jobs/handlers.ts) and by
 * the brief routes.
 */
import { registerAttachment } from '../outbox/attachments';
import { regionBriefPdf } from './service';

registerAttachment('region_brief', async (ctx, spec) => {
  if (spec.runId === undefined) throw new Error('a region_brief attachment needs a runId');
  const pdf = await regionBriefPdf(ctx, spec.runId);
  return { filename: pdf.filename, content: pdf.content, contentType: 'application/pdf' };
});
