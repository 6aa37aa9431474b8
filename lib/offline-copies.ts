// Offline reading. The service worker (scripts/web-offline/service-worker.ts) keeps the
// last answers of the region and of the district cards an official opened, in caches whose
// names start with API_CACHE_PREFIX; it answers from them only when the network fails, and
// then marks the answer with OFFLINE_COPY_HEADER (the date the server sent it). This module
// is imported by both sides (no aliases, no app imports), so the names are written once.

/** Every cache holding API answers starts with this; deleting them all forgets every offline copy. */
export const API_CACHE_PREFIX = 'crestwatch-api-';

/** The caches of API answers, and how many answers each keeps (newest opened first). */
export const API_CACHES = {
  /** The region answer, the district list and the tracks (one of each). */
  region: `${API_CACHE_PREFIX}region`,
  /** The district shapes the region map and the card's locator draw (phone and print detail). */
  boundaries: `${API_CACHE_PREFIX}boundaries`,
  /** The last CARD_LIMIT district cards opened: their estimate, series and history answers. */
  cardEstimate: `${API_CACHE_PREFIX}card-estimate`,
  cardDetail: `${API_CACHE_PREFIX}card-detail`,
  cardHistory: `${API_CACHE_PREFIX}card-history`,
} as const;

/** District cards kept for reading offline. */
export const CARD_LIMIT = 20;

/** Oldest answer read offline: a week, so a stale figure is never shown as if it were current. */
export const OFFLINE_MAX_AGE_SECONDS = 7 * 24 * 60 * 60;

/** Set by the worker on an answer read from its cache: the `Date` the server sent it with. */
export const OFFLINE_COPY_HEADER = 'x-crestwatch-offline-copy';

/** Messages the app posts to the worker (and the worker's answers). */
export const SW_MESSAGES = {
  /** "Delete every cached API answer" (sign-out, session ended). */
  clearApi: 'crestwatch:clear-api',
  /** "Which build are you?" answered on the message's port with { version }. */
  version: 'crestwatch:version',
  /** From a navigation of the current worker to the waiting one: take over now. */
  activate: 'crestwatch:activate',
} as const;

// ---- App side -------------------------------------------------------------------------

const copies = new WeakMap<object, number>();

/**
 * Marks an answer (and its direct parts, which a query's `select` may hand to a screen) as
 * read from the offline copy saved at `savedAt` (ms since the epoch).
 */
export function markOfflineCopy(answer: unknown, savedAt: number): void {
  if (typeof answer !== 'object' || answer === null) return;
  copies.set(answer, savedAt);
  for (const part of Object.values(answer)) if (typeof part === 'object' && part !== null) copies.set(part, savedAt);
}

/** Marks the answer when the worker said it came from its offline copy (OFFLINE_COPY_HEADER). */
export function noteOfflineCopy(answer: unknown, headers: Headers): void {
  const savedAt = Date.parse(headers.get(OFFLINE_COPY_HEADER) ?? '');
  if (Number.isFinite(savedAt)) markOfflineCopy(answer, savedAt);
}

/** When the answer shown was saved, if it is an offline copy; null for a fresh answer. */
export function offlineCopySavedAt(data: unknown): number | null {
  if (typeof data !== 'object' || data === null) return null;
  return copies.get(data) ?? null;
}

/**
 * Forgets every offline copy of API answers (sign-out, a 401, an ended session). Deletes the
 * caches by name from the page, so it works even while no worker is running.
 */
export async function clearOfflineCopies(): Promise<void> {
  if (typeof caches === 'undefined') return;
  try {
    const names = await caches.keys();
    await Promise.all(names.filter((n) => n.startsWith(API_CACHE_PREFIX)).map((n) => caches.delete(n)));
  } catch {
    // Storage refused (a private window, say): there is nothing kept to forget.
  }
}
