// Web: the root font size relative to 16 px (the reader's browser setting), for boxes
// whose height is fixed in advance (virtualised rows). 1 while the pre-rendered page
// hydrates, so the first render matches the HTML; the real factor right after.
import { useSyncExternalStore } from 'react';

const ROOT_PX = 16;

function subscribe(onChange: () => void): () => void {
  window.addEventListener('resize', onChange);
  return () => window.removeEventListener('resize', onChange);
}

function read(): number {
  const px = parseFloat(getComputedStyle(document.documentElement).fontSize);
  return Number.isFinite(px) && px > 0 ? Math.max(1, px / ROOT_PX) : 1;
}

export function useTextScale(): number {
  return useSyncExternalStore(subscribe, read, () => 1);
}
