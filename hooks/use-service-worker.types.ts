/** What the app knows of its service worker (web only; native has none). */
export type ServiceWorkerState = {
  /** This visit runs a newer build than the last one this browser ran. */
  updated: boolean;
  /** Hides the "updated" notice. */
  dismiss: () => void;
};
