// Web: registers the service worker the web build writes (dist/sw.js: offline reading and
// the app shell; scripts/web-offline/). A new build installs in the background and takes
// over on the next visit; the app then says it was updated, once.
import { useEffect, useState } from 'react';

import { SW_MESSAGES } from '@/lib/offline-copies';

import type { ServiceWorkerState } from './use-service-worker.types';

/** The build this browser ran last (localStorage), to tell a visit after a deploy. */
const LAST_BUILD_KEY = 'crestwatch.build';

/** How long to wait for the worker's answer: a worker that just took over may still be tidying its caches. */
const VERSION_ANSWER_MS = 20_000;

/** The build of the worker in charge, asked over a message channel (null when it does not answer). */
function askVersion(worker: ServiceWorker): Promise<string | null> {
  return new Promise((resolve) => {
    const channel = new MessageChannel();
    const timer = setTimeout(() => resolve(null), VERSION_ANSWER_MS);
    channel.port1.onmessage = (e: MessageEvent<{ version?: unknown }>) => {
      clearTimeout(timer);
      resolve(typeof e.data?.version === 'string' ? e.data.version : null);
    };
    worker.postMessage({ type: SW_MESSAGES.version }, [channel.port2]);
  });
}

function rememberBuild(version: string): string | null {
  try {
    const last = localStorage.getItem(LAST_BUILD_KEY);
    localStorage.setItem(LAST_BUILD_KEY, version);
    return last;
  } catch {
    return null; // storage refused: never claim an update
  }
}

export function useServiceWorker(): ServiceWorkerState {
  const [updated, setUpdated] = useState(false);
  useEffect(() => {
    // Only the exported build has a worker (the development server has no sw.js).
    if (process.env.NODE_ENV !== 'production' || !('serviceWorker' in navigator)) return;
    let cancelled = false;
    navigator.serviceWorker
      .register('/sw.js', { scope: '/', updateViaCache: 'none' })
      .then(() => navigator.serviceWorker.ready)
      .then(async (registration) => {
        const version = registration.active ? await askVersion(registration.active) : null;
        if (cancelled || version === null) return;
        const last = rememberBuild(version);
        if (last !== null && last !== version) setUpdated(true);
      })
      .catch((err: unknown) => console.warn('Crestwatch: offline reading is not available.', err));
    return () => {
      cancelled = true;
    };
  }, []);
  return { updated, dismiss: () => setUpdated(false) };
}
