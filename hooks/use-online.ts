// Whether the device has a network, as react-query sees it (it pauses fetches while offline).
import { onlineManager } from '@tanstack/react-query';
import { useSyncExternalStore } from 'react';

const subscribe = (onChange: () => void) => onlineManager.subscribe(onChange);

/** True while online; true during pre-rendering and hydration, where nothing is known. */
export function useOnline(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => onlineManager.isOnline(),
    () => true,
  );
}
