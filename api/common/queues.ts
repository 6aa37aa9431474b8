/**
 * The job queues' names and the shape of a handler: a leaf module, so a feature that
 * sends jobs or defines handlers (runs, outbox, retention) need not import the queue
 * itself (api/jobs), which registers every handler in one place.
 */
export const QUEUES = {
  runStart: 'run-start',
  runChunk: 'run-chunk',
  outbox: 'outbox-send',
  scheduledRun: 'run-scheduled',
  retention: 'retention-prune',
  runWatch: 'run-watch',
} as const;
export type QueueName = (typeof QUEUES)[keyof typeof QUEUES];

export type Handler = (
  data: Record<string, unknown>,
  meta: { retryCount: number; retryLimit: number; id: string },
) => Promise<void>;
