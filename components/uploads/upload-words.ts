// Words for uploads: statuses, kinds and counts, shared by the upload screen and its history.
import type { Tone } from '@/components/theme';
import type { UploadStatus, UploadSummary } from '@/contracts/uploads';

export const UPLOAD_STATUS: Record<UploadStatus, { label: string; tone: Tone }> = {
  previewed: { label: 'Checked, not loaded', tone: 'warning' },
  committed: { label: 'Loaded', tone: 'success' },
  reverted: { label: 'Reverted', tone: 'neutral' },
  failed: { label: 'Refused', tone: 'danger' },
};

/** The status pill of an upload: a revert or a recomputation that went through is "applied", not "loaded". */
export function uploadStatus(u: Pick<UploadSummary, 'kind' | 'status'>): { label: string; tone: Tone } {
  if (u.status === 'committed' && u.kind !== 'file') return { label: 'Applied', tone: 'success' };
  return UPLOAD_STATUS[u.status];
}

/** What an upload row stands for, when it is not a file someone chose. */
export function uploadTitle(u: UploadSummary): string {
  if (u.kind === 'seed') return 'Demo region data';
  if (u.kind === 'revert') return u.revertsUploadId ? `Revert of upload #${u.revertsUploadId}` : 'Revert';
  if (u.kind === 'derivation') return u.note ?? 'Derived series recomputed';
  return u.fileName ?? 'File without a name';
}

/** "+120 new, 14 changed, 3 unchanged" from counts. */
export function changeWords(c: { insert: number; change: number; unchanged?: number; remove?: number }): string {
  const parts = [`${c.insert} new`, `${c.change} changed`];
  if (c.unchanged !== undefined) parts.push(`${c.unchanged} unchanged`);
  if (c.remove) parts.push(`${c.remove} removed`);
  return parts.join(', ');
}

/** Plural helper: "1 value", "3 values". */
export function count(n: number, one: string, many = `${one}s`): string {
  return `${n.toLocaleString('en-GB')} ${n === 1 ? one : many}`;
}
