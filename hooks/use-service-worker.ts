// Native: no service worker; the app never says it was updated.
import type { ServiceWorkerState } from './use-service-worker.types';

export function useServiceWorker(): ServiceWorkerState {
  return { updated: false, dismiss: () => undefined };
}
