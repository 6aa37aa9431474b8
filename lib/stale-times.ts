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
} as const;

export type StaleTimeName = keyof typeof STALE_TIMES;
