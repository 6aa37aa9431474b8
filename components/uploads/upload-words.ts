// Words for uploads: statuses, kinds and counts, shared by the upload screen and its history.
import type { Tone } from '@/components/theme';
import { formatDateTime } from '@/lib/format-time';
import type { UploadProblem, UploadRejectionDetails, UploadStatus, UploadSummary } from '@/contracts/uploads';
import { formatCount } from '@/lib/format';

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
  if (u.kind === 'boundaries') return `District boundaries: ${u.fileName ?? 'file without a name'}`;
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
  return `${formatCount(n)} ${n === 1 ? one : many}`;
}

/** "line 3, column 4 (value)": where a problem is, from its fields. */
export function problemPlace(p: Pick<UploadProblem, 'line' | 'column' | 'field'>): string {
  const parts: string[] = [];
  if (p.line !== null) parts.push(`line ${p.line}`);
  if (p.column !== null) parts.push(`column ${p.column}${p.field ? ` (${p.field})` : ''}`);
  return parts.join(', ');
}

/**
 * One sentence for a refused file, composed from the refusal's fields (the first error, its
 * place and how many more problems there are), never from the server's own sentence.
 */
export function refusalSummary(d: Pick<UploadRejectionDetails, 'problems' | 'errorCount' | 'warningCount'>): string {
  const first = d.problems.find((p) => p.severity === 'error') ?? d.problems[0];
  if (!first) return `${count(d.errorCount, 'error')} and ${count(d.warningCount, 'warning')}.`;
  const place = problemPlace(first);
  const more = [
    d.errorCount > 1 ? count(d.errorCount - 1, 'more error') : '',
    d.warningCount > 0 ? count(d.warningCount, 'warning') : '',
  ].filter(Boolean);
  const lead = place
    ? `${place.charAt(0).toUpperCase()}${place.slice(1)}: ${first.reason}`
    : `${first.reason.charAt(0).toUpperCase()}${first.reason.slice(1)}`;
  return `${lead}${more.length ? ` (and ${more.join(' and ')})` : ''}.`;
}

/** The same file was loaded before: which upload, when and as which data version, from the answer's fields. */
export function noopSummary(u: Pick<UploadSummary, 'id' | 'committedAt' | 'version'>): string {
  return `This file was already loaded as upload #${u.id} (${formatDateTime(u.committedAt)}, data version ${u.version ?? '—'}): nothing was changed.`;
}
