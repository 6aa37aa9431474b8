// How long each kind of server data counts as fresh (react-query `staleTime`, ms).
// Every query takes its value from here; change one here, not at the call site.

const SECOND = 1000;
const MINUTE = 60 * SECOND;

export const STALE_TIMES = {
  /** Reachability is what the health check is for, so it must not be served from cache long. */
  health: 15 * SECOND,
  /** The district list changes only when an upload is applied (a few times a quarter). */
  districtList: 5 * MINUTE,
  /** A district's series changes with uploads too; 5 min keeps back-and-forth browsing instant. */
  districtDetail: 5 * MINUTE,
  /** Set by the server's configuration at start-up; it cannot change while the page is open. */
  authOptions: Infinity,
  /** Signing in or out reloads the page, so the session only needs an occasional recheck. */
  me: 5 * MINUTE,
  /** Published estimates change only when an analyst publishes a run (a few times a quarter). */
  region: 5 * MINUTE,
  estimate: 5 * MINUTE,
  /** New alerts arrive with a publish; a minute keeps the feed column close without polling hard. */
  alertFeed: 1 * MINUTE,
  /** Changed only by the caller's own toggles, which refetch. */
  subscriptions: 5 * MINUTE,
  /** Upload history: another analyst may load a file meanwhile; half a minute is recent enough. */
  uploads: 30 * SECOND,
  /** A running upload's progress is polled (UPLOAD_POLL_MS); an answer is old at once. */
  uploadProgress: 0,
  /** A kept preview does not change once made (only committing it does, which refetches). */
  uploadDetail: 5 * MINUTE,
  /** Run list: scheduled runs appear without anyone here pressing a button. */
  runs: 15 * SECOND,
  /** A queued or running run is polled instead (RUN_POLL_MS); once in review it only changes by our own actions. */
  runDetail: 30 * SECOND,
  /** Estimates of a run are fixed once it reaches review; notes refetch after saving. */
  runReview: 5 * MINUTE,
  /** Tracks change by hand (an admin creates, renames, pauses one), rarely. */
  tracks: 2 * MINUTE,
  /** Specs change by hand, rarely. */
  specs: 2 * MINUTE,
  /** The catalogue changes only when someone adds or edits an indicator. */
  indicators: 5 * MINUTE,
  /** The latest published run id is the cheap question that tells whether anything above changed: always ask again. */
  published: 0,
  /** Settings change by hand, rarely; the next scheduled start is computed on each load. */
  settings: 1 * MINUTE,
  /** Admin lists: short, so a second admin's change shows on the next visit. */
  people: 30 * SECOND,
  audit: 15 * SECOND,
  /** Demo mail catcher: an invitation arrives a moment after it is sent. */
  mailbox: 5 * SECOND,
} as const;

/** How often a queued or running run is asked for its progress (ms). */
export const RUN_POLL_MS = 1500;

/** How often a running upload is asked for its phase and counts (ms). */
export const UPLOAD_POLL_MS = 500;

export type StaleTimeName = keyof typeof STALE_TIMES;

/** How often an open app asks whether a run was published elsewhere (besides on regaining focus). */
export const PUBLISHED_POLL_MS = 60_000;
