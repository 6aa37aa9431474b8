import { useSyncExternalStore } from 'react';

const never = () => () => {};

/**
 * False while the static page is rendered and hydrated, true on the client after that
 * (and at once for screens the client renders itself). For parts that must not be in the
 * pre-rendered HTML: charts that measure their box, the print portal.
 */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    never,
    () => true,
    () => false,
  );
}
