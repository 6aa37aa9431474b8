/**
 * Attachments an outbox message names by kind (e.g. the region brief of a run) are
 * rendered when the mail is sent. Features register their renderer here; an unknown kind
 * makes the send fail loudly (the message stays pending with the error).
 */
import type { AppContext } from '../context';

export interface AttachmentSpec {
  kind: string;
  runId?: number;
}

export type Renderer = (
  ctx: AppContext,
  spec: AttachmentSpec,
) => Promise<{ filename: string; content: Buffer; contentType: string }>;

const renderers = new Map<string, Renderer>();

export function registerAttachment(kind: string, render: Renderer): void {
  renderers.set(kind, render);
}

export async function renderAttachment(ctx: AppContext, spec: AttachmentSpec) {
  const render = renderers.get(spec.kind);
  if (!render) throw new Error(`no renderer for attachment kind "${spec.kind}"`);
  return render(ctx, spec);
}
