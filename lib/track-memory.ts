// The track last chosen on this device (web: localStorage; elsewhere: for the app's lifetime).
import { TRACK_MEMORY_KEY } from './track-choice';

let kept: string | null = null;
const listeners = new Set<() => void>();

function storage(): Storage | null {
  try {
    return typeof localStorage === 'undefined' ? null : localStorage;
  } catch {
    return null;
  }
}

export function rememberedTrack(): string | null {
  try {
    return storage()?.getItem(TRACK_MEMORY_KEY) ?? kept;
  } catch {
    return kept;
  }
}

export function rememberTrack(code: string | null): void {
  kept = code;
  try {
    const s = storage();
    if (code === null) s?.removeItem(TRACK_MEMORY_KEY);
    else s?.setItem(TRACK_MEMORY_KEY, code);
  } catch {
    // Private modes may refuse storage: the in-memory copy still serves this page.
  }
  listeners.forEach((l) => l());
}

export function subscribeTrackMemory(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}
