// Native: wait for the Inter files before the first screen, but never longer than the
// deadline — a font that fails or hangs leaves the app in the system font, not blank.
import { useFonts } from 'expo-font';
import { useEffect, useState } from 'react';

import { fontSources } from '@/lib/font-sources';

/** How long a first launch may wait for fonts before drawing with the system font. */
export const FONT_DEADLINE_MS = 2500;

/** True once the app may draw: fonts loaded, failed, or the deadline passed. */
export function useAppFonts(): boolean {
  const [loaded, error] = useFonts(fontSources);
  const [pastDeadline, setPastDeadline] = useState(false);
  useEffect(() => {
    const timer = setTimeout(() => setPastDeadline(true), FONT_DEADLINE_MS);
    return () => clearTimeout(timer);
  }, []);
  useEffect(() => {
    if (error) console.warn('Crestwatch: fonts failed to load, using the system font.', error);
  }, [error]);
  return loaded || error !== null || pastDeadline;
}
