// Words for boundary uploads: kinds of problem, one-sentence summaries of a check, a commit
// and a revert, composed from the answers' fields.
import type { BoundaryProblem, BoundaryRevertAnswer, BoundaryUploadAnswer } from '@/contracts/boundaries';

import { count } from '@/components/uploads/upload-words';
import { formatDecimal } from '@/lib/format';

/** Short names of the problems, for the table's "Problem" column. */
export const PROBLEM_LABEL: Record<BoundaryProblem['problem'], string> = {
  not_feature_collection: 'Not a FeatureCollection',
  foreign_crs: 'Other coordinate system',
  not_feature: 'Not a Feature',
  no_code: 'No district code',
  duplicate_code: 'Code repeated',
  unknown_code: 'Unknown code',
  not_polygon: 'Not a polygon',
  bad_coordinates: 'Bad coordinates',
  short_ring: 'Ring too short',
  unclosed_ring: 'Ring not closed',
  out_of_range: 'Out of range',
  too_many_vertices: 'Too many vertices',
  self_intersection: 'Crosses itself',
  repaired: 'Repaired',
  dropped_z: 'Heights dropped',
  no_boundary: 'No boundary',
  crs84_member: 'crs ignored',
};

/** "feature 6 (D07)", "district D24", or "the file": where a problem is. */
export function problemPlace(p: Pick<BoundaryProblem, 'feature' | 'code'>): string {
  if (p.feature !== null) return `feature ${p.feature}${p.code ? ` (${p.code})` : ''}`;
  if (p.code) return `district ${p.code}`;
  return 'the file';
}

/** True when some feature could be repaired with ST_MakeValid, were the analyst to ask. */
export function repairable(answer: Pick<BoundaryUploadAnswer, 'problems'>): boolean {
  return answer.problems.some((p) => p.problem === 'self_intersection' && p.severity === 'error');
}

/** One sentence for a check that found errors: the first one and how many more. */
export function refusalSummary(answer: Pick<BoundaryUploadAnswer, 'problems' | 'counts'>): string {
  const first = answer.problems.find((p) => p.severity === 'error');
  const { errors, warnings } = answer.counts;
  if (!first) return `${count(errors, 'error')} and ${count(warnings, 'warning')}.`;
  const more = [errors > 1 ? count(errors - 1, 'more error') : '', warnings > 0 ? count(warnings, 'warning') : '']
    .filter(Boolean)
    .join(' and ');
  const reason = first.reason.charAt(0).toUpperCase() + first.reason.slice(1);
  return `${reason}${more ? ` (and ${more})` : ''}.`;
}

/** What loading the checked file would do. */
export function readyWords(answer: Pick<BoundaryUploadAnswer, 'counts'>): string {
  const c = answer.counts;
  const parts = [`boundaries for ${count(c.matched, 'district')} (${count(c.vertices, 'vertex', 'vertices')})`];
  if (c.repaired) parts.push(`${count(c.repaired, 'feature')} repaired with ST_MakeValid`);
  if (c.missing) parts.push(`${count(c.missing, 'district')} left without a boundary`);
  return parts.join('; ');
}

/** The outcome of a commit. */
export function committedWords(
  answer: Pick<BoundaryUploadAnswer, 'versionId' | 'uploadId' | 'dataVersion' | 'counts'>,
): string {
  return `Loaded as boundary version ${answer.versionId ?? '—'} (upload #${answer.uploadId ?? '—'}, data version ${answer.dataVersion ?? '—'}): ${readyWords(answer)}.`;
}

/** The outcome of a revert. */
export function revertedWords(
  id: number,
  answer: Pick<BoundaryRevertAnswer, 'currentVersionId' | 'dataVersion'>,
): string {
  const now =
    answer.currentVersionId === null
      ? 'No boundaries are in force now: the map shows the list only.'
      : `Boundary version ${answer.currentVersionId} is in force again.`;
  return `Boundary version ${id} reverted (data version ${answer.dataVersion ?? '—'}). ${now}`;
}

/** km² with a sensible number of places. */
export function formatArea(km2: number): string {
  const places = km2 >= 100 ? 0 : km2 >= 1 ? 1 : 3;
  return `${formatDecimal(km2, places, places)} km²`;
}
